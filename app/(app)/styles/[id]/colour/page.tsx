import type { Metadata } from 'next';
import { can } from '@/lib/auth/roles';
import { ColourSection } from '@/components/colour/colour-section';
import { workspaceStyle } from '@/components/workspace/workspace-style';

export const metadata: Metadata = { title: 'Colour' };

export default async function StyleColourPage({ params }: { params: Promise<{ id: string }> }) {
  const { user, style } = await workspaceStyle((await params).id);
  return (
    <ColourSection
      styleId={style.id}
      can={{
        edit: can(user.role, 'colour:edit'),
        decide: can(user.role, 'labdip:decide'),
        submit: can(user.role, 'mill:upload'),
        library: can(user.role, 'library:read'),
        client: user.role === 'client',
        preview: can(user.role, 'style:working-copy'),
      }}
    />
  );
}
