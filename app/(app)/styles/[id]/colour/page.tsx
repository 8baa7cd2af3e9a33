import type { Metadata } from 'next';
import { notFound, redirect } from 'next/navigation';
import { currentUser } from '@/lib/auth/authorize';
import { can } from '@/lib/auth/roles';
import { findStyle } from '@/lib/db/styles';
import { idParamSchema } from '@/lib/validations/style';
import { ColourSection } from '@/components/colour/colour-section';

export const metadata: Metadata = { title: 'Colour' };

export default async function StyleColourPage({ params }: { params: Promise<{ id: string }> }) {
  const user = await currentUser();
  if (!user) redirect('/sign-in');
  const parsed = idParamSchema.safeParse(await params);
  if (!parsed.success) notFound();
  const style = await findStyle(user, parsed.data.id);
  if (!style) notFound();
  return (
    <ColourSection
      styleId={style.id}
      can={{
        edit: can(user.role, 'colour:edit'),
        decide: can(user.role, 'labdip:decide'),
        submit: can(user.role, 'mill:upload'),
        library: can(user.role, 'library:read'),
        client: user.role === 'client',
      }}
    />
  );
}
