import type { Metadata } from 'next';
import { notFound, redirect } from 'next/navigation';
import { currentUser } from '@/lib/auth/authorize';
import { can } from '@/lib/auth/roles';
import { findTexture, yarnsOfTextures } from '@/lib/db/textures';
import { listYarns } from '@/lib/db/yarns';
import { studioRuleLimits } from '@/lib/db/rule-limits';
import { idParamSchema } from '@/lib/validations/library';
import { LibraryCrumbs } from '@/components/library/library-crumbs';
import { TextureEditor } from '@/components/library/texture-editor';

export const metadata: Metadata = { title: 'Texture' };

export default async function TexturePage({ params }: { params: Promise<{ id: string }> }) {
  const user = await currentUser();
  if (!user) redirect('/sign-in');
  if (!can(user.role, 'library:read')) redirect('/styles');
  const parsed = idParamSchema.safeParse(await params);
  if (!parsed.success) notFound();
  const texture = await findTexture(user, parsed.data.id);
  if (!texture || texture.archivedAt) notFound();
  const [library, used, ruleLimits] = await Promise.all([listYarns(user), yarnsOfTextures(user.studioId, [texture]), studioRuleLimits(user.studioId)]);
  // The library's yarns, and any the texture still uses that have left it.
  const yarns = [...library, ...used.filter((u) => !library.some((y) => y.id === u.id))];
  return (
    <>
      <LibraryCrumbs tab="textures" current={texture.name} />
      <TextureEditor texture={texture} yarns={yarns} canEdit={can(user.role, 'library:edit')} ruleLimits={ruleLimits} />
    </>
  );
}
