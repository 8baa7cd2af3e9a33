'use client';

import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { useState } from 'react';
import { z } from 'zod';
import { ApiError } from '@/lib/api/client';

// The page policy allows no eval (lib/api/security-headers.ts). Without this, zod would probe for it
// with `Function('')` on the first parse, which the browser refuses and reports as a violation.
z.config({ jitless: true });

export function Providers({ children }: { children: React.ReactNode }) {
  const [client] = useState(
    () =>
      new QueryClient({
        defaultOptions: {
          queries: { staleTime: 15_000, retry: (n, err) => n < 2 && !(err instanceof ApiError && err.status < 500) },
        },
      }),
  );
  return <QueryClientProvider client={client}>{children}</QueryClientProvider>;
}
