import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import { currentUser } from '@/lib/auth/authorize';
import { can } from '@/lib/auth/roles';
import { listYarns } from '@/lib/db/yarns';
import { studioRuleLimits } from '@/lib/db/rule-limits';
import { LibraryCrumbs } from '@/components/library/library-crumbs';
import { TextureEditor } from '@/components/library/texture-editor';

export const metadata: Metadata = { title: 'New texture' };

export default async function NewTexturePage() {
  const user = await currentUser();
  if (!user) redirect('/sign-in');
  if (!can(user.role, 'library:edit')) redirect('/library');
  const [yarns, ruleLimits] = await Promise.all([listYarns(user), studioRuleLimits(user.studioId)]);
  return (
    <>
      <LibraryCrumbs tab="textures" current="New texture" />
      <TextureEditor yarns={yarns} canEdit ruleLimits={ruleLimits} />
    </>
  );
}
