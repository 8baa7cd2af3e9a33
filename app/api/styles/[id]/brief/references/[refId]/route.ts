import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { deleteReference, updateReference } from '@/lib/db/briefs';
import { objectStore } from '@/lib/storage/object-store';
import { referenceParamsSchema, referencePatchSchema } from '@/lib/validations/brief';

type Params = { id: string; refId: string };

export const PATCH = route<Params>(async (req, params) => {
  const user = await authorize('style:edit');
  const { id, refId } = referenceParamsSchema.parse(params);
  const patch = await parseBody(req, referencePatchSchema);
  return NextResponse.json({ reference: await updateReference(user, id, refId, patch) });
});

export const DELETE = route<Params>(async (_req, params) => {
  const user = await authorize('style:edit');
  const { id, refId } = referenceParamsSchema.parse(params);
  await deleteReference(user, id, refId, objectStore());
  return NextResponse.json({ ok: true });
});
