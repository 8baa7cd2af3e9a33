import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { can } from '@/lib/auth/roles';
import { loadBodyMap } from '@/lib/db/body-map';
import { findTexture, listStyleTextures, listTextures, yarnsOfTextures } from '@/lib/db/textures';
import { yarnForViewer } from '@/lib/db/yarns';
import { listTrims } from '@/lib/db/trims';
import { TrimsWorkspace } from '@/components/trims/trims-workspace';
import { workingCopyStyle } from '@/components/workspace/workspace-style';

export const metadata: Metadata = { title: 'Trims' };

export default async function TrimsPage({ params }: { params: Promise<{ id: string }> }) {
  const { user, style } = await workingCopyStyle((await params).id);
  const [map, styleTextures, trims] = await Promise.all([loadBodyMap(user, style.id), listStyleTextures(user, style.id), listTrims(user, style.id)]);
  if (!map) notFound();
  const textures = [...styleTextures.textures];
  for (const id of new Set(map.panels.flatMap((p) => [p.baseTextureId, ...p.zones.map((z) => z.textureId)]))) {
    if (!id || textures.some((t) => t.id === id)) continue;
    const t = await findTexture(user, id);
    if (t) textures.push(t);
  }
  const yarns = (await yarnsOfTextures(user.studioId, textures)).map((y) => yarnForViewer(user, y));
  // The same flat colours as the body map: it colours the style's textures together with the library for staff.
  const library = can(user.role, 'library:read') ? await listTextures(user) : [];
  const colourIds = [...new Set([...textures, ...library].map((t) => t.id))];
  return (
    <TrimsWorkspace
      styleId={style.id}
      panels={map.panels}
      generated={map.generated}
      textures={textures}
      yarns={yarns}
      colourIds={colourIds}
      machine={{ construction: style.construction, gauge: style.machine.gauge, maxYarns: style.machine.maxYarns }}
      initialTrims={trims}
      editable={can(user.role, 'style:edit')}
    />
  );
}
