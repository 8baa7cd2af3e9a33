/**
 * Where textures are used: each panel's base texture and each zone's, with the stitch area they
 * cover, so texture rules can say where a problem shows.
 */
import { polygonBounds, type StitchBounds } from '@/lib/editor/geometry';
import type { Panel, Zone } from '@/lib/knit/panel';
import type { Texture } from '@/lib/knit/texture';

export type TextureLookup = Readonly<Record<string, Texture>> | readonly Texture[] | ReadonlyMap<string, Texture>;

/** Normalises the accepted texture collections into a map by id. */
export function textureMap(textures: TextureLookup): ReadonlyMap<string, Texture> {
  if (textures instanceof Map) return textures as ReadonlyMap<string, Texture>;
  if (Array.isArray(textures)) return new Map((textures as readonly Texture[]).map((t) => [t.id, t]));
  return new Map(Object.entries(textures as Readonly<Record<string, Texture>>));
}

export interface TextureUsage {
  panel: Panel;
  /** Absent for the panel's base texture. */
  zone?: Zone;
  textureId: string;
  /** Undefined when the texture is not in the lookup. */
  texture: Texture | undefined;
  /** The area used, clamped to the panel, in needles and courses. */
  bounds: StitchBounds;
}

/** Every use of a texture on the panels: base textures first, then zones by panel order. */
export function textureUsages(panels: readonly Panel[], textures: ReadonlyMap<string, Texture>): TextureUsage[] {
  const out: TextureUsage[] = [];
  for (const panel of panels) {
    const whole = { minX: 0, minY: 0, maxX: panel.widthNeedles, maxY: panel.heightCourses };
    out.push({ panel, textureId: panel.baseTextureId, texture: textures.get(panel.baseTextureId), bounds: whole });
    for (const zone of panel.zones) {
      const b = polygonBounds(zone.polygon);
      out.push({
        panel,
        zone,
        textureId: zone.textureId,
        texture: textures.get(zone.textureId),
        bounds: {
          minX: Math.max(0, b.minX),
          minY: Math.max(0, b.minY),
          maxX: Math.min(panel.widthNeedles, b.maxX),
          maxY: Math.min(panel.heightCourses, b.maxY),
        },
      });
    }
  }
  return out;
}

/**
 * The first whole stitch at or after `min` whose place in the repeat lattice is `offset`
 * (the lattice is counted from the panel's top-left corner, where the raster starts tiling).
 */
export function firstLatticeStitch(min: number, period: number, offset: number): number {
  // Stitch i is sampled at its centre i + 0.5 (lib/knit/panel.ts).
  const start = Math.ceil(min - 0.5);
  const shift = (((offset - start) % period) + period) % period;
  return start + shift;
}

/** Location fields for a use of a texture. */
export function usageWhere(u: TextureUsage): { panelId: string; zoneId?: string; textureId: string } {
  return u.zone ? { panelId: u.panel.id, zoneId: u.zone.id, textureId: u.textureId } : { panelId: u.panel.id, textureId: u.textureId };
}

/** "zone Side panel on Front" or "the base of Front", for messages. */
export function usageLabel(u: TextureUsage): string {
  return u.zone ? `zone ${u.zone.name} on ${u.panel.name}` : `the base of ${u.panel.name}`;
}
