import type { Metadata } from 'next';
import Link from 'next/link';
import { redirect } from 'next/navigation';
import { currentUser } from '@/lib/auth/authorize';
import { can } from '@/lib/auth/roles';
import { listColourStandards } from '@/lib/db/colour-standards';
import { readColourSettings } from '@/lib/db/colour-settings';
import { PageHeader } from '@/components/ui/card';
import { ColourStandardsLibrary } from '@/components/colour/colour-standards-library';
import { ColourSettingsForm } from '@/components/colour/colour-settings-form';

export const metadata: Metadata = { title: 'Colour standards' };

export default async function ColourStandardsPage() {
  const user = await currentUser();
  if (!user) redirect('/sign-in');
  if (!can(user.role, 'library:read')) redirect('/styles');
  const [standards, settings] = await Promise.all([listColourStandards(user), readColourSettings(user)]);
  return (
    <>
      <div className="mb-1 flex items-center gap-2 text-xs text-ink-faint">
        <Link href="/library" className="hover:text-ink">Library</Link>
        <span aria-hidden>/</span>
        <span className="text-ink-soft">Colour standards</span>
      </div>
      <PageHeader eyebrow={user.studioName} title="Colour standards">
        <p className="mt-1 text-sm text-ink-soft">Named colours the studio matches lab dips against, with the tolerance each accepts.</p>
      </PageHeader>
      <ColourStandardsLibrary initial={standards} canEdit={can(user.role, 'colour:edit')} />
      <div className="mt-6 max-w-2xl">
        <ColourSettingsForm initial={settings} editable={can(user.role, 'colour:edit')} />
      </div>
    </>
  );
}
