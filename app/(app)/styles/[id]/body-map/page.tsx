import type { Metadata } from 'next';
import { can } from '@/lib/auth/roles';
import { loadBodyMap } from '@/lib/db/body-map';
import { listStyleTextures, listTextures, yarnsOfTextures } from '@/lib/db/textures';
import { yarnForViewer } from '@/lib/db/yarns';
import { listTrims } from '@/lib/db/trims';
import { gradedSizeSpec } from '@/lib/db/fit';
import { studioRuleLimits } from '@/lib/db/rule-limits';
import { trimKindLabels } from '@/lib/validations/library';
import { BodyMapEditor } from '@/components/body-map/body-map-editor';
import { notFound } from 'next/navigation';
import { workingCopyStyle } from '@/components/workspace/workspace-style';

export const metadata: Metadata = { title: 'Body map' };

export default async function BodyMapPage({ params }: { params: Promise<{ id: string }> }) {
  const { user, style } = await workingCopyStyle((await params).id);
  const [map, styleTextures, styleTrims, spec, ruleLimits] = await Promise.all([
    loadBodyMap(user, style.id), listStyleTextures(user, style.id), listTrims(user, style.id), gradedSizeSpec(style), studioRuleLimits(user.studioId),
  ]);
  if (!map) notFound();
  const panelIdOf = new Map(map.panels.map((p) => [p.kind, p.id]));
  const trims = styleTrims.flatMap((t) => {
    const panelId = panelIdOf.get(t.panelKind);
    return panelId ? [{ id: t.id, panelId, box: t.box, label: t.name || trimKindLabels[t.kind] }] : [];
  });
  // Editors choose from the whole library; everyone else sees the style's own textures.
  const library = can(user.role, 'library:read') ? await listTextures(user) : [];
  const byId = new Map([...styleTextures.textures, ...library].map((t) => [t.id, t]));
  const textures = [...byId.values()].filter((t) => !t.archivedAt || styleTextures.textures.some((s) => s.id === t.id));
  const yarns = (await yarnsOfTextures(user.studioId, textures)).map((y) => yarnForViewer(user, y));
  const machine = { construction: style.construction, gauge: style.machine.gauge, maxYarns: style.machine.maxYarns };
  return (
    <BodyMapEditor
      styleId={style.id}
      initial={map}
      textures={textures}
      yarns={yarns}
      machine={machine}
      ruleLimits={ruleLimits}
      readOnly={!can(user.role, 'style:edit')}
      baseSize={style.sizes.base}
      sizes={style.sizes.labels}
      garment={style.garmentType}
      graded={spec?.values ?? null}
      trims={trims}
    />
  );
}
