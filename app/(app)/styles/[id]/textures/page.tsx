import type { Metadata } from 'next';
import { can } from '@/lib/auth/roles';
import { loadPanels } from '@/lib/db/body-map';
import { listStyleTextures, listTextures, yarnsOfTextures } from '@/lib/db/textures';
import { yarnForViewer } from '@/lib/db/yarns';
import { StyleTextures, type TextureUse } from '@/components/style-textures/style-textures';
import { workingCopyStyle } from '@/components/workspace/workspace-style';

export const metadata: Metadata = { title: 'Textures' };

export default async function StyleTexturesPage({ params }: { params: Promise<{ id: string }> }) {
  const { user, style } = await workingCopyStyle((await params).id);
  const editable = can(user.role, 'style:edit');
  const [styleTextures, panels, library] = await Promise.all([
    listStyleTextures(user, style.id),
    loadPanels(style.id),
    editable ? listTextures(user) : Promise.resolve([]),
  ]);
  const usage: Record<string, TextureUse> = {};
  const entry = (id: string) => (usage[id] ??= { zones: 0, bases: 0 });
  for (const p of panels) {
    if (p.baseTextureId) entry(p.baseTextureId).bases += 1;
    for (const z of p.zones) entry(z.textureId).zones += 1;
  }
  const all = [...styleTextures.textures, ...library.filter((t) => !styleTextures.textures.some((s) => s.id === t.id))];
  const yarns = (await yarnsOfTextures(user.studioId, all)).map((y) => yarnForViewer(user, y));
  return (
    <StyleTextures
      styleId={style.id}
      initial={{ version: styleTextures.version, textures: styleTextures.textures }}
      library={library}
      yarns={yarns}
      gauge={style.machine.gauge}
      usage={usage}
      editable={editable}
    />
  );
}
