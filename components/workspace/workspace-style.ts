import 'server-only';
import { cache } from 'react';
import { notFound, redirect } from 'next/navigation';
import { currentUser } from '@/lib/auth/authorize';
import { can } from '@/lib/auth/roles';
import { findStyle } from '@/lib/db/styles';
import { idParamSchema } from '@/lib/validations/style';

/**
 * The signed-in user and the style of a workspace page, or the sign-in redirect / 404 page.
 * Cached per request, so the workspace layout and its page read them once.
 */
export const workspaceStyle = cache(async (rawId: string) => {
  const user = await currentUser();
  if (!user) redirect('/sign-in');
  const parsed = idParamSchema.safeParse({ id: rawId });
  if (!parsed.success) notFound();
  const style = await findStyle(user, parsed.data.id);
  if (!style) notFound();
  return { user, style };
});

/**
 * The same, for the sections that show the live working copy (brief, body map, textures, yarns,
 * trims). The mill works from what was released to it, so it is sent to the mill pack instead.
 */
export async function workingCopyStyle(rawId: string) {
  const found = await workspaceStyle(rawId);
  if (!can(found.user.role, 'style:working-copy')) redirect(`/styles/${found.style.id}/mill-pack`);
  return found;
}
