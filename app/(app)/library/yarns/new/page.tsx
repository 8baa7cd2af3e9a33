import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import { currentUser } from '@/lib/auth/authorize';
import { can } from '@/lib/auth/roles';
import { PageHeader } from '@/components/ui/card';
import { LibraryCrumbs } from '@/components/library/library-crumbs';
import { YarnForm } from '@/components/library/yarn-form';

export const metadata: Metadata = { title: 'New yarn' };

export default async function NewYarnPage() {
  const user = await currentUser();
  if (!user) redirect('/sign-in');
  if (!can(user.role, 'library:edit')) redirect('/library?tab=yarns');
  return (
    <>
      <LibraryCrumbs tab="yarns" />
      <PageHeader title="New yarn" />
      <YarnForm canEdit />
    </>
  );
}
