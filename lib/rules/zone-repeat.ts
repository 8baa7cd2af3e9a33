import type { RuleFinding } from './types';
import { usageLabel, usageWhere, type TextureUsage } from './usage';

const onLattice = (value: number, period: number) => Math.abs(value / period - Math.round(value / period)) < 1e-9;

/**
 * A zone narrower (or shorter) than one repeat of its texture, or one whose edges do not fall on
 * the texture's repeat lattice (counted from the panel's top-left corner, as the raster tiles), so
 * it starts or ends on a partial repeat. Checked on the zone's bounding box, clipped to the panel;
 * an edge on the panel's own edge counts as whole.
 */
export function checkZoneRepeats(usages: readonly TextureUsage[]): RuleFinding[] {
  const out: RuleFinding[] = [];
  for (const u of usages) {
    if (!u.zone || !u.texture) continue;
    const { needles, courses } = u.texture.repeat;
    const { minX, minY, maxX, maxY } = u.bounds;
    const width = maxX - minX;
    const height = maxY - minY;
    if (width < needles || height < courses) {
      out.push({
        rule: 'zone-repeat',
        severity: 'warning',
        message: `${usageLabel(u)} is ${Math.round(width)} × ${Math.round(height)} stitches, smaller than one ${needles} × ${courses} repeat of ${u.texture.name}: the structure will not show.`,
        where: { ...usageWhere(u), needle: Math.round(minX), course: Math.round(minY) },
      });
      continue;
    }
    const edges: { at: number; period: number; panelEdge: boolean; axis: 'needle' | 'course' }[] = [
      { at: minX, period: needles, panelEdge: minX === 0, axis: 'needle' },
      { at: maxX, period: needles, panelEdge: maxX === u.panel.widthNeedles, axis: 'needle' },
      { at: minY, period: courses, panelEdge: minY === 0, axis: 'course' },
      { at: maxY, period: courses, panelEdge: maxY === u.panel.heightCourses, axis: 'course' },
    ];
    const partial = edges.find((e) => !e.panelEdge && !onLattice(e.at, e.period));
    if (!partial) continue;
    out.push({
      rule: 'zone-repeat',
      severity: 'info',
      message: `${usageLabel(u)} ends on a partial repeat of ${u.texture.name} (an edge at ${partial.axis} ${Math.round(partial.at)} is not on the ${needles} × ${courses} repeat); snap it to whole repeats.`,
      where: {
        ...usageWhere(u),
        ...(partial.axis === 'needle'
          ? { needle: Math.round(partial.at), course: Math.round(minY) }
          : { needle: Math.round(minX), course: Math.round(partial.at) }),
      },
    });
  }
  return out;
}
