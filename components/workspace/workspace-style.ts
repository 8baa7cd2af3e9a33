import 'server-only';
import { cache } from 'react';
import { notFound, redirect } from 'next/navigation';
import { currentUser } from '@/lib/auth/authorize';
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
