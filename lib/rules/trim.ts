/**
 * Trims: branding and label elements placed on a panel (product design, "Trim").
 */

export const trimKinds = ['heat-transfer', 'woven-label', 'printed-tag', 'care-label'] as const;
export type TrimKind = (typeof trimKinds)[number];

/** How a trim is applied. `heat-press` and `bonded` apply heat to the fabric under the trim. */
export const trimMethods = ['heat-press', 'bonded', 'sewn', 'printed'] as const;
export type TrimMethod = (typeof trimMethods)[number];

/** An axis-aligned box in stitch space: needles from the panel's left edge, courses from its top. */
export interface StitchBox {
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface Trim {
  id: string;
  panelId: string;
  kind: TrimKind;
  method: TrimMethod;
  /** Application temperature at the fabric, °C (heat-applied methods). */
  tempC?: number;
  box: StitchBox;
}

/** Whether applying the trim heats the fabric under it. */
export function isHeatApplied(trim: Trim): boolean {
  switch (trim.method) {
    case 'heat-press':
    case 'bonded':
      return true;
    case 'sewn':
    case 'printed':
      return false;
  }
}

/** Whether two boxes share any area (touching edges do not count). */
export function boxesOverlap(p: StitchBox, q: StitchBox): boolean {
  return p.x < q.x + q.width && q.x < p.x + p.width && p.y < q.y + q.height && q.y < p.y + p.height;
}
