import Link from 'next/link';
import type { LibraryTab } from './library-tabs';

/** Library / Textures / <name>: where a library page sits. */
export function LibraryCrumbs({ tab, current }: { tab: LibraryTab; current?: string }) {
  return (
    <div className="mb-1 flex items-center gap-2 text-xs text-ink-faint">
      <Link href="/library" className="hover:text-ink">Library</Link>
      <span aria-hidden>/</span>
      <Link href={tab === 'yarns' ? '/library?tab=yarns' : '/library'} className="hover:text-ink">{tab === 'yarns' ? 'Yarns' : 'Textures'}</Link>
      {current ? (
        <>
          <span aria-hidden>/</span>
          <span className="text-ink-soft">{current}</span>
        </>
      ) : null}
    </div>
  );
}
