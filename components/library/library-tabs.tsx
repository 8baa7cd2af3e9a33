import Link from 'next/link';

export type LibraryTab = 'textures' | 'yarns';

/** The library's two lists as tabs; the tab lives in the address (?tab=yarns) so it can be linked. */
export function LibraryTabs({ active, counts }: { active: LibraryTab; counts: Record<LibraryTab, number> }) {
  const tabs: { id: LibraryTab; label: string; href: string }[] = [
    { id: 'textures', label: 'Textures', href: '/library' },
    { id: 'yarns', label: 'Yarns', href: '/library?tab=yarns' },
  ];
  return (
    <nav aria-label="Library" className="-mb-px flex gap-1">
      {tabs.map((t) => (
        <Link
          key={t.id}
          href={t.href}
          aria-current={active === t.id ? 'page' : undefined}
          className={`inline-flex items-center gap-2 whitespace-nowrap border-b-2 px-3 py-2 text-sm font-medium ${
            active === t.id ? 'border-spruce-600 text-ink' : 'border-transparent text-ink-soft hover:text-ink'
          }`}
        >
          {t.label}
          <span className="figures rounded-full bg-rule/70 px-1.5 text-2xs leading-4 text-ink-soft">{counts[t.id]}</span>
        </Link>
      ))}
      <Link
        href="/library/colour-standards"
        className="inline-flex items-center gap-2 whitespace-nowrap border-b-2 border-transparent px-3 py-2 text-sm font-medium text-ink-soft hover:text-ink"
      >
        Colour standards
      </Link>
    </nav>
  );
}
