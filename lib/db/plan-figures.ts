import type { Knex } from 'knex';
import { db } from './knex';
import type { SessionUser } from './users';
import { notFound } from '@/lib/api/errors';
import { findStyle, type Style } from './styles';
import { loadBodyMap } from './body-map';
import { findTexture, listStyleTextures, yarnsOfTextures, type LibraryTexture } from './textures';
import type { LibraryYarn } from './yarns';
import { loadFit } from './fit';
import { summariseBodyMap, type BodyMapSummary } from '@/lib/knit/summary';
import type { Panel } from '@/lib/knit/panel';
import { resolveValues } from '@/lib/fit/grading';
import { pointsOfMeasure } from '@/lib/fit/points';

/** The knit plan of a style as the brief checks and the quote read it: the body map summarised with its yarns. */
export interface StylePlan {
  style: Style;
  panels: Panel[];
  textures: LibraryTexture[];
  /** The yarns the textures feed, straight from the library (prices included: studio callers only). */
  yarns: LibraryYarn[];
  summary: BodyMapSummary;
}

/**
 * Reads the style's body map (saved, or generated), the textures it uses and their yarns, and
 * summarises it for the base size. The caller has checked that the user may see what it returns.
 */
export async function loadStylePlan(user: SessionUser, styleId: string, wasteAllowance: number, q: Knex = db()): Promise<StylePlan> {
  const style = await findStyle(user, styleId, q);
  if (!style) throw notFound('Style not found.');
  const [map, styleTextures] = await Promise.all([loadBodyMap(user, styleId, q), listStyleTextures(user, styleId, q)]);
  const panels = map?.panels ?? [];
  const textures = [...styleTextures.textures];
  const known = new Set(textures.map((t) => t.id));
  for (const id of new Set(panels.flatMap((p) => [p.baseTextureId, ...p.zones.map((z) => z.textureId)]))) {
    if (!id || known.has(id)) continue;
    const t = await findTexture(user, id, q);
    if (t) { textures.push(t); known.add(id); }
  }
  const yarns = await yarnsOfTextures(user.studioId, textures, q);
  const summary = summariseBodyMap({
    panels, textures: new Map(textures.map((t) => [t.id, t])), yarns, gauge: style.machine.gauge, wasteAllowance,
  });
  return { style, panels, textures, yarns, summary };
}

/**
 * Courses the machine knits for one garment of the mapped (base) size: on a circular machine the
 * front and back are one tube (its height counts once) and every other panel is a tube of its
 * own; on a V-bed every panel is knitted on its own.
 */
export function coursesPerGarment(style: Style, panels: readonly Panel[]): number {
  if (style.construction === 'flat') return panels.reduce((a, p) => a + p.heightCourses, 0);
  const body = panels.filter((p) => p.kind === 'front' || p.kind === 'back');
  const rest = panels.filter((p) => p.kind !== 'front' && p.kind !== 'back');
  return Math.max(0, ...body.map((p) => p.heightCourses)) + rest.reduce((a, p) => a + p.heightCourses, 0);
}

export interface SizeScale {
  size: string;
  /** Width ratio to the base size (first width point of the spec). */
  width: number;
  /** Length ratio to the base size (first length point of the spec). */
  length: number;
}

/**
 * How each size scales from the mapped base size: the ratio of the spec's first width point and
 * first length point (as the mill pack scales consumption). 1 × 1 when no spec is saved.
 */
export async function sizeScales(user: SessionUser, style: Style, q: Knex = db()): Promise<{ scales: SizeScale[]; fromSpec: boolean }> {
  const doc = await loadFit(user, style.id, q);
  const base = doc.spec.baseSize;
  const values = resolveValues(doc.spec.points, doc.sizes, base);
  const widthPoint = doc.saved ? doc.spec.points.find((p) => pointsOfMeasure[p.point]?.kind !== 'length' && values[p.point]?.[base]) : undefined;
  const lengthPoint = doc.saved ? doc.spec.points.find((p) => pointsOfMeasure[p.point]?.kind === 'length' && values[p.point]?.[base]) : undefined;
  const ratio = (point: string | undefined, size: string) => {
    if (!point) return 1;
    const v = values[point as keyof typeof values];
    const b = v?.[base];
    const s = v?.[size];
    return b && s ? s / b : 1;
  };
  // The map is drawn for the style's base size; a spec with another base size is rescaled to it.
  const mapBase = style.sizes.base;
  const w0 = ratio(widthPoint?.point, mapBase);
  const l0 = ratio(lengthPoint?.point, mapBase);
  return {
    scales: style.sizes.labels.map((size) => ({ size, width: ratio(widthPoint?.point, size) / w0, length: ratio(lengthPoint?.point, size) / l0 })),
    fromSpec: !!(widthPoint || lengthPoint),
  };
}
