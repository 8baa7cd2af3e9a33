/**
 * Trims: branding and label elements placed on a panel (product design, "Trim"). A knitted logo is
 * knitted into the fabric where it sits (method `knitted`); its finest detail is checked against
 * the stitch it must be drawn with.
 */

export const trimKinds = ['heat-transfer', 'woven-label', 'printed-tag', 'care-label', 'knitted-logo'] as const;
export type TrimKind = (typeof trimKinds)[number];

/** How a trim is applied. `heat-press` and `bonded` apply heat to the fabric under the trim. */
export const trimMethods = ['heat-press', 'bonded', 'sewn', 'printed', 'knitted'] as const;
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
  /** What the designer called it (e.g. "Chest logo"); findings name the trim by it. */
  name?: string;
  panelId: string;
  kind: TrimKind;
  method: TrimMethod;
  /** Application temperature at the fabric, °C (heat-applied methods). */
  tempC?: number;
  /** Knitted logo: the finest line or gap of the artwork, mm. */
  detailMm?: number;
  box: StitchBox;
}

const kindWords: Record<TrimKind, string> = {
  'heat-transfer': 'heat transfer',
  'woven-label': 'woven label',
  'printed-tag': 'printed tag',
  'care-label': 'care label',
  'knitted-logo': 'knitted logo',
};

/** How findings name a trim: its name and kind ("Chest logo (heat transfer)"), else the kind and id. */
export function trimLabel(trim: Pick<Trim, 'id' | 'name' | 'kind'>): string {
  const name = trim.name?.trim();
  return name ? `${name} (${kindWords[trim.kind]})` : `${kindWords[trim.kind]} ${trim.id}`;
}

/** Whether applying the trim heats the fabric under it. */
export function isHeatApplied(trim: Trim): boolean {
  switch (trim.method) {
    case 'heat-press':
    case 'bonded':
      return true;
    case 'sewn':
    case 'printed':
    case 'knitted':
      return false;
  }
}

/** Whether two boxes share any area (touching edges do not count). */
export function boxesOverlap(p: StitchBox, q: StitchBox): boolean {
  return p.x < q.x + q.width && q.x < p.x + p.width && p.y < q.y + q.height && q.y < p.y + p.height;
}
