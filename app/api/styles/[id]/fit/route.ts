import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { loadFit, saveSizeSpec } from '@/lib/db/fit';
import { fitParamsSchema, sizeSpecSaveSchema } from '@/lib/validations/fit';

type Params = { id: string };

/** The size spec, body girths, cut-and-sew entries, fit settings and sample rounds: for everyone who sees the style. */
export const GET = route<Params>(async (_req, params) => {
  const user = await authorize('style:read');
  const { id } = fitParamsSchema.parse(params);
  return NextResponse.json({ fit: await loadFit(user, id) });
});

/** Saves the whole size spec; carries the style's version (409 when stale). */
export const PUT = route<Params>(async (req, params) => {
  const user = await authorize('style:edit');
  const { id } = fitParamsSchema.parse(params);
  const input = await parseBody(req, sizeSpecSaveSchema);
  return NextResponse.json({ fit: await saveSizeSpec(user, id, input) });
});
