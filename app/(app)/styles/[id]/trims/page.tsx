import type { Metadata } from 'next';
import { can } from '@/lib/auth/roles';
import { listTextures } from '@/lib/db/textures';
import { yarnForViewer } from '@/lib/db/yarns';
import { loadStyleParts } from '@/lib/db/style-parts';
import { TrimsWorkspace } from '@/components/trims/trims-workspace';
import { workingCopyStyle } from '@/components/workspace/workspace-style';

export const metadata: Metadata = { title: 'Trims' };

export default async function TrimsPage({ params }: { params: Promise<{ id: string }> }) {
  const { user, style } = await workingCopyStyle((await params).id);
  // The same flat colours as the body map: it colours the style's textures together with the library for staff.
  const [{ map, textures, yarns: storedYarns, trims }, library] = await Promise.all([
    loadStyleParts(user, style),
    can(user.role, 'library:read') ? listTextures(user) : Promise.resolve([]),
  ]);
  const yarns = storedYarns.map((y) => yarnForViewer(user, y));
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
