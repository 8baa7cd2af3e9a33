import Link from 'next/link';
import { NeedlemapMark } from './mark';
import { SignOutButton } from './sign-out-button';
import { NavLink } from './nav-link';
import { env } from '@/lib/env';
import { can, isOutsideRole, roleLabels } from '@/lib/auth/roles';
import type { SessionUser } from '@/lib/db/users';

export function AppShell({ user, children }: { user: SessionUser; children: React.ReactNode }) {
  const outside = isOutsideRole(user.role);
  return (
    <div className="min-h-screen">
      <header className="sticky top-0 z-30 border-b border-rule bg-panel/95 backdrop-blur">
        <div className="mx-auto flex h-12 max-w-[1600px] items-center gap-6 px-5">
          <Link href="/styles" className="flex items-center gap-2">
            <NeedlemapMark className="h-6 w-6" />
            <span className="text-[15px] font-semibold tracking-tight">Needlemap</span>
          </Link>
          <nav className="flex items-center gap-1 text-sm" aria-label="Main">
            <NavLink href="/styles">{outside ? (user.role === 'mill' ? 'Released to you' : 'Shared with you') : 'Styles'}</NavLink>
            {can(user.role, 'library:read') ? <NavLink href="/library">Library</NavLink> : null}
            {can(user.role, 'members:manage') ? <NavLink href="/members">Members</NavLink> : null}
            {!outside && env().devPages ? <NavLink href="/dev/mail">Mail (dev)</NavLink> : null}
          </nav>
          <div className="ml-auto flex items-center gap-3 text-sm">
            <Link href="/account" title="Your account and password" className="rounded-md px-2 py-1 text-right leading-tight hover:bg-paper">
              <div className="font-medium">{user.name}</div>
              <div className="text-xs text-ink-faint">
                {roleLabels[user.role]} · {user.organisationName ?? user.studioName}
              </div>
            </Link>
            <SignOutButton />
          </div>
        </div>
      </header>
      <main className="mx-auto max-w-[1600px] px-5 py-6">{children}</main>
    </div>
  );
}
