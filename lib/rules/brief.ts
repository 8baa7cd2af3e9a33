/**
 * Brief vs plan: what the client asked for in the brief, checked against the knit plan as it
 * stands — the label regions its markets need, recycled content, weight, compression, the number
 * of tones and the fibres to avoid. Pure: the caller gathers the plan's figures.
 */
import type { LabelRegion } from '@/lib/knit/content';
import { fibres as fibreRegistry, type FibreId } from '@/lib/knit/fibres';
import { defaultPressureBands, type CompressionLevel, type PressureBand } from '@/lib/fit/compression-target';

export const markets = ['eu', 'uk', 'us', 'ca', 'other'] as const;
export type Market = (typeof markets)[number];

export const marketLabels: Record<Market, string> = {
  eu: 'European Union',
  uk: 'United Kingdom',
  us: 'United States',
  ca: 'Canada',
  other: 'Other markets',
};

/**
 * The label region whose fibre names a market uses: the EU names for the EU and the UK (which
 * kept the EU textile-name rules), the US names for the US; Canada and other markets have rules
 * of their own that this product does not write, so they get no region and a note.
 * Sources: Regulation (EU) No 1007/2011 Annex I; 16 CFR Part 303; the UK and Canada from memory.
 */
export const marketRegion: Record<Market, LabelRegion | null> = { eu: 'eu', uk: 'eu', us: 'us', ca: null, other: null };

export const briefCompressionLevels = ['none', 'mild', 'moderate', 'firm'] as const;
export type BriefCompressionLevel = (typeof briefCompressionLevels)[number];

export interface BriefTargets {
  markets: readonly Market[];
  /** Recycled content target, a fraction of the garment mass (0.5 = 50 %); null when not asked. */
  recycledMin: number | null;
  weight: { unit: 'gsm' | 'garment'; value: number } | null;
  compression: BriefCompressionLevel | null;
  tones: number | null;
  fibresToAvoid: readonly FibreId[];
}

export interface PlanYarn {
  id: string;
  name: string;
  fibres: readonly { fibre: FibreId; share: number }[];
  /** Share of recycled content by mass, 0 to 1; null when the library does not say. */
  recycledShare: number | null;
  /** Grams of this yarn kept in one garment of the base size. */
  keptGrams: number;
}

export interface PlanFigures {
  yarns: readonly PlanYarn[];
  /** The label text per region, when the content could be computed. */
  labels: Partial<Record<LabelRegion, string>> | null;
  /** Garment mass inside the cut lines, base size, g. */
  garmentGrams: number | null;
  /** Garment area inside the cut lines, base size, m². */
  garmentAreaM2: number | null;
  /** Compression estimates of the Fit section (null when there is none). */
  compression: readonly { size: string; girth: string; pressureMmHg: number; slack: boolean }[] | null;
  /** Tones per colourway (its number of target colours). */
  colourways: readonly { name: string; tones: number }[];
}

export type BriefCheckId = 'label-regions' | 'recycled' | 'weight' | 'compression' | 'tones' | 'fibres-to-avoid';
export type BriefCheckStatus = 'ok' | 'warning' | 'error' | 'missing' | 'info';

export interface BriefCheck {
  id: BriefCheckId;
  title: string;
  status: BriefCheckStatus;
  /** What the brief asked for. */
  asked: string;
  /** What the plan gives. */
  plan: string;
  message: string;
}

export interface BriefCheckOptions {
  /** Weight within ± this fraction of the target is on target (default 5 %). Common practice. */
  weightTolerance?: number;
  bands?: Record<CompressionLevel, PressureBand>;
}

const pct = (f: number) => `${(f * 100).toFixed(0)} %`;
const regionNames: Record<LabelRegion, string> = { eu: 'EU fibre names', us: 'US fibre names' };

function labelRegions(brief: BriefTargets, plan: PlanFigures): BriefCheck {
  const asked = brief.markets.map((m) => marketLabels[m]).join(', ') || 'no markets';
  if (brief.markets.length === 0) {
    return { id: 'label-regions', title: 'Markets and label regions', status: 'missing', asked, plan: '—', message: 'The brief names no markets: the label regions are unknown.' };
  }
  const regions = [...new Set(brief.markets.map((m) => marketRegion[m]).filter((r): r is LabelRegion => r !== null))];
  const uncovered = brief.markets.filter((m) => marketRegion[m] === null).map((m) => marketLabels[m]);
  const parts = regions.map((r) => {
    const text = plan.labels?.[r];
    return `${regionNames[r]} (${brief.markets.filter((m) => marketRegion[m] === r).map((m) => marketLabels[m]).join(', ')})${text ? `: ${text}` : ''}`;
  });
  let message = regions.length ? `Labels to write: ${parts.join('; ')}.` : 'No label region of this product covers these markets.';
  if (!plan.labels && regions.length) message += ' The fibre content is not computed yet (body map and yarns).';
  if (uncovered.length) message += ` ${uncovered.join(', ')}: labelling rules of their own; check them before production.`;
  return {
    id: 'label-regions', title: 'Markets and label regions', status: uncovered.length ? 'warning' : 'info', asked,
    plan: regions.map((r) => regionNames[r]).join(', ') || 'none', message,
  };
}

function recycled(brief: BriefTargets, plan: PlanFigures): BriefCheck | null {
  if (brief.recycledMin === null) return null;
  const asked = `at least ${pct(brief.recycledMin)} recycled`;
  const total = plan.yarns.reduce((a, y) => a + y.keptGrams, 0);
  if (!(total > 0)) return { id: 'recycled', title: 'Recycled content', status: 'missing', asked, plan: '—', message: 'No yarn grams yet: draw the body map and feed its textures.' };
  const unknown = plan.yarns.filter((y) => y.keptGrams > 0 && y.recycledShare === null).map((y) => y.name);
  const share = plan.yarns.reduce((a, y) => a + y.keptGrams * (y.recycledShare ?? 0), 0) / total;
  const ok = share + 1e-9 >= brief.recycledMin;
  const notes = unknown.length ? ` No recycled share in the library for ${unknown.join(', ')} (counted as 0).` : '';
  return {
    id: 'recycled', title: 'Recycled content', status: ok ? 'ok' : 'error', asked, plan: `${pct(share)} recycled by mass`,
    message: (ok ? 'The yarns reach the recycled target.' : `The yarns give ${pct(share)}, ${pct(brief.recycledMin - share)} short of the target: use recycled grades of the heaviest yarns.`) + notes,
  };
}

function weight(brief: BriefTargets, plan: PlanFigures, tolerance: number): BriefCheck | null {
  if (!brief.weight) return null;
  const { unit, value } = brief.weight;
  const asked = unit === 'gsm' ? `${value} g/m²` : `${value} g per garment`;
  const actual = unit === 'gsm'
    ? (plan.garmentGrams !== null && plan.garmentAreaM2 ? plan.garmentGrams / plan.garmentAreaM2 : null)
    : plan.garmentGrams;
  if (actual === null) return { id: 'weight', title: 'Weight', status: 'missing', asked, plan: '—', message: 'The garment weight is not computed yet (body map with textures and yarns).' };
  const diff = actual / value - 1;
  const shown = unit === 'gsm' ? `${actual.toFixed(0)} g/m² (garment average)` : `${actual.toFixed(1)} g (base size)`;
  const ok = Math.abs(diff) <= tolerance;
  return {
    id: 'weight', title: 'Weight', status: ok ? 'ok' : 'warning', asked, plan: shown,
    message: ok
      ? `Within ±${pct(tolerance)} of the target.`
      : `${pct(Math.abs(diff))} ${diff > 0 ? 'heavier' : 'lighter'} than the target: ${diff > 0 ? 'open the structures or use finer yarns' : 'use denser structures or heavier yarns'}.`,
  };
}

function compression(brief: BriefTargets, plan: PlanFigures, bands: Record<CompressionLevel, PressureBand>): BriefCheck | null {
  if (brief.compression === null) return null;
  const level = brief.compression;
  if (level === 'none') {
    return { id: 'compression', title: 'Compression', status: 'info', asked: 'no compression', plan: plan.compression?.length ? `${plan.compression.length} estimates` : '—', message: 'The brief asks for no compression.' };
  }
  const band = bands[level];
  const asked = `${level} (${band.minMmHg}–${band.maxMmHg} mmHg)`;
  if (!plan.compression || plan.compression.length === 0) {
    return { id: 'compression', title: 'Compression', status: 'missing', asked, plan: '—', message: 'No compression estimate yet: in Fit, choose a compression texture with a force–extension test and enter body girths.' };
  }
  const off = plan.compression.filter((c) => c.slack || c.pressureMmHg < band.minMmHg || c.pressureMmHg > band.maxMmHg);
  const lo = Math.min(...plan.compression.map((c) => c.pressureMmHg));
  const hi = Math.max(...plan.compression.map((c) => c.pressureMmHg));
  return {
    id: 'compression', title: 'Compression', status: off.length ? 'warning' : 'ok', asked, plan: `${lo.toFixed(1)}–${hi.toFixed(1)} mmHg estimated`,
    message: off.length
      ? `${off.length} of ${plan.compression.length} estimates fall outside the band: ${off.slice(0, 4).map((c) => `size ${c.size} ${c.girth} ${c.slack ? 'slack' : `${c.pressureMmHg.toFixed(1)} mmHg`}`).join(', ')}${off.length > 4 ? ', …' : ''}. An estimate, not a medical rating.`
      : 'Every estimate lies in the band. An estimate, not a medical rating.',
  };
}

function tones(brief: BriefTargets, plan: PlanFigures): BriefCheck | null {
  if (brief.tones === null) return null;
  const asked = `${brief.tones} ${brief.tones === 1 ? 'tone' : 'tones'}`;
  if (plan.colourways.length === 0) return { id: 'tones', title: 'Tones', status: 'missing', asked, plan: '—', message: 'No colourway yet (Colour section).' };
  const off = plan.colourways.filter((c) => c.tones !== brief.tones);
  return {
    id: 'tones', title: 'Tones', status: off.length ? 'warning' : 'ok', asked,
    plan: plan.colourways.map((c) => `${c.name}: ${c.tones}`).join(', '),
    message: off.length
      ? `${off.map((c) => `${c.name} has ${c.tones}`).join('; ')}, the brief asks for ${brief.tones}.`
      : 'Every colourway has the number of tones asked for.',
  };
}

function avoid(brief: BriefTargets, plan: PlanFigures): BriefCheck | null {
  if (brief.fibresToAvoid.length === 0) return null;
  const asked = `no ${brief.fibresToAvoid.map((f) => fibreRegistry[f]?.names.eu ?? f).join(', ')}`;
  const hits = plan.yarns.flatMap((y) =>
    y.fibres.filter((f) => f.share > 0 && brief.fibresToAvoid.includes(f.fibre)).map((f) => `${y.name} (${fibreRegistry[f.fibre]?.names.eu ?? f.fibre})`),
  );
  return {
    id: 'fibres-to-avoid', title: 'Fibres to avoid', status: hits.length ? 'error' : 'ok', asked,
    plan: hits.length ? hits.join(', ') : 'none of them used',
    message: hits.length ? `The plan uses fibres the brief rules out: ${hits.join(', ')}.` : 'No yarn of the plan contains them.',
  };
}

/**
 * Checks the plan against the brief. Returns one check per target the brief sets (the label
 * regions always), in a fixed order.
 */
export function checkBriefAgainstPlan(brief: BriefTargets, plan: PlanFigures, opts: BriefCheckOptions = {}): BriefCheck[] {
  const out = [
    labelRegions(brief, plan),
    recycled(brief, plan),
    weight(brief, plan, opts.weightTolerance ?? 0.05),
    compression(brief, plan, opts.bands ?? defaultPressureBands),
    tones(brief, plan),
    avoid(brief, plan),
  ];
  return out.filter((c): c is BriefCheck => c !== null);
}
