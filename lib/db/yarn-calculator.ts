import type { Knex } from 'knex';
import { db } from './knex';
import type { SessionUser } from './users';
import { findStyleStamped, type Style } from './styles';
import type { LibraryTexture } from './textures';
import { yarnForViewer, type LibraryYarn } from './yarns';
import { gradedSizeSpec } from './fit';
import { loadStyleParts } from './style-parts';
import { DataCache } from './data-cache';
import { HttpError, notFound } from '@/lib/api/errors';
import { isOutsideRole } from '@/lib/auth/roles';
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
async function gradedSpec(style: Style, q: Knex): Promise<{ graded: GradedPoints | null; note?: string }> {
  try {
    return { graded: (await gradedSizeSpec(style, q))?.values ?? null };
  } catch (err) {
    if (err instanceof HttpError) throw err;
    console.error('Yarn calculator: the size spec could not be read', err);
    return { graded: null, note: 'The size spec could not be read just now; sizes other than the base size use its grams.' };
  }
}

/** Reads the source of a style the caller has already read. */
async function readSource(user: SessionUser, style: Style, q: Knex): Promise<YarnCalculatorSource> {
  const [parts, spec] = await Promise.all([loadStyleParts(user, style, q), gradedSpec(style, q)]);
  const heatTransfer = parts.trims.some((t) => isHeatApplied({ id: t.id, panelId: '', kind: t.kind, method: t.method, box: t.box }));
  return {
    style: {
      id: style.id, code: style.code, name: style.name, garmentType: style.garmentType, construction: style.construction,
      version: style.version, gauge: style.machine.gauge, sizes: style.sizes.labels, baseSize: style.sizes.base,
    },
    panels: parts.map.panels,
    generated: parts.map.generated,
    textures: parts.textures,
    yarns: parts.yarns.map((y) => yarnForViewer(user, y)),
    graded: spec.graded,
    heatTransfer,
    showPrices: !isOutsideRole(user.role),
    notes: spec.note ? [spec.note] : [],
  };
}

// Per process, keyed by the style's data stamp (lib/db/data-cache.ts), bounded by count and by the
// length of their JSON (a source is some 10–50 KB of it, a map at the panel limits several MB; an
// answer, figures and names, some 20 KB).
const jsonLength = (v: unknown) => JSON.stringify(v).length;
const sources = new DataCache<YarnCalculatorSource>({
  maxEntries: 200, maxBytes: 16 * 1024 * 1024, sizeOf: jsonLength, keepIf: (src) => src.notes.length === 0,
});
const answers = new DataCache<YarnCalculatorAnswer>({ maxEntries: 400, maxBytes: 16 * 1024 * 1024, sizeOf: jsonLength });

/** Cached values are shared between requests: read inside a transaction, the data may yet be rolled back. */
const cacheable = (q: Knex) => !(q as Knex.Transaction).isTransaction;

/** The source and its cache key, for one style the user can see; null when not visible. */
async function sourceFor(user: SessionUser, styleId: string, q: Knex): Promise<{ key: string; src: YarnCalculatorSource } | null> {
  const found = await findStyleStamped(user, styleId, q);
  if (!found) return null;
  const key = `${found.style.id}|${isOutsideRole(user.role) ? 'outside' : 'studio'}|${found.stamp}`;
  const src = cacheable(q) ? await sources.get(key, () => readSource(user, found.style, q)) : await readSource(user, found.style, q);
  return { key, src };
}

/**
 * Everything the yarn calculator needs for one style the user can see: the saved body map (or the
 * generated panels), the textures it uses and their yarns (prices only for studio accounts), the
 * graded size spec, and whether a trim is heat-applied. Null when the style is not visible. Kept
 * per process until the style's data changes (`findStyleStamped`).
 */
export async function loadYarnCalculatorSource(user: SessionUser, styleId: string, q: Knex = db()): Promise<YarnCalculatorSource | null> {
  return (await sourceFor(user, styleId, q))?.src ?? null;
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

/** The calculator's figures with the names of the textures and yarns they refer to. */
export interface YarnCalculatorAnswer {
  style: YarnCalculatorSource['style'];
  generated: boolean;
  notes: string[];
  textures: { id: string; name: string }[];
  yarns: { id: string; name: string; supplierRef: string; dtex: number; pricePerKg?: number | null }[];
  figures: YarnCalculatorFigures;
}

function answerOf(src: YarnCalculatorSource, query: YarnCalculatorQuery): YarnCalculatorAnswer {
  return {
    style: src.style,
    generated: src.generated,
    notes: src.notes,
    textures: src.textures.map((t) => ({ id: t.id, name: t.name })),
    yarns: src.yarns.map((y) => ({
      id: y.id, name: y.name, supplierRef: y.supplierRef, dtex: y.dtex,
      ...(src.showPrices ? { pricePerKg: y.pricePerKg } : {}),
    })),
    figures: computeYarnCalculator(src, query),
  };
}

/** The options of a request as a key: garments by size in sorted order. */
function queryKey(query: YarnCalculatorQuery): string {
  return JSON.stringify([query.waste, query.method, Object.entries(query.qty).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0))]);
}

/**
 * The calculator as the API answers it: the figures for the options of a request, with the names
 * they refer to. Kept per process like the source, per set of options.
 */
export async function yarnCalculatorFor(user: SessionUser, styleId: string, query: YarnCalculatorQuery, q: Knex = db()): Promise<YarnCalculatorAnswer> {
  const found = await sourceFor(user, styleId, q);
  if (!found) throw notFound('Style not found.');
  const { key, src } = found;
  if (!cacheable(q) || src.notes.length > 0) return answerOf(src, query);
  return answers.get(`${key}|${queryKey(query)}`, async () => answerOf(src, query));
}

/** The run's order as CSV (RFC 4180), named after the style code. */
export async function yarnOrderCsv(user: SessionUser, styleId: string, query: YarnCalculatorQuery, q: Knex = db()): Promise<{ fileName: string; body: string }> {
  const { style, yarns, figures } = await yarnCalculatorFor(user, styleId, query, q);
  const showPrices = !isOutsideRole(user.role);
  const rows = orderTable(
    figures,
    yarns.map((y) => ({ id: y.id, name: y.name, supplierRef: y.supplierRef, dtex: y.dtex, pricePerKg: showPrices ? (y.pricePerKg ?? null) : null })),
    { withPrices: showPrices },
  );
  const safeCode = style.code.replace(/[^A-Za-z0-9._-]+/g, '-');
  return { fileName: `${safeCode}-yarn-order.csv`, body: csv(rows) };
}
