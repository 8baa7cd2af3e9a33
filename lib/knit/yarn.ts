/**
 * Yarns as bought: linear density in dtex, fibre make-up and colour state.
 */
import { fibres, isFibreId, type FibreId } from './fibres';

/** A CIELAB colour (D65 / 10°). */
export interface LabColour {
  L: number;
  a: number;
  b: number;
}

export type YarnColour =
  | { state: 'dyeable' }
  | { state: 'dope-dyed'; lab: LabColour }
  | { state: 'yarn-dyed'; lab: LabColour };

export interface YarnFibre {
  fibre: FibreId;
  /** Mass fraction of the yarn, 0–1. */
  share: number;
  /** Staple (discontinuous) rather than filament; overrides `Yarn.staple` for this fibre. */
  staple?: boolean;
}

export interface Yarn {
  id: string;
  name: string;
  /** Linear density as bought (resultant, for folded yarns), dtex. */
  dtex: number;
  /** Fibre make-up by mass; shares sum to 1. */
  fibres: YarnFibre[];
  colour: YarnColour;
  /** Spun from staple fibre (matters for the EU allowance of polyamide). Filament if absent. */
  staple?: boolean;
  filaments?: number;
}

/** Tolerance used when checking that fibre shares sum to 1. */
export const SHARE_SUM_TOLERANCE = 1e-9;

/** True when the shares are all in [0, 1] and sum to 1 (within `tolerance`). */
export function sharesSumToOne(
  shares: readonly { share: number }[],
  tolerance = SHARE_SUM_TOLERANCE,
): boolean {
  let sum = 0;
  for (const s of shares) {
    if (!Number.isFinite(s.share) || s.share < 0 || s.share > 1) return false;
    sum += s.share;
  }
  return Math.abs(sum - 1) <= tolerance;
}

/**
 * Problems with a yarn record, as sentences; an empty list means the yarn is valid.
 * Checks: positive dtex, known fibres, no fibre twice, shares in [0, 1] summing to 1, a colour for
 * dope-dyed and yarn-dyed yarns, no piece-dyeing for a fibre that can only be dope-dyed.
 */
export function validateYarn(yarn: Yarn, tolerance = SHARE_SUM_TOLERANCE): string[] {
  const problems: string[] = [];
  if (!Number.isFinite(yarn.dtex) || yarn.dtex <= 0) {
    problems.push(`Yarn ${yarn.name}: linear density must be a positive dtex (got ${yarn.dtex}).`);
  }
  if (yarn.fibres.length === 0) problems.push(`Yarn ${yarn.name}: has no fibres.`);
  const seen = new Set<string>();
  for (const f of yarn.fibres) {
    if (!isFibreId(f.fibre)) problems.push(`Yarn ${yarn.name}: unknown fibre "${f.fibre}".`);
    if (seen.has(f.fibre)) problems.push(`Yarn ${yarn.name}: fibre ${f.fibre} is listed twice.`);
    seen.add(f.fibre);
    if (!Number.isFinite(f.share) || f.share < 0 || f.share > 1) {
      problems.push(`Yarn ${yarn.name}: share of ${f.fibre} must be between 0 and 1 (got ${f.share}).`);
    }
  }
  const sum = yarn.fibres.reduce((s, f) => s + f.share, 0);
  if (yarn.fibres.length > 0 && Math.abs(sum - 1) > tolerance) {
    problems.push(`Yarn ${yarn.name}: fibre shares sum to ${Number(sum.toPrecision(9))}, not 1.`);
  }
  if (yarn.colour.state === 'dyeable') {
    const undyeable = yarn.fibres.filter((f) => isFibreId(f.fibre) && fibres[f.fibre].dopeDyedOnly && f.share > 0);
    for (const f of undyeable) {
      problems.push(`Yarn ${yarn.name}: ${f.fibre} cannot be piece-dyed; mark the yarn dope-dyed with its colour.`);
    }
  }
  return problems;
}

/** Throws when `validateYarn` finds problems. */
export function assertValidYarn(yarn: Yarn): void {
  const problems = validateYarn(yarn);
  if (problems.length > 0) throw new Error(problems.join(' '));
}

export interface CoreSpec {
  fibre: FibreId;
  /** Core yarn as bought, dtex. */
  dtex: number;
  /** Draft of the core while it is covered (e.g. 3.0): its length in the covered yarn ÷ package length. */
  draft: number;
}

export interface CoverSpec {
  fibre: FibreId;
  /** Cover yarn as bought, dtex. */
  dtex: number;
  /** Extra cover length per unit of covered yarn from wrapping, fraction (0.1 = 10 %). */
  takeUp: number;
  staple?: boolean;
}

export interface CoveredYarnMakeUp {
  /** Effective linear density of the covered yarn, dtex. */
  dtex: number;
  /** Core's contribution, dtex (core dtex ÷ draft). */
  coreDtex: number;
  /** Covers' contribution, dtex (Σ cover dtex × (1 + take-up)). */
  coverDtex: number;
  /** Fibre shares by mass, summing to 1 (a fibre in both core and cover appears once). */
  fibres: YarnFibre[];
}

/**
 * The make-up of a covered yarn: an elastane core drafted inside one or more cover yarns.
 * Core contributes dtex ÷ draft, each cover dtex × (1 + take-up) per unit length of covered yarn
 * (product design §2). Pass an array of covers for a double-covered yarn.
 */
export function coveredYarn(core: CoreSpec, cover: CoverSpec | readonly CoverSpec[]): CoveredYarnMakeUp {
  if (!(core.dtex > 0) || !(core.draft >= 1)) {
    throw new RangeError(`Core needs dtex > 0 and draft ≥ 1 (got ${core.dtex} dtex, draft ${core.draft}).`);
  }
  const covers = Array.isArray(cover) ? (cover as readonly CoverSpec[]) : [cover as CoverSpec];
  if (covers.length === 0) throw new RangeError('A covered yarn needs at least one cover.');
  const coreDtex = core.dtex / core.draft;
  const parts: { fibre: FibreId; dtex: number; staple?: boolean }[] = [{ fibre: core.fibre, dtex: coreDtex }];
  let coverDtex = 0;
  for (const c of covers) {
    if (!(c.dtex > 0) || !(c.takeUp >= 0)) {
      throw new RangeError(`Cover needs dtex > 0 and take-up ≥ 0 (got ${c.dtex} dtex, take-up ${c.takeUp}).`);
    }
    const d = c.dtex * (1 + c.takeUp);
    coverDtex += d;
    parts.push(c.staple === undefined ? { fibre: c.fibre, dtex: d } : { fibre: c.fibre, dtex: d, staple: c.staple });
  }
  const dtex = coreDtex + coverDtex;
  const byFibre = new Map<FibreId, YarnFibre>();
  for (const p of parts) {
    const prev = byFibre.get(p.fibre);
    if (prev) prev.share += p.dtex / dtex;
    else {
      const yf: YarnFibre = { fibre: p.fibre, share: p.dtex / dtex };
      if (p.staple !== undefined) yf.staple = p.staple;
      byFibre.set(p.fibre, yf);
    }
  }
  return { dtex, coreDtex, coverDtex, fibres: [...byFibre.values()] };
}

/** True if the yarn contains elastane (any share above zero). */
export function yarnHasElastane(yarn: Yarn): boolean {
  return yarn.fibres.some((f) => f.fibre === 'elastane' && f.share > 0);
}

/** Whether a fibre of the yarn counts as staple for the EU allowance. */
export function isStapleFibre(yarn: Yarn, fibre: YarnFibre): boolean {
  return fibre.staple ?? yarn.staple ?? false;
}

export type YarnLookup = Readonly<Record<string, Yarn>> | readonly Yarn[] | ReadonlyMap<string, Yarn>;

/** Normalises the accepted yarn collections into a map by id. */
export function yarnMap(yarns: YarnLookup): ReadonlyMap<string, Yarn> {
  if (yarns instanceof Map) return yarns as ReadonlyMap<string, Yarn>;
  if (Array.isArray(yarns)) return new Map((yarns as readonly Yarn[]).map((y) => [y.id, y]));
  return new Map(Object.entries(yarns as Readonly<Record<string, Yarn>>));
}

/** Looks a yarn up by id. @throws Error naming the missing id. */
export function requireYarn(yarns: ReadonlyMap<string, Yarn>, id: string): Yarn {
  const y = yarns.get(id);
  if (!y) throw new Error(`Unknown yarn "${id}".`);
  return y;
}
