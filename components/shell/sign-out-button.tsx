'use client';

import { Button } from '@/components/ui/button';
import { useRouter } from 'next/navigation';
import { api } from '@/lib/api/client';

export function SignOutButton() {
  const router = useRouter();
  return (
    <Button
      size="sm"
      variant="ghost"
      onClick={async () => {
        await api('/api/auth/sign-out', { method: 'POST' }).catch(() => undefined);
        router.replace('/sign-in');
        router.refresh();
      }}
    >
      Sign out
    </Button>
  );
}
