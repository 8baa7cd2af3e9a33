import { fibres, type Fibre, type FibreId } from '@/lib/knit/fibres';
import type { PanelRaster } from '@/lib/knit/raster';
import { textureYarnIds, type Texture } from '@/lib/knit/texture';
import type { Yarn } from '@/lib/knit/yarn';
import { boxesOverlap, isHeatApplied, trimLabel, type Trim } from './trim';
import type { RuleFinding } from './types';

/** What the heat rule reads of a panel's raster: the texture of every stitch. */
export type TextureGrid = Pick<PanelRaster, 'width' | 'height' | 'cells' | 'legend'>;

/** Texture ids knitted under a box of a raster (stitch centres inside the box), in legend order. */
export function texturesUnderBox(raster: TextureGrid, box: Trim['box']): string[] {
  const x0 = Math.max(0, Math.ceil(box.x - 0.5));
  const x1 = Math.min(raster.width, Math.ceil(box.x + box.width - 0.5));
  const y0 = Math.max(0, Math.ceil(box.y - 0.5));
  const y1 = Math.min(raster.height, Math.ceil(box.y + box.height - 0.5));
  const seen = new Uint8Array(raster.legend.length);
  for (let y = y0; y < y1; y++) {
    const row = y * raster.width;
    for (let x = x0; x < x1; x++) seen[raster.cells[row + x] as number] = 1;
  }
  return raster.legend.filter((id, k) => k > 0 && seen[k] === 1);
}

/**
 * Heat-applied trims (heat press, bonding) hotter than a fibre under them can take: for every
 * texture knitted under the trim's box, every fibre of its yarns is checked against its dry-heat
 * limit in the fibre registry (`heatLimitC`). A heat-applied trim without a temperature is flagged
 * too, since it cannot be checked.
 */
export function checkTrimHeat(
  trims: readonly Trim[],
  rasters: ReadonlyMap<string, TextureGrid>,
  textures: ReadonlyMap<string, Texture>,
  yarns: ReadonlyMap<string, Yarn>,
): RuleFinding[] {
  const out: RuleFinding[] = [];
  for (const trim of trims) {
    if (!isHeatApplied(trim)) continue;
    const at = { panelId: trim.panelId, needle: Math.round(trim.box.x), course: Math.round(trim.box.y), trimIds: [trim.id] };
    if (trim.tempC === undefined) {
      out.push({
        rule: 'trim-heat',
        severity: 'warning',
        message: `Trim ${trimLabel(trim)} is applied by ${trim.method} but has no temperature; it cannot be checked against the fabric.`,
        where: at,
      });
      continue;
    }
    const raster = rasters.get(trim.panelId);
    if (!raster) continue;
    const hurt: { fibre: FibreId; limit: number; yarnIds: Set<string>; textureId: string }[] = [];
    for (const textureId of texturesUnderBox(raster, trim.box)) {
      const texture = textures.get(textureId);
      if (!texture) continue;
      for (const yarnId of textureYarnIds(texture)) {
        const yarn = yarns.get(yarnId);
        if (!yarn) continue;
        for (const f of yarn.fibres) {
          const spec: Fibre = fibres[f.fibre];
          if (f.share <= 0 || spec.heatLimitC === undefined || trim.tempC <= spec.heatLimitC) continue;
          const entry = hurt.find((h) => h.fibre === f.fibre);
          if (entry) entry.yarnIds.add(yarnId);
          else hurt.push({ fibre: f.fibre, limit: spec.heatLimitC, yarnIds: new Set([yarnId]), textureId });
        }
      }
    }
    const firstHurt = hurt[0];
    if (!firstHurt) continue;
    out.push({
      rule: 'trim-heat',
      severity: 'error',
      message:
        `Trim ${trimLabel(trim)} is applied at ${trim.tempC} °C over ` +
        `${hurt.map((h) => `${h.fibre} (limit ${h.limit} °C)`).join(', ')}. ` +
        'Lower the temperature, move the trim to a zone without these fibres, or sew it on.',
      where: { ...at, textureId: firstHurt.textureId, yarnIds: [...new Set(hurt.flatMap((h) => [...h.yarnIds]))] },
    });
  }
  return out;
}

/** A second heat application on the same area: two heat-applied trims whose boxes overlap on a panel. */
export function checkTrimReheat(trims: readonly Trim[]): RuleFinding[] {
  const heated = trims.filter(isHeatApplied);
  const out: RuleFinding[] = [];
  for (let i = 0; i < heated.length; i++) {
    for (let j = i + 1; j < heated.length; j++) {
      const p = heated[i];
      const q = heated[j];
      if (!p || !q || p.panelId !== q.panelId || !boxesOverlap(p.box, q.box)) continue;
      out.push({
        rule: 'trim-reheat',
        severity: 'warning',
        message: `Trims ${trimLabel(p)} and ${trimLabel(q)} overlap, so that area is heated twice; the first application and the fabric under it may not take a second press.`,
        where: {
          panelId: p.panelId,
          needle: Math.round(Math.max(p.box.x, q.box.x)),
          course: Math.round(Math.max(p.box.y, q.box.y)),
          trimIds: [p.id, q.id],
        },
      });
    }
  }
  return out;
}
