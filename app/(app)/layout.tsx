import { redirect } from 'next/navigation';
import { currentUser } from '@/lib/auth/authorize';
import { AppShell } from '@/components/shell/app-shell';

export default async function AppLayout({ children }: { children: React.ReactNode }) {
  const user = await currentUser();
  if (!user) redirect('/sign-in');
  return (
    <AppShell user={user}>
      {children}
    </AppShell>
  );
}
