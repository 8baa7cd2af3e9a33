import type { Panel, Zone } from '@/lib/knit/panel';
import type { PanelRaster } from '@/lib/knit/raster';
import { needlePitchMm, type Texture } from '@/lib/knit/texture';
import { texturesUnderBox, type TextureGrid } from './trim-heat';
import { trimLabel, type Trim } from './trim';
import type { RuleFinding } from './types';

/** What the ventilation rule reads of a panel's raster: the zone that drew every stitch. */
export type ZoneGrid = Pick<PanelRaster, 'width' | 'height'> & { zoneCells: Uint16Array };

/** The stitch cells under a box (stitch centres inside it), clipped to the raster, as index ranges. */
function cellRange(grid: { width: number; height: number }, box: Trim['box']) {
  return {
    x0: Math.max(0, Math.ceil(box.x - 0.5)),
    x1: Math.min(grid.width, Math.ceil(box.x + box.width - 0.5)),
    y0: Math.max(0, Math.ceil(box.y - 0.5)),
    y1: Math.min(grid.height, Math.ceil(box.y + box.height - 0.5)),
  };
}

const pct = (x: number) => `${Math.round(x * 100)} %`;

/**
 * A trim over a ventilation zone: any trim whose box covers stitches drawn by a zone tagged
 * `ventilation` (the zone as it shows, after the zones stacked over it). A label, transfer or logo
 * there closes the open structure and the air flow the zone is for. Common practice, no published
 * source.
 * @param grids per panel id, rasters drawn with `zoneMap` (lib/knit/raster `rasterizePanel`).
 */
export function checkTrimVentilation(
  trims: readonly Trim[],
  panels: readonly Panel[],
  grids: ReadonlyMap<string, ZoneGrid>,
): RuleFinding[] {
  const out: RuleFinding[] = [];
  const byId = new Map(panels.map((p) => [p.id, p]));
  for (const trim of trims) {
    const panel = byId.get(trim.panelId);
    const grid = grids.get(trim.panelId);
    if (!panel || !grid) continue;
    const { x0, x1, y0, y1 } = cellRange(grid, trim.box);
    const cells = Math.max(0, x1 - x0) * Math.max(0, y1 - y0);
    if (cells === 0) continue;
    const counts = new Map<number, number>();
    for (let y = y0; y < y1; y++) {
      const row = y * grid.width;
      for (let x = x0; x < x1; x++) {
        const k = grid.zoneCells[row + x] as number;
        if (k > 0) counts.set(k, (counts.get(k) ?? 0) + 1);
      }
    }
    const vents: { zone: Zone; n: number }[] = [];
    for (const [k, n] of counts) {
      const zone = panel.zones[k - 1];
      if (zone?.fn === 'ventilation') vents.push({ zone, n });
    }
    if (vents.length === 0) continue;
    vents.sort((a, b) => b.n - a.n);
    const covered = vents.reduce((s, v) => s + v.n, 0);
    const first = vents[0] as { zone: Zone; n: number };
    out.push({
      rule: 'trim-ventilation',
      severity: 'warning',
      message:
        `Trim ${trimLabel(trim)} sits over the ventilation ${vents.length === 1 ? 'zone' : 'zones'} ` +
        `${vents.map((v) => v.zone.name || 'unnamed').join(', ')} (${pct(covered / cells)} of the trim): it closes the open structure there. ` +
        'Move it onto a closed texture.',
      where: { panelId: trim.panelId, zoneId: first.zone.id, needle: Math.round(trim.box.x), course: Math.round(trim.box.y), trimIds: [trim.id] },
    });
  }
  return out;
}

/** The size of one stitch of a texture in relaxed fabric, mm: 10 ÷ wales per cm across, 10 ÷ courses per cm up. */
export function stitchSizeMm(texture: Pick<Texture, 'density'>): { widthMm: number; heightMm: number } {
  return { widthMm: 10 / texture.density.walesPerCm, heightMm: 10 / texture.density.coursesPerCm };
}

const mm = (x: number) => `${x.toFixed(2)} mm`;

/**
 * A knitted logo finer than the gauge can render: the artwork's finest line or gap (`detailMm`)
 * is smaller than one stitch of the texture it is knitted in. A stitch is the smallest thing a knit
 * can draw, and a line of any direction needs a whole wale across and a whole course up, so the
 * detail must be at least the larger of the two (stitch size from the relaxed density, product design
 * §4; off the textures, the needle pitch 25.4 ÷ gauge). Details of one or two stitches read poorly
 * on the body: common practice, no published source. A logo without its detail is flagged for it.
 * @param gauge needles per inch.
 */
export function checkKnittedLogoDetail(
  trims: readonly Trim[],
  rasters: ReadonlyMap<string, TextureGrid>,
  textures: ReadonlyMap<string, Texture>,
  gauge: number,
): RuleFinding[] {
  const out: RuleFinding[] = [];
  for (const trim of trims) {
    if (trim.kind !== 'knitted-logo') continue;
    const at = { panelId: trim.panelId, needle: Math.round(trim.box.x), course: Math.round(trim.box.y), trimIds: [trim.id] };
    if (trim.detailMm === undefined) {
      out.push({
        rule: 'knitted-logo-detail',
        severity: 'info',
        message: `Knitted logo ${trimLabel(trim)} has no finest detail given; enter the thinnest line or gap of the artwork to check it against the stitch.`,
        where: at,
      });
      continue;
    }
    const raster = rasters.get(trim.panelId);
    const under = raster ? texturesUnderBox(raster, trim.box).flatMap((id) => (textures.get(id) ? [textures.get(id) as Texture] : [])) : [];
    // The coarsest stitch under the logo decides.
    let worst: { texture?: Texture; widthMm: number; heightMm: number; need: number } | undefined;
    for (const t of under) {
      const s = stitchSizeMm(t);
      const need = Math.max(s.widthMm, s.heightMm);
      if (!worst || need > worst.need) worst = { texture: t, ...s, need };
    }
    if (!worst) {
      const pitch = needlePitchMm(gauge);
      worst = { widthMm: pitch, heightMm: pitch, need: pitch };
    }
    if (trim.detailMm >= worst.need) continue;
    const where = worst.texture
      ? `one stitch of ${worst.texture.name} is ${mm(worst.widthMm)} wide and ${mm(worst.heightMm)} high (${worst.texture.density.walesPerCm} wales/cm, ${worst.texture.density.coursesPerCm} courses/cm)`
      : `one needle at ${gauge} gauge is ${mm(worst.widthMm)}`;
    out.push({
      rule: 'knitted-logo-detail',
      severity: 'warning',
      message:
        `Knitted logo ${trimLabel(trim)} has details of ${mm(trim.detailMm)}, finer than the knit can draw: ${where}. ` +
        `Thicken lines and gaps to at least ${mm(worst.need)}, better two stitches (${mm(2 * worst.need)}).`,
      where: worst.texture ? { ...at, textureId: worst.texture.id } : at,
    });
  }
  return out;
}
