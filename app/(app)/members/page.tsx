import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import { currentUser } from '@/lib/auth/authorize';
import { can } from '@/lib/auth/roles';
import { PageHeader } from '@/components/ui/card';
import { MembersAdmin } from '@/components/members/members-admin';

export const metadata: Metadata = { title: 'Members' };

export default async function MembersPage() {
  const user = await currentUser();
  if (!user) redirect('/sign-in');
  if (!can(user.role, 'members:manage')) redirect('/styles');
  return (
    <>
      <PageHeader eyebrow={user.studioName} title="Members" />
      <MembersAdmin selfId={user.id} />
    </>
  );
}
