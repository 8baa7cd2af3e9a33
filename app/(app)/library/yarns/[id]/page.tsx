import type { Metadata } from 'next';
import { notFound, redirect } from 'next/navigation';
import { currentUser } from '@/lib/auth/authorize';
import { can } from '@/lib/auth/roles';
import { findYarn, texturesUsingYarn } from '@/lib/db/yarns';
import { idParamSchema } from '@/lib/validations/library';
import { PageHeader } from '@/components/ui/card';
import { LibraryCrumbs } from '@/components/library/library-crumbs';
import { YarnForm } from '@/components/library/yarn-form';

export const metadata: Metadata = { title: 'Yarn' };

export default async function YarnPage({ params }: { params: Promise<{ id: string }> }) {
  const user = await currentUser();
  if (!user) redirect('/sign-in');
  if (!can(user.role, 'library:read')) redirect('/styles');
  const parsed = idParamSchema.safeParse(await params);
  if (!parsed.success) notFound();
  const yarn = await findYarn(user, parsed.data.id);
  if (!yarn || yarn.archivedAt) notFound();
  const usedBy = await texturesUsingYarn(user.studioId, yarn.id);
  return (
    <>
      <LibraryCrumbs tab="yarns" current={yarn.name} />
      <PageHeader title={yarn.name}>
        <p className="figures mt-1 text-sm text-ink-soft">{yarn.supplierRef || 'no supplier reference'} · version {yarn.version}</p>
      </PageHeader>
      <YarnForm yarn={yarn} canEdit={can(user.role, 'library:edit')} usedBy={usedBy} />
    </>
  );
}
