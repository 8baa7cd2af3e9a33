import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import { currentUser } from '@/lib/auth/authorize';
import { can } from '@/lib/auth/roles';
import { Card, PageHeader } from '@/components/ui/card';
import { StyleForm } from '@/components/styles/style-form';

export const metadata: Metadata = { title: 'New style' };

export default async function NewStylePage() {
  const user = await currentUser();
  if (!user) redirect('/sign-in');
  if (!can(user.role, 'style:create')) redirect('/styles');
  return (
    <div className="max-w-5xl">
      <PageHeader eyebrow="Styles" title="New style" />
      <Card><StyleForm /></Card>
    </div>
  );
}
