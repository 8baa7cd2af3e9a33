import { NextResponse } from 'next/server';
import { route } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { env } from '@/lib/env';
import { submitTestKnit } from '@/lib/db/test-knits';
import { uploadLimits } from '@/lib/files/inspect';
import { inspectOrRefuse, readMultipart } from '@/lib/files/multipart';
import { objectStore } from '@/lib/storage/object-store';
import { testKnitParamsSchema, testKnitSubmissionSchema } from '@/lib/validations/mill';

/** The mill's test knit: multipart with `photo` and the measured `walesPerCm`, `coursesPerCm`, `gsm` (and `note`). */
export const POST = route<{ id: string }>(async (req, params) => {
  const user = await authorize('mill:upload');
  const { id } = testKnitParamsSchema.parse(params);
  const { file, fields } = await readMultipart(req, 'photo', uploadLimits.photo);
  const input = testKnitSubmissionSchema.parse(fields);
  const upload = inspectOrRefuse(file, ['photo'], 'photo');
  return NextResponse.json(await submitTestKnit(user, id, input, { upload, name: file?.name ?? '' }, objectStore(), { appUrl: env().APP_URL }));
});
