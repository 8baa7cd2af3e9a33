'use client';

import Link from 'next/link';
import { usePathname } from 'next/navigation';
import { workspaceSections } from './sections';
import { can, type Role } from '@/lib/auth/roles';

export function SectionTabs({ styleId, role }: { styleId: string; role: Role }) {
  const path = usePathname();
  const base = `/styles/${styleId}`;
  return (
    <nav aria-label="Style sections" className="-mb-px flex gap-1 overflow-x-auto">
      {workspaceSections.filter((s) => !s.permission || can(role, s.permission)).map((s) => {
        const href = s.slug ? `${base}/${s.slug}` : base;
        const active = s.slug ? path.startsWith(href) : path === base;
        return (
          <Link
            key={s.slug}
            href={href}
            aria-current={active ? 'page' : undefined}
            className={`whitespace-nowrap border-b-2 px-3 py-2 text-sm font-medium ${active ? 'border-spruce-600 text-ink' : 'border-transparent text-ink-soft hover:text-ink'}`}
          >
            {s.label}
          </Link>
        );
      })}
    </nav>
  );
}
