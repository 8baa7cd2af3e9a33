import type { Knex } from 'knex';
import { db } from './knex';
import type { SessionUser } from './users';
import type { Style } from './styles';
import { bodyMapOf, type BodyMap } from './body-map';
import { texturesByIds, texturesOfStyleList, yarnsOfTextures, type LibraryTexture } from './textures';
import type { LibraryYarn } from './yarns';
import { trimsOfStyle, type StyleTrim } from './trims';

/**
 * What the yarn calculator and the mill pack both read of a style: its body map, the textures, the
 * yarns those feed and the trims.
 */
export interface StyleParts {
  /** The saved map, or the panels generated for the style when none is saved. */
  map: BodyMap;
  /** The style's texture list in its order, then any texture a panel or zone uses that is not on it. */
  textures: LibraryTexture[];
  /** The yarns the textures feed, as stored: prices included (apply `yarnForViewer` before showing them). */
  yarns: LibraryYarn[];
  trims: StyleTrim[];
}

/**
 * The parts of a style the caller has already read (and so may see), in four queries after the
 * style: map, texture list and trims side by side, then the textures the map uses beyond the
 * list, then their yarns.
 */
export async function loadStyleParts(user: SessionUser, style: Style, q: Knex = db()): Promise<StyleParts> {
  const [map, listed, trims] = await Promise.all([
    bodyMapOf(user.studioId, style, q),
    texturesOfStyleList(user.studioId, style.id, q),
    trimsOfStyle(style.id, q),
  ]);
  const known = new Set(listed.map((t) => t.id));
  const beyondList = map.panels.flatMap((p) => [p.baseTextureId, ...p.zones.map((z) => z.textureId)]).filter((id) => id && !known.has(id));
  const textures = [...listed, ...(await texturesByIds(user.studioId, beyondList, q))];
  const yarns = await yarnsOfTextures(user.studioId, textures, q);
  return { map, textures, yarns, trims };
}
