import type { Metadata } from 'next';
import { SignInForm } from '@/components/auth/sign-in-form';
import { NeedlemapMark } from '@/components/shell/mark';
import { redirect } from 'next/navigation';
import { currentUser } from '@/lib/auth/authorize';
import { sameOriginPath } from '@/lib/auth/next-path';

export const metadata: Metadata = { title: 'Sign in' };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ next?: string }> }) {
  const { next } = await searchParams;
  const safeNext = sameOriginPath(next, '/styles');
  // Already signed in: go on. (A database outage must not hide the sign-in page.)
  const user = await currentUser().catch(() => null);
  if (user) redirect(safeNext);
  return (
    <main className="grid min-h-screen place-items-center px-4">
      <div className="w-full max-w-sm">
        <div className="mb-6 flex items-center gap-2.5">
          <NeedlemapMark className="h-8 w-8" />
          <div>
            <div className="text-lg font-semibold tracking-tight">Needlemap</div>
            <div className="text-xs text-ink-faint">Knit zoning, yarn and fit for performance garments</div>
          </div>
        </div>
        <div className="rounded-[var(--radius-card)] border border-rule bg-panel p-6 shadow-sm">
          <h1 className="mb-4 text-base font-semibold">Sign in to your studio</h1>
          <SignInForm next={safeNext} />
        </div>
      </div>
    </main>
  );
}
