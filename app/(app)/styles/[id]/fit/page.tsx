import type { Metadata } from 'next';
import { notFound, redirect } from 'next/navigation';
import { currentUser } from '@/lib/auth/authorize';
import { can } from '@/lib/auth/roles';
import { loadFit } from '@/lib/db/fit';
import { idParamSchema } from '@/lib/validations/style';
import { HttpError } from '@/lib/api/errors';
import { FitWorkspace } from '@/components/fit/fit-workspace';

export const metadata: Metadata = { title: 'Fit' };

export default async function FitPage({ params }: { params: Promise<{ id: string }> }) {
  const user = await currentUser();
  if (!user) redirect('/sign-in');
  const parsed = idParamSchema.safeParse(await params);
  if (!parsed.success) notFound();
  const fit = await loadFit(user, parsed.data.id).catch((err: unknown) => {
    if (err instanceof HttpError && err.status === 404) return null;
    throw err;
  });
  if (!fit) notFound();
  return <FitWorkspace styleId={fit.styleId} initial={fit} readOnly={!can(user.role, 'style:edit')} />;
}
