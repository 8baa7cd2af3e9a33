import type { Knex } from 'knex';
import { db } from './knex';
import type { SessionUser } from './users';
import { findStyle, type Style } from './styles';
import { loadBodyMap } from './body-map';
import { findTexture, listStyleTextures, yarnsOfTextures, type LibraryTexture } from './textures';
import { yarnForViewer, type LibraryYarn } from './yarns';
import { listTrims } from './trims';
import { loadFit } from './fit';
import { HttpError, notFound } from '@/lib/api/errors';
import { isOutsideRole } from '@/lib/auth/roles';
import { resolveValues } from '@/lib/fit/grading';
import type { Panel } from '@/lib/knit/panel';
import { isHeatApplied } from '@/lib/rules/trim';
import { orderTable, yarnCalculator, type GradedPoints, type YarnCalculatorFigures } from '@/lib/knit/yarn-calculator';
import { csv } from '@/lib/mill/csv';
import type { YarnCalculatorQuery } from '@/lib/validations/yarn-calculator';

/** What the calculator is computed from: one read of the style. */
export interface YarnCalculatorSource {
  style: Pick<Style, 'id' | 'code' | 'name' | 'garmentType' | 'construction' | 'version'> & { gauge: number; sizes: string[]; baseSize: string };
  panels: Panel[];
  /** True when no body map is saved and the panels are generated from the style. */
  generated: boolean;
  textures: LibraryTexture[];
  /** The yarns the textures feed; `pricePerKg` is null for mill and client accounts. */
  yarns: LibraryYarn[];
  graded: GradedPoints | null;
  /** Whether the style has a heat-applied trim (care: do not iron on it). */
  heatTransfer: boolean;
  /** Whether the viewer may see prices and costs (studio accounts). */
  showPrices: boolean;
  /** Why a part could not be read, in words. */
  notes: string[];
}

/** The graded size spec of the Fit section (point → size → cm), or null when none is saved. */
async function gradedSpec(user: SessionUser, styleId: string, q: Knex): Promise<{ graded: GradedPoints | null; note?: string }> {
  try {
    const doc = await loadFit(user, styleId, q);
    if (!doc.saved) return { graded: null };
    return { graded: resolveValues(doc.spec.points, doc.sizes, doc.spec.baseSize) };
  } catch (err) {
    if (err instanceof HttpError) throw err;
    console.error('Yarn calculator: the size spec could not be read', err);
    return { graded: null, note: 'The size spec could not be read just now; sizes other than the base size use its grams.' };
  }
}

/**
 * Everything the yarn calculator needs for one style the user can see: the saved body map (or the
 * generated panels), the textures it uses and their yarns (prices only for studio accounts), the
 * graded size spec, and whether a trim is heat-applied. Null when the style is not visible.
 */
export async function loadYarnCalculatorSource(user: SessionUser, styleId: string, q: Knex = db()): Promise<YarnCalculatorSource | null> {
  const style = await findStyle(user, styleId, q);
  if (!style) return null;
  const [map, styleTextures, trims, spec] = await Promise.all([
    loadBodyMap(user, styleId, q),
    listStyleTextures(user, styleId, q),
    listTrims(user, styleId, q),
    gradedSpec(user, styleId, q),
  ]);
  const panels = map?.panels ?? [];
  const textures = [...styleTextures.textures];
  const known = new Set(textures.map((t) => t.id));
  for (const id of new Set(panels.flatMap((p) => [p.baseTextureId, ...p.zones.map((z) => z.textureId)]))) {
    if (!id || known.has(id)) continue;
    const t = await findTexture(user, id, q);
    if (t) {
      textures.push(t);
      known.add(id);
    }
  }
  const yarns = (await yarnsOfTextures(user.studioId, textures, q)).map((y) => yarnForViewer(user, y));
  const heatTransfer = trims.some((t) => isHeatApplied({ id: t.id, panelId: '', kind: t.kind, method: t.method, box: t.box }));
  return {
    style: {
      id: style.id, code: style.code, name: style.name, garmentType: style.garmentType, construction: style.construction,
      version: style.version, gauge: style.machine.gauge, sizes: style.sizes.labels, baseSize: style.sizes.base,
    },
    panels,
    generated: map?.generated ?? true,
    textures,
    yarns,
    graded: spec.graded,
    heatTransfer,
    showPrices: !isOutsideRole(user.role),
    notes: spec.note ? [spec.note] : [],
  };
}

/** Prices per kg by yarn id, for the accounts that may see them. */
export function pricesOf(src: YarnCalculatorSource): Record<string, number> | undefined {
  if (!src.showPrices) return undefined;
  const out: Record<string, number> = {};
  for (const y of src.yarns) if (y.pricePerKg !== null) out[y.id] = y.pricePerKg;
  return out;
}

/** The calculator's figures for the options of a request. Garments for sizes the style lacks are a 400. */
export function computeYarnCalculator(src: YarnCalculatorSource, query: YarnCalculatorQuery): YarnCalculatorFigures {
  const unknown = Object.keys(query.qty).filter((s) => !src.style.sizes.includes(s));
  if (unknown.length > 0) {
    throw new HttpError(400, 'Some fields need attention.', {
      fieldErrors: { qty: [`The style has no size ${unknown.join(', ')} (its sizes: ${src.style.sizes.join(', ')})`] },
    });
  }
  const prices = pricesOf(src);
  const { figures } = yarnCalculator({
    panels: src.panels,
    textures: new Map(src.textures.map((t) => [t.id, t])),
    yarns: src.yarns,
    gauge: src.style.gauge,
    garment: src.style.garmentType,
    sizes: src.style.sizes,
    baseSize: src.style.baseSize,
    graded: src.graded,
    wasteAllowance: query.waste / 100,
    method: query.method,
    garments: query.qty,
    heatTransfer: src.heatTransfer,
    ...(prices ? { pricesPerKg: prices } : {}),
  });
  return figures;
}

/** The calculator as the API answers it: the figures with the names they refer to. */
export async function yarnCalculatorFor(user: SessionUser, styleId: string, query: YarnCalculatorQuery, q: Knex = db()) {
  const src = await loadYarnCalculatorSource(user, styleId, q);
  if (!src) throw notFound('Style not found.');
  const figures = computeYarnCalculator(src, query);
  return {
    style: src.style,
    generated: src.generated,
    notes: src.notes,
    textures: src.textures.map((t) => ({ id: t.id, name: t.name })),
    yarns: src.yarns.map((y) => ({
      id: y.id, name: y.name, supplierRef: y.supplierRef, dtex: y.dtex,
      ...(src.showPrices ? { pricePerKg: y.pricePerKg } : {}),
    })),
    figures,
  };
}

/** The run's order as CSV (RFC 4180), named after the style code. */
export async function yarnOrderCsv(user: SessionUser, styleId: string, query: YarnCalculatorQuery, q: Knex = db()): Promise<{ fileName: string; body: string }> {
  const src = await loadYarnCalculatorSource(user, styleId, q);
  if (!src) throw notFound('Style not found.');
  const figures = computeYarnCalculator(src, query);
  const rows = orderTable(
    figures,
    src.yarns.map((y) => ({ id: y.id, name: y.name, supplierRef: y.supplierRef, dtex: y.dtex, pricePerKg: src.showPrices ? y.pricePerKg : null })),
    { withPrices: src.showPrices },
  );
  const safeCode = src.style.code.replace(/[^A-Za-z0-9._-]+/g, '-');
  return { fileName: `${safeCode}-yarn-order.csv`, body: csv(rows) };
}
