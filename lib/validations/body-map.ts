import { z } from 'zod';
import { panelKinds, panelLimits, zoneFunctions } from '@/lib/knit/panel';
import { isSimplePolygon } from '@/lib/knit/raster';

export { panelLimits };

/** The largest body-map save the route reads (a busy map of 8 panels is well under 1 MB as JSON). */
export const bodyMapMaxBytes = 4 * 1024 * 1024;

const point = z.object({ x: z.number().finite(), y: z.number().finite() });

const polygon = z
  .array(point)
  .min(3, 'A polygon needs at least 3 points')
  .max(panelLimits.maxVertices, `At most ${panelLimits.maxVertices} points`)
  .refine(isSimplePolygon, 'Edges must not cross (self-intersecting polygon)');

const zone = z.object({
  id: z.string().uuid(),
  name: z.string().trim().min(1, 'Name the zone').max(80),
  textureId: z.string().uuid('Assign a texture from the studio library'),
  fn: z.enum(zoneFunctions),
  order: z.number().int(),
  polygon,
});

function inside(poly: { x: number; y: number }[], w: number, h: number) {
  return poly.every((p) => p.x >= 0 && p.y >= 0 && p.x <= w && p.y <= h);
}

const panel = z
  .object({
    id: z.string().uuid(),
    name: z.string().trim().min(1).max(60),
    kind: z.enum(panelKinds),
    widthNeedles: z.number().int().min(8).max(panelLimits.maxNeedles),
    heightCourses: z.number().int().min(8).max(panelLimits.maxCourses),
    knittedArea: polygon,
    cutOutline: polygon,
    baseTextureId: z.string().uuid('Choose the base texture'),
    zones: z.array(zone).max(panelLimits.maxZonesPerPanel),
  })
  .superRefine((p, ctx) => {
    const { widthNeedles: w, heightCourses: h } = p;
    if (!inside(p.knittedArea, w, h)) ctx.addIssue({ code: 'custom', path: ['knittedArea'], message: 'The knitted area must lie inside the panel' });
    if (!inside(p.cutOutline, w, h)) ctx.addIssue({ code: 'custom', path: ['cutOutline'], message: 'The cut lines must lie inside the panel' });
    p.zones.forEach((z, i) => {
      if (!inside(z.polygon, w, h)) ctx.addIssue({ code: 'custom', path: ['zones', i, 'polygon'], message: `Zone "${z.name}" reaches outside the panel` });
    });
  });

export const bodyMapSaveSchema = z
  .object({
    version: z.number().int().positive('The version you edited is required'),
    panels: z.array(panel).min(1).max(panelLimits.maxPanels),
  })
  .superRefine((m, ctx) => {
    const kinds = new Set<string>();
    const ids = new Set<string>();
    m.panels.forEach((p, i) => {
      if (kinds.has(p.kind)) ctx.addIssue({ code: 'custom', path: ['panels', i, 'kind'], message: `Two ${p.kind} panels` });
      kinds.add(p.kind);
      for (const id of [p.id, ...p.zones.map((z) => z.id)]) {
        if (ids.has(id)) ctx.addIssue({ code: 'custom', path: ['panels', i], message: `Duplicate id ${id}` });
        ids.add(id);
      }
    });
  });
export type BodyMapSave = z.infer<typeof bodyMapSaveSchema>;
