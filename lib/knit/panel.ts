/**
 * Panels and zones in stitch space.
 *
 * Stitch space: x counts needles from the panel's left edge, y counts courses from the panel's
 * top edge (row 0 is the top of the drawing). A point may sit between stitches (fractions are
 * allowed while editing); the raster samples stitch centres at (i + 0.5, j + 0.5).
 *
 * The optional `space` brand keeps stitch points and screen points apart in the type system:
 * a `StitchPoint` cannot be passed where a `ScreenPoint` is expected, yet plain `{ x, y }`
 * literals are accepted by either.
 */
export interface StitchPoint {
  readonly space?: 'stitch';
  x: number;
  y: number;
}

/** A point in stage pixels (the editor's view layer). */
export interface ScreenPoint {
  readonly space?: 'screen';
  x: number;
  y: number;
}

/** A closed polygon in stitch space; the last vertex connects back to the first. */
export type StitchPolygon = StitchPoint[];

/**
 * Largest body map the product keeps: a wide body-size cylinder and a long garment, and what one
 * panel may hold. The save route refuses more; the editor stops the designer before that.
 */
export const panelLimits = { maxNeedles: 4000, maxCourses: 8000, maxVertices: 400, maxZonesPerPanel: 200, maxPanels: 8 } as const;

export const zoneFunctions = [
  'compression',
  'ventilation',
  'support',
  'colour-block',
  'hem',
  'trim-area',
] as const;
export type ZoneFunction = (typeof zoneFunctions)[number];

export interface Zone {
  id: string;
  name: string;
  /** Texture id from the studio library. */
  textureId: string;
  fn: ZoneFunction;
  /** Stacking order: higher draws over lower. */
  order: number;
  polygon: StitchPolygon;
}

export const panelKinds = ['front', 'back', 'sleeve-left', 'sleeve-right', 'leg-left', 'leg-right'] as const;
export type PanelKind = (typeof panelKinds)[number];

export interface Panel {
  id: string;
  name: string;
  kind: PanelKind;
  /** Panel width in needles (a seamless body panel is half the cylinder's needles). */
  widthNeedles: number;
  /** Panel height in courses. */
  heightCourses: number;
  /** What the machine knits: a rectangle for a tube, the fashioned outline for flat knitting. */
  knittedArea: StitchPolygon;
  /** The garment part kept after cutting (neckline, armholes, shoulders); inside = garment. */
  cutOutline: StitchPolygon;
  /** Texture that fills whatever no zone covers. */
  baseTextureId: string;
  zones: Zone[];
}

/** The knitted area of a tube panel: the full rectangle. */
export function rectanglePolygon(widthNeedles: number, heightCourses: number): StitchPolygon {
  return [
    { x: 0, y: 0 },
    { x: widthNeedles, y: 0 },
    { x: widthNeedles, y: heightCourses },
    { x: 0, y: heightCourses },
  ];
}

export const zoneFunctionLabels: Record<ZoneFunction, string> = {
  compression: 'Compression',
  ventilation: 'Ventilation',
  support: 'Support',
  'colour-block': 'Colour block',
  hem: 'Hem',
  'trim-area': 'Trim area',
};
