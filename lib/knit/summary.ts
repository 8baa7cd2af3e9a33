/**
 * The body map's live summary: everything the side panel shows after an edit, computed in one pass
 * from the panels — the stitch rasters, stitches and area per texture inside and outside the cut
 * lines, grams per yarn for one garment, the fibre content and its label texts.
 */
import { garmentConsumption, keptYarnGrams, type GarmentConsumption } from './consumption';
import { contentLabel, fibreContent, type ContentLabel, type ContentMethod, type FibreShares } from './content';
import type { Panel } from './panel';
import { rasterizePanel, type PanelRaster } from './raster';
import type { Texture } from './texture';
import type { Yarn } from './yarn';

export interface TextureTotals {
  textureId: string;
  inside: number;
  outside: number;
  /** Relaxed fabric area of those stitches, cm² (stitches ÷ (wales/cm × courses/cm)). */
  insideCm2: number;
  outsideCm2: number;
}

export interface BodyMapSummary {
  rasters: Map<string, PanelRaster>;
  textures: TextureTotals[];
  consumption: GarmentConsumption | null;
  content: FibreShares | null;
  labels: { eu: ContentLabel; us: ContentLabel } | null;
  /** Why grams or content could not be computed (a texture or yarn missing), in words. */
  problems: string[];
}

export interface SummaryInput {
  panels: readonly Panel[];
  textures: ReadonlyMap<string, Texture>;
  yarns: readonly Yarn[];
  /** Needles per inch. */
  gauge: number;
  /** Fraction added to the knitted grams (0.05 = 5 %). */
  wasteAllowance?: number;
  method?: ContentMethod;
  /** Rasters of unchanged panels from the previous summary, reused by identity of the panel. */
  previous?: { panels: readonly Panel[]; rasters: Map<string, PanelRaster> };
}

/** Stitches per cm² of a texture: wales/cm × courses/cm (product design §4). */
function stitchesPerCm2(t: Texture): number {
  return t.density.walesPerCm * t.density.coursesPerCm;
}

/**
 * Computes the summary. Panels whose object is unchanged since `previous` keep their raster, so a
 * drag on one panel redraws only that one.
 */
export function summariseBodyMap(input: SummaryInput): BodyMapSummary {
  const rasters = new Map<string, PanelRaster>();
  const reusable = new Map<string, PanelRaster>();
  if (input.previous) {
    input.previous.panels.forEach((p) => {
      const r = input.previous!.rasters.get(p.id);
      if (r) reusable.set(p.id, r);
    });
  }
  const prevPanels = new Set(input.previous?.panels ?? []);
  for (const panel of input.panels) {
    const r = prevPanels.has(panel) ? reusable.get(panel.id) : undefined;
    rasters.set(panel.id, r ?? rasterizePanel(panel));
  }

  const totals = new Map<string, TextureTotals>();
  for (const r of rasters.values()) {
    for (const [textureId, c] of Object.entries(r.stitches)) {
      if (!textureId) continue;
      const t = totals.get(textureId) ?? { textureId, inside: 0, outside: 0, insideCm2: 0, outsideCm2: 0 };
      t.inside += c.inside;
      t.outside += c.outside;
      totals.set(textureId, t);
    }
  }
  const problems: string[] = [];
  for (const t of totals.values()) {
    const texture = input.textures.get(t.textureId);
    if (!texture) {
      problems.push(`A zone uses a texture that is not in the library (${t.textureId}).`);
      continue;
    }
    t.insideCm2 = t.inside / stitchesPerCm2(texture);
    t.outsideCm2 = t.outside / stitchesPerCm2(texture);
  }

  let consumption: GarmentConsumption | null = null;
  let content: FibreShares | null = null;
  let labels: BodyMapSummary['labels'] = null;
  if (problems.length === 0 && totals.size > 0) {
    try {
      consumption = garmentConsumption({
        panels: [...rasters.values()],
        textures: input.textures,
        yarns: input.yarns,
        gauge: input.gauge,
        wasteAllowance: input.wasteAllowance ?? 0.05,
      });
      content = fibreContent({ yarnGrams: keptYarnGrams(consumption), yarns: input.yarns, method: input.method ?? 'nominal' });
      labels = { eu: contentLabel(content, 'eu'), us: contentLabel(content, 'us') };
    } catch (err) {
      problems.push(err instanceof Error ? err.message : String(err));
    }
  }
  return {
    rasters,
    textures: [...totals.values()].sort((a, b) => b.inside + b.outside - (a.inside + a.outside)),
    consumption,
    content,
    labels,
    problems,
  };
}
