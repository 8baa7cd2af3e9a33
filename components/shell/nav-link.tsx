'use client';

import Link from 'next/link';
import { usePathname } from 'next/navigation';

export function NavLink({ href, children }: { href: string; children: React.ReactNode }) {
  const path = usePathname();
  const active = path === href || path.startsWith(`${href}/`);
  return (
    <Link
      href={href}
      aria-current={active ? 'page' : undefined}
      className={`rounded-md px-2.5 py-1.5 font-medium ${active ? 'bg-spruce-50 text-spruce-700' : 'text-ink-soft hover:bg-paper hover:text-ink'}`}
    >
      {children}
    </Link>
  );
}
