import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import { currentUser } from '@/lib/auth/authorize';
import { can, isOutsideRole } from '@/lib/auth/roles';
import { PageHeader } from '@/components/ui/card';
import { ButtonLink } from '@/components/ui/button';
import { StylesTable } from '@/components/styles/styles-table';

export const metadata: Metadata = { title: 'Styles' };

export default async function StylesPage() {
  const user = await currentUser();
  if (!user) redirect('/sign-in');
  const canCreate = can(user.role, 'style:create');
  const title = isOutsideRole(user.role) ? (user.role === 'mill' ? 'Released to your mill' : 'Shared with you') : 'Styles';
  return (
    <>
      <PageHeader
        eyebrow={user.organisationName ?? user.studioName}
        title={title}
        actions={canCreate ? <ButtonLink href="/styles/new" variant="primary">New style</ButtonLink> : null}
      />
      <StylesTable canCreate={canCreate} />
    </>
  );
}
