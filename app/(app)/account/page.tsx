import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import { currentUser } from '@/lib/auth/authorize';
import { roleLabels } from '@/lib/auth/roles';
import { Card, PageHeader } from '@/components/ui/card';
import { PasswordForm } from '@/components/account/password-form';

export const metadata: Metadata = { title: 'Your account' };

export default async function AccountPage() {
  const user = await currentUser();
  if (!user) redirect('/sign-in');
  return (
    <>
      <PageHeader eyebrow={user.organisationName ?? user.studioName} title="Your account" />
      <div className="grid grid-cols-1 items-start gap-5 lg:grid-cols-[360px_1fr]">
        <Card title="Signed in as">
          <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-2 text-sm">
            <dt className="text-ink-soft">Name</dt>
            <dd className="font-medium">{user.name}</dd>
            <dt className="text-ink-soft">E-mail</dt>
            <dd className="figures text-[13px]">{user.email}</dd>
            <dt className="text-ink-soft">Role</dt>
            <dd>{roleLabels[user.role]}</dd>
            <dt className="text-ink-soft">{user.organisationName ? 'Organisation' : 'Studio'}</dt>
            <dd>{user.organisationName ?? user.studioName}</dd>
          </dl>
        </Card>
        <Card title="Change password">
          <PasswordForm />
        </Card>
      </div>
    </>
  );
}
