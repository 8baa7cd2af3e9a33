import type { Metadata } from 'next';
import { can, isOutsideRole } from '@/lib/auth/roles';
import { listOrganisations } from '@/lib/db/organisations';
import { listReleases, requireRelease } from '@/lib/db/releases';
import { packDataOf } from '@/lib/db/pack-source';
import { Card, Notice } from '@/components/ui/card';
import { ExportsPanel } from '@/components/mill/exports-panel';
import { ReleaseForm } from '@/components/mill/release-form';
import { ReleasesList } from '@/components/mill/releases-list';
import { workspaceStyle } from '@/components/workspace/workspace-style';

export const metadata: Metadata = { title: 'Mill pack' };

export default async function MillPackPage({ params }: { params: Promise<{ id: string }> }) {
  const { user, style } = await workspaceStyle((await params).id);
  const releases = await listReleases(user, style.id);
  const outside = isOutsideRole(user.role);
  const latest = releases[0];
  // Outside accounts print released revisions only; the studio prints the working copy too.
  const data = outside ? (latest ? (await requireRelease(user, latest.id)).snapshot : null) : (await packDataOf(user, style)).data;
  const mills = can(user.role, 'style:release') ? (await listOrganisations(user.studioId)).filter((o) => o.kind === 'mill') : [];
  const choices = data
    ? {
        styleId: style.id,
        releaseId: outside ? (latest?.id ?? null) : null,
        title: outside ? `Mill pack · revision ${latest?.revision}` : `Exports of the working copy · revision ${style.revision}`,
        textures: data.textures.map((t) => ({ id: t.id, name: t.name })),
        panels: data.panels.map((p) => ({ id: p.id, name: p.name })),
      }
    : null;
  return (
    <div className="grid grid-cols-1 gap-5 xl:grid-cols-[1fr_380px]">
      <div className="space-y-5">
        {user.role === 'mill' && latest ? (
          <Notice>
            You work from the revisions released to you. Open{' '}
            <a className="font-medium underline" href={`/releases/${latest.id}`}>revision {latest.revision}</a> to see its body map, textures,
            yarns and label as they were released.
          </Notice>
        ) : null}
        {choices && can(user.role, 'mill:download') ? <ExportsPanel choices={choices} /> : null}
        {!choices && outside ? (
          <Card title="Mill pack"><p className="text-sm text-ink-soft">Nothing of this style was released to you yet.</p></Card>
        ) : null}
        <ReleasesList releases={releases} />
      </div>
      <div className="space-y-5">
        {can(user.role, 'style:release') ? (
          <ReleaseForm
            styleId={style.id}
            version={style.version}
            revision={style.revision}
            alreadyReleased={releases.some((r) => r.revision >= style.revision)}
            mills={mills.map((m) => ({ id: m.id, name: m.name, contacts: m.contactEmails.length }))}
          />
        ) : null}
        <Card title="What the mill gets">
          <ul className="list-disc space-y-1 pl-4 text-sm text-ink-soft">
            <li>Swatch sheets: every texture at true size, with scale bars and the stitch chart.</li>
            <li>The mill pack: cover and approvals, panels with zones and cut lines, swatches, yarns and consumption, label, colour, sizes and needles, trims.</li>
            <li>Tiles, stitch maps with their legend, and the yarn list as files for their own tools.</li>
          </ul>
        </Card>
      </div>
    </div>
  );
}
