'use client';

import { Button } from '@/components/ui/button';
import { api } from '@/lib/api/client';

export function SignOutButton() {
  return (
    <Button
      size="sm"
      variant="ghost"
      onClick={async () => {
        await api('/api/auth/sign-out', { method: 'POST' }).catch(() => undefined);
        window.location.assign('/sign-in');
      }}
    >
      Sign out
    </Button>
  );
}
