/**
 * Fibre content of a garment and its label.
 *
 * Sources (see ../shared/references.md §2–3):
 * - Regulation (EU) No 1007/2011: Annex I names, Art. 7 ("100 %"), Art. 9 (descending order,
 *   'other fibres'), Art. 19(3) and Annex IX (agreed allowances), Annex VIII (the formula with the
 *   pre-treatment loss b), Art. 20(3) (3 % manufacturing tolerance).
 * - 16 CFR Part 303: §303.6 and §303.42(a) (fibres of 5 % or more named, in order of predominance,
 *   then 'other fiber(s)'), §303.3(a) (a fibre under 5 % may be named for a clearly established
 *   functional significance), §303.27 ('All' / '100%'), §303.43 (3 % tolerance; from memory).
 *
 * A computed label is a statement from nominal data: it must be confirmed by a fibre analysis
 * (e.g. the ISO 1833 methods) before the garment is sold.
 */
import { euAllowancePct, fibres, isFibreId, type Fibre, type FibreId } from './fibres';
import { isStapleFibre, requireYarn, yarnMap, type YarnLookup } from './yarn';

/** Mass fraction per fibre; the values sum to 1. */
export type FibreShares = Partial<Record<FibreId, number>>;

export type ContentMethod = 'nominal' | 'eu-allowance';

export type LabelRegion = 'eu' | 'us';

/** A fibre component for the allowance formula: polyamide staple and filament are separate. */
interface Component {
  fibre: FibreId;
  staple: boolean;
  mass: number;
}

function checkMass(value: number, what: string): void {
  if (!Number.isFinite(value) || value < 0) throw new RangeError(`${what} must be a mass ≥ 0 (got ${value}).`);
}

function componentsOf(yarnGrams: Readonly<Record<string, number>>, yarns: YarnLookup): Component[] {
  const byId = yarnMap(yarns);
  const out = new Map<string, Component>();
  for (const [yarnId, grams] of Object.entries(yarnGrams)) {
    checkMass(grams, `Grams of yarn ${yarnId}`);
    if (grams === 0) continue;
    const yarn = requireYarn(byId, yarnId);
    for (const f of yarn.fibres) {
      if (!isFibreId(f.fibre)) throw new Error(`Yarn ${yarn.name}: unknown fibre "${f.fibre}".`);
      const staple = isStapleFibre(yarn, f);
      const key = `${f.fibre}|${staple}`;
      const c = out.get(key) ?? { fibre: f.fibre, staple, mass: 0 };
      c.mass += grams * f.share;
      out.set(key, c);
    }
  }
  return [...out.values()];
}

function sharesFromComponents(components: readonly Component[], weight: (c: Component) => number): FibreShares {
  let total = 0;
  const weighted = components.map((c) => {
    const w = c.mass * weight(c);
    total += w;
    return { fibre: c.fibre, w };
  });
  if (!(total > 0)) throw new RangeError('There is no fibre mass to share out.');
  const shares: FibreShares = {};
  for (const { fibre, w } of weighted) {
    if (w === 0) continue;
    shares[fibre] = (shares[fibre] ?? 0) + w / total;
  }
  return shares;
}

/** Grams per fibre: Σ over yarns of yarn grams × the yarn's fibre share. */
export function fibreMasses(input: { yarnGrams: Readonly<Record<string, number>>; yarns: YarnLookup }): Partial<Record<FibreId, number>> {
  const out: Partial<Record<FibreId, number>> = {};
  for (const c of componentsOf(input.yarnGrams, input.yarns)) out[c.fibre] = (out[c.fibre] ?? 0) + c.mass;
  return out;
}

/**
 * Fibre shares of a garment from the grams of each yarn it keeps (inside the cut outline).
 * - 'nominal': yarn grams × fibre shares, as a fraction of the total (product design §7).
 * - 'eu-allowance': the EU basis, Regulation (EU) No 1007/2011 Art. 19(3), Annex VIII and IX: each
 *   fibre's clean dry mass × (1 + (agreed allowance + pre-treatment loss) / 100), as a fraction of the
 *   sum. Yarn grams are taken as conditioned and brought to dry mass by the fibre's commercial
 *   moisture regain (most regain values are from memory, see fibres.ts) unless `massBasis` is 'dry'.
 *   Polyamide counts as filament unless its yarn says staple.
 * @returns shares per fibre summing to 1.
 */
export function fibreContent(input: {
  yarnGrams: Readonly<Record<string, number>>;
  yarns: YarnLookup;
  method: ContentMethod;
  massBasis?: 'conditioned' | 'dry';
  pretreatmentLossPct?: Partial<Record<FibreId, number>>;
}): FibreShares {
  const components = componentsOf(input.yarnGrams, input.yarns);
  switch (input.method) {
    case 'nominal':
      return sharesFromComponents(components, () => 1);
    case 'eu-allowance': {
      const toDry = (input.massBasis ?? 'conditioned') === 'conditioned';
      return sharesFromComponents(components, (c) => {
        const dry = toDry ? 1 / (1 + fibres[c.fibre].regainPct / 100) : 1;
        return dry * allowanceFactor(c.fibre, c.staple, input.pretreatmentLossPct);
      });
    }
  }
}

function allowanceFactor(fibre: FibreId, staple: boolean, loss: Partial<Record<FibreId, number>> | undefined): number {
  const b = loss?.[fibre] ?? 0;
  if (!Number.isFinite(b)) throw new RangeError(`Pre-treatment loss of ${fibre} must be a number.`);
  return 1 + (euAllowancePct(fibre, { staple }) + b) / 100;
}

/**
 * Shares on the EU basis: P_iA = P_i (1 + (a_i + b_i)/100) / Σ_j P_j (1 + (a_j + b_j)/100), with P the
 * clean dry mass shares (any scale), a the Annex IX agreed allowance and b the % loss of mass in
 * pre-treatment (0 unless given). Regulation (EU) No 1007/2011 Annex VIII (worked ternary example)
 * and Annex IX. Polyamide is filament (5.75) unless listed in `staple` (6.25).
 * @returns shares summing to 1.
 */
export function applyAgreedAllowances(
  dryShares: FibreShares,
  opts: { staple?: readonly FibreId[]; pretreatmentLossPct?: Partial<Record<FibreId, number>> } = {},
): FibreShares {
  const components: Component[] = [];
  for (const [id, share] of Object.entries(dryShares)) {
    if (!isFibreId(id)) throw new Error(`Unknown fibre "${id}".`);
    if (share === undefined) continue;
    checkMass(share, `Share of ${id}`);
    components.push({ fibre: id, staple: opts.staple?.includes(id) ?? false, mass: share });
  }
  return sharesFromComponents(components, (c) => allowanceFactor(c.fibre, c.staple, opts.pretreatmentLossPct));
}

export interface LabelLine {
  /** The region's fibre name, or 'other fibres' / 'other fiber(s)'. */
  name: string;
  /** Whole percentage; the lines sum to 100. */
  percent: number;
  /** The unrounded percentage. */
  exactPercent: number;
  /** Fibres behind the line. */
  fibres: FibreId[];
  /** The line groups small shares ('other fibres' / 'other fiber(s)'). */
  other: boolean;
}

export interface ContentLabel {
  region: LabelRegion;
  lines: LabelLine[];
  text: string;
  notes: string[];
}

export interface ContentLabelOptions {
  /**
   * EU only: group small fibres as 'other fibres' (Art. 9(2), allowed where they cannot easily be
   * stated at the time of manufacture). Art. 9(2) reads "a fibre which accounts for up to 5 % …, or
   * fibres which collectively account for up to 15 %"; Needlemap applies the cautious reading of both
   * together: each grouped fibre at most 5 % and all of them at most 15 %. Default false: every fibre
   * is named (Art. 9(1)).
   */
  otherFibres?: boolean;
  /**
   * US only: fibres under 5 % named for their functional significance (§303.3(a)) instead of
   * 'other fiber(s)'. Default: the elastomeric fibres (stretch). Pass [] to name none.
   */
  functionalFibres?: readonly FibreId[];
}

/** EU Art. 9(2) and US §303.6 threshold for naming a small share, as a fraction. */
export const SMALL_SHARE_THRESHOLD = 0.05;
/** EU Art. 9(2): 'other fibres' may hold up to 15 % together. */
export const EU_OTHER_FIBRES_TOTAL = 0.15;
/**
 * Float slack for comparing shares with each other and with thresholds: shares computed from grams
 * carry rounding error (95 g : 5 g can give 0.049999999999999996), and a share that is exactly at a
 * legal threshold must fall on the side the text puts it.
 */
const SHARE_EPSILON = 1e-9;

/** -1 if `a` is below `b`, 1 if above, 0 if they are equal within `SHARE_EPSILON`. */
function compareShares(a: number, b: number): -1 | 0 | 1 {
  const d = a - b;
  if (d > SHARE_EPSILON) return 1;
  if (d < -SHARE_EPSILON) return -1;
  return 0;
}

/** EU Art. 20(3) manufacturing tolerance, % of the fibre weight. */
export const EU_TOLERANCE_PCT = 3;
/** US §303.43 tolerance, percentage points (from memory). */
export const US_TOLERANCE_PCT = 3;

export const labelCaution =
  'Computed from nominal yarn data: confirm the fibre content by a fibre analysis (e.g. the ISO 1833 methods) before sale.';

/**
 * Whole percentages that sum to 100, by the largest-remainder method: floor every value, then give
 * the remaining points to the largest remainders (ties to the larger value, then the earlier entry).
 * With `minimumOne`, an entry above zero that would round to 0 gets 1 point, taken from the entry that
 * was rounded up the most (ties to the larger, then the later entry). Values equal within float error
 * count as ties.
 */
export function largestRemainderPercents(values: readonly number[], minimumOne = false): number[] {
  return roundPercents(values, minimumOne).percents;
}

/** `largestRemainderPercents`, also telling which entries were rounded to 0 and then raised to 1. */
function roundPercents(values: readonly number[], minimumOne: boolean): { percents: number[]; raisedToOne: boolean[] } {
  const raisedToOne = values.map(() => false);
  const total = values.reduce((s, v) => s + v, 0);
  if (!(total > 0)) throw new RangeError('Nothing to share out.');
  const exact = values.map((v) => (v / total) * 100);
  const out = exact.map((e) => Math.floor(e));
  let left = 100 - out.reduce((s, v) => s + v, 0);
  const order = exact
    .map((e, i) => ({ i, r: e - Math.floor(e), e }))
    // Equal within float error counts as a tie, so equal shares from grams round the same way.
    .sort((p, q) => compareShares(q.r, p.r) || compareShares(q.e, p.e) || p.i - q.i);
  for (let k = 0; left > 0 && k < order.length; k++, left--) {
    const i = (order[k] as { i: number }).i;
    out[i] = (out[i] as number) + 1;
  }
  if (minimumOne) {
    for (let i = 0; i < out.length; i++) {
      if (out[i] !== 0 || !((exact[i] as number) > 0)) continue;
      let donor = -1;
      let best = -Infinity;
      for (let j = 0; j < out.length; j++) {
        if ((out[j] as number) <= 1) continue;
        const up = (out[j] as number) - (exact[j] as number);
        // Ties (within float error) go to the larger entry, then the later one, so that equal
        // shares keep the earlier line at least as high as the later.
        const vs = compareShares(up, best);
        if (vs > 0 || (vs === 0 && (out[j] as number) >= (out[donor] ?? 0))) {
          best = up;
          donor = j;
        }
      }
      if (donor < 0) break;
      out[donor] = (out[donor] as number) - 1;
      out[i] = 1;
      raisedToOne[i] = true;
    }
  }
  return { percents: out, raisedToOne };
}

function normalise(shares: FibreShares): { fibre: FibreId; share: number }[] {
  const entries: { fibre: FibreId; share: number }[] = [];
  let total = 0;
  for (const [id, share] of Object.entries(shares)) {
    if (!isFibreId(id)) throw new Error(`Unknown fibre "${id}".`);
    if (share === undefined) continue;
    if (!Number.isFinite(share) || share < 0) throw new RangeError(`Share of ${id} must be ≥ 0 (got ${share}).`);
    if (share === 0) continue;
    entries.push({ fibre: id, share });
    total += share;
  }
  if (!(total > 0)) throw new RangeError('The garment has no fibre content.');
  return entries.map((e) => ({ fibre: e.fibre, share: e.share / total }));
}

const pct = (share: number) => `${(share * 100).toFixed(1)} %`;

interface NameGroup {
  name: string;
  share: number;
  fibres: FibreId[];
}

/** Descending by share, ties by name. */
function sortGroups(groups: NameGroup[]): NameGroup[] {
  return groups.sort((p, q) => compareShares(q.share, p.share) || p.name.localeCompare(q.name));
}

/**
 * US: the 5 % rule of 16 CFR 303.6 is about generic fibres, so members of one generic (viscose,
 * modal and lyocell are rayon) count together. Each keeps its own name only if every member is
 * 5 % or more; otherwise they are one line under the generic name. A fibre named for its
 * functional significance (§303.3(a)) keeps its own line.
 */
function joinUsGenerics(named: NameGroup[], isFunctional: (g: NameGroup) => boolean, notes: string[]): NameGroup[] {
  const generic = (g: NameGroup) => {
    const first: Fibre = fibres[g.fibres[0] as FibreId];
    return first.names.usGeneric ?? g.name;
  };
  const members = new Map<string, NameGroup[]>();
  for (const g of named) {
    if (isFunctional(g)) continue;
    const list = members.get(generic(g)) ?? [];
    list.push(g);
    members.set(generic(g), list);
  }
  let out = named;
  for (const [name, list] of members) {
    if (list.length < 2 || list.every((g) => compareShares(g.share, SMALL_SHARE_THRESHOLD) >= 0)) continue;
    const joined: NameGroup = { name, share: list.reduce((s, g) => s + g.share, 0), fibres: list.flatMap((g) => g.fibres) };
    out = [...out.filter((g) => !list.includes(g)), joined];
    notes.push(
      `${list.map((g) => `${g.name} ${pct(g.share)}`).join(', ')}: all ${name} under 16 CFR 303.7 (from memory), not each 5 % or more, so labelled together as ${name} (§303.6).`,
    );
  }
  return out === named ? named : sortGroups(out);
}

/**
 * The fibre-content label for a region, from shares per fibre (any scale; normalised to 1).
 * Names: EU Annex I / US §303.7 (fibres with the same label name are added together). Order:
 * descending (EU Art. 9(1); US §303.42(a) 'order of predominance'); the EU 'other fibres' line by its
 * percentage, the US 'other fiber(s)' line last (§303.42(a)).
 * Percentages: whole numbers summing to 100 by largest remainder; a fibre present is never shown
 * as 0 %. Small shares: EU names every fibre unless `otherFibres` (Art. 9(2)); US groups fibres
 * under 5 % as 'other fiber(s)' (§303.6, §303.42(a)) except functionally significant ones
 * (§303.3(a)). Notes: shares within the manufacturing tolerance of a threshold (EU Art. 20(3),
 * US §303.43), the '100 %' rule (EU Art. 7, US §303.27), and the need for a fibre analysis.
 */
export function contentLabel(shares: FibreShares, region: LabelRegion, opts: ContentLabelOptions = {}): ContentLabel {
  const entries = normalise(shares);
  const notes: string[] = [];

  // Group by the region's name.
  const groups = new Map<string, NameGroup>();
  for (const e of entries) {
    const name = fibres[e.fibre].names[region];
    const g = groups.get(name) ?? { name, share: 0, fibres: [] };
    g.share += e.share;
    g.fibres.push(e.fibre);
    groups.set(name, g);
  }
  let named = sortGroups([...groups.values()]);

  let other: { share: number; fibres: FibreId[]; names: string[] } | undefined;
  const tolerance = region === 'eu' ? EU_TOLERANCE_PCT : US_TOLERANCE_PCT;
  const nearThreshold = (share: number, threshold: number) => compareShares(Math.abs(share - threshold), tolerance / 100) <= 0;

  switch (region) {
    case 'eu': {
      if (opts.otherFibres) {
        // Smallest shares are grouped first (ties by name), as many as fit in 15 %: the choice of
        // which fibres stay named is the same for the same shares, and the larger ones stay named.
        const small = named
          .filter((g) => compareShares(g.share, SMALL_SHARE_THRESHOLD) <= 0)
          .sort((p, q) => compareShares(p.share, q.share) || p.name.localeCompare(q.name));
        let sum = 0;
        const grouped: typeof small = [];
        for (const g of small) {
          if (compareShares(sum + g.share, EU_OTHER_FIBRES_TOTAL) > 0) break;
          sum += g.share;
          grouped.push(g);
        }
        // Keep at least one fibre named.
        if (grouped.length > 0 && grouped.length < named.length) {
          other = { share: sum, fibres: grouped.flatMap((g) => g.fibres), names: grouped.map((g) => g.name) };
          notes.push(
            `'other fibres' (${grouped.map((g) => `${g.name} ${pct(g.share)}`).join(', ')}): Reg. (EU) 1007/2011 Art. 9(2) allows it for "a fibre which accounts for up to 5 %" or "fibres which collectively account for up to 15 %", and only where they cannot easily be stated at the time of manufacture. Needlemap applies the cautious reading: each grouped fibre at most 5 % and all of them at most 15 % together.`,
          );
          if (nearThreshold(sum, EU_OTHER_FIBRES_TOTAL)) {
            notes.push(
              `'other fibres' total ${pct(sum)} is within the ${tolerance} % manufacturing tolerance (Art. 20(3)) of the 15 % limit of Art. 9(2).`,
            );
          }
        }
      }
      // Only a fibre grouped as 'other fibres' is at risk: analysis over 5 % would make the grouping
      // wrong. A named fibre stays correctly named on either side of 5 %.
      for (const g of named) {
        if (other?.names.includes(g.name) && nearThreshold(g.share, SMALL_SHARE_THRESHOLD)) {
          notes.push(
            `${g.name} at ${pct(g.share)} is within the ${tolerance} % manufacturing tolerance (Art. 20(3)) of the 5 % limit up to which a fibre may be grouped as 'other fibres' (Art. 9(2)).`,
          );
        }
      }
      break;
    }
    case 'us': {
      const functional = new Set<FibreId>(
        opts.functionalFibres ?? entries.filter((e) => fibres[e.fibre].kind === 'elastomeric').map((e) => e.fibre),
      );
      const isFunctional = (g: { fibres: FibreId[] }) => g.fibres.every((f) => functional.has(f));
      named = joinUsGenerics(named, isFunctional, notes);
      const small = named.filter((g) => compareShares(g.share, SMALL_SHARE_THRESHOLD) < 0);
      const grouped = small.filter((g) => !isFunctional(g));
      for (const g of small) {
        if (grouped.includes(g)) continue;
        const reason = g.fibres.every((f) => fibres[f].kind === 'elastomeric') ? ' (stretch)' : '';
        notes.push(
          `${g.name} at ${pct(g.share)} is under 5 % but named for its functional significance${reason} under 16 CFR 303.3(a); that significance must be real and established.`,
        );
      }
      if (grouped.length > 0) {
        other = {
          share: grouped.reduce((s, g) => s + g.share, 0),
          fibres: grouped.flatMap((g) => g.fibres),
          names: grouped.map((g) => g.name),
        };
        notes.push(
          `${grouped.map((g) => `${g.name} ${pct(g.share)}`).join(', ')}: under 5 % and not named, so labelled '${grouped.length === 1 ? 'other fiber' : 'other fibers'}' (16 CFR 303.6, 303.42(a)).`,
        );
      }
      // A fibre named for its functional significance keeps its line on either side of 5 %.
      for (const g of named) {
        if (!isFunctional(g) && nearThreshold(g.share, SMALL_SHARE_THRESHOLD)) {
          notes.push(
            `${g.name} at ${pct(g.share)} is within the ${tolerance}-point tolerance (16 CFR 303.43) of the 5 % naming threshold (§303.6); an analysis may put it on the other side.`,
          );
        }
      }
      break;
    }
  }

  const keep = other ? named.filter((g) => !other.names.includes(g.name)) : named;
  const rows = keep.map((g) => ({ name: g.name, share: g.share, fibres: g.fibres, other: false }));
  if (other) {
    const otherName = region === 'eu' ? 'other fibres' : other.names.length === 1 ? 'other fiber' : 'other fibers';
    rows.push({ name: otherName, share: other.share, fibres: other.fibres, other: true });
  }
  switch (region) {
    case 'eu':
      // Art. 9(1) puts all constituent fibres in descending order; Art. 9(2) says only that 'other
      // fibres' is preceded or followed by its total percentage, nothing of where the line goes. So
      // it takes its place by its percentage, after a named fibre of the same share.
      rows.sort((p, q) => compareShares(q.share, p.share) || Number(p.other) - Number(q.other));
      break;
    case 'us':
      // §303.42(a): 'other fiber(s)' follows the named fibres.
      break;
  }
  const { percents, raisedToOne } = roundPercents(
    rows.map((r) => r.share),
    true,
  );
  const lines: LabelLine[] = rows.map((r, i) => ({
    name: r.name,
    percent: percents[i] as number,
    exactPercent: r.share * 100,
    fibres: r.fibres,
    other: r.other,
  }));
  for (const [i, l] of lines.entries()) {
    if (raisedToOne[i]) {
      notes.push(`${l.name} (${l.exactPercent.toFixed(2)} %) would round to 0 % and is shown as 1 %.`);
    }
  }

  const sep = region === 'eu' ? ' % ' : '% ';
  const single = lines.length === 1 && !(lines[0] as LabelLine).other;
  const text = lines.map((l) => `${l.percent}${sep}${l.name}`).join(', ');
  if (single) {
    notes.push(
      region === 'eu'
        ? `'100 %', 'pure' or 'all' may be used only because the garment is of one fibre (Reg. (EU) 1007/2011 Art. 7(1)).`
        : `'All' or '100%' may be used for a product of one fibre (16 CFR 303.27); the tolerance of §303.43 does not cover that claim (from memory).`,
    );
  }
  notes.push(
    region === 'eu'
      ? `Analysis may differ from the stated composition by up to ${EU_TOLERANCE_PCT} % of the total fibre weight (Art. 20(3)).`
      : `Stated percentages may differ from analysis by up to ${US_TOLERANCE_PCT} percentage points only for unavoidable manufacturing variation (16 CFR 303.43, from memory).`,
  );
  notes.push(labelCaution);
  return { region, lines, text, notes };
}
