import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import { currentUser } from '@/lib/auth/authorize';
import { can } from '@/lib/auth/roles';
import { listTextures } from '@/lib/db/textures';
import { listYarns } from '@/lib/db/yarns';
import { studioRuleLimits } from '@/lib/db/rule-limits';
import { PageHeader } from '@/components/ui/card';
import { ButtonLink } from '@/components/ui/button';
import { LibraryTabs, type LibraryTab } from '@/components/library/library-tabs';
import { TexturesTable } from '@/components/library/textures-table';
import { YarnsTable } from '@/components/library/yarns-table';
import { MachineLimitsForm } from '@/components/library/machine-limits-form';

export const metadata: Metadata = { title: 'Library' };

export default async function LibraryPage({ searchParams }: { searchParams: Promise<{ tab?: string }> }) {
  const user = await currentUser();
  if (!user) redirect('/sign-in');
  if (!can(user.role, 'library:read')) redirect('/styles');
  const tab: LibraryTab = (await searchParams).tab === 'yarns' ? 'yarns' : 'textures';
  const canEdit = can(user.role, 'library:edit');
  // The machine limits show on the textures tab only.
  const [textures, yarns, ruleLimits] = await Promise.all([
    listTextures(user), listYarns(user), tab === 'textures' ? studioRuleLimits(user.studioId) : null,
  ]);
  return (
    <>
      <PageHeader
        eyebrow={user.studioName}
        title="Library"
        actions={
          canEdit ? (
            tab === 'yarns' ? <ButtonLink href="/library/yarns/new" variant="primary">New yarn</ButtonLink> : <ButtonLink href="/library/textures/new" variant="primary">New texture</ButtonLink>
          ) : null
        }
      >
        <p className="mt-1 text-sm text-ink-soft">The studio’s knit structures and the yarns that feed them. Styles pick their textures from here.</p>
      </PageHeader>
      <div className="mb-4 border-b border-rule">
        <LibraryTabs active={tab} counts={{ textures: textures.length, yarns: yarns.length }} />
      </div>
      {tab === 'yarns' ? (
        <YarnsTable initial={yarns} canEdit={canEdit} />
      ) : (
        <>
          {ruleLimits ? <MachineLimitsForm initial={ruleLimits} editable={can(user.role, 'studio:settings')} /> : null}
          <TexturesTable initialTextures={textures} initialYarns={yarns} canEdit={canEdit} />
        </>
      )}
    </>
  );
}
