/**
 * The studio's costing rates (studios.settings.costing) and their defaults. The defaults are example
 * values only, there so a first quote shows every line: each studio sets its own.
 */

export const exampleValueNote = 'example value, set your own';

export const makingUpKeys = ['cutting', 'linking', 'dyeing', 'heatSetting'] as const;
export type MakingUpKey = (typeof makingUpKeys)[number];

export const makingUpLabels: Record<MakingUpKey, string> = {
  cutting: 'Cutting',
  linking: 'Linking or sewing',
  dyeing: 'Dyeing',
  heatSetting: 'Heat-setting',
};

/** Trim kinds of the Trims section, each with a cost per piece (bought and applied). */
export const trimCostKinds = ['heat-transfer', 'woven-label', 'printed-tag', 'care-label', 'knitted-logo'] as const;
export type TrimCostKind = (typeof trimCostKinds)[number];

export interface CostRates {
  /** ISO 4217 code of the studio currency (yarn prices per kg are in it too). */
  currency: string;
  /** Machine cost per minute of knitting. */
  machineMinuteRate: number;
  /** Share of the time the machine knits, 0 < η ≤ 1. */
  efficiency: number;
  /** Revolutions per minute of a circular machine. */
  circularRpm: number;
  /** Carriage passes per minute of a V-bed. */
  flatPassesPerMinute: number;
  /** Knitting systems of a V-bed carriage. */
  flatSystems: number;
  /** Yarn waste allowance, a fraction added to the knitted grams. */
  wasteAllowance: number;
  /** Making-up and finishing per garment. */
  makingUp: Record<MakingUpKey, number>;
  /** Cost per trim piece by kind. */
  trimUnitCost: Record<TrimCostKind, number>;
}

/** Example values: every one marked in the UI as "example value, set your own". */
export const defaultCostRates: CostRates = {
  currency: 'EUR',
  machineMinuteRate: 0.35,
  efficiency: 0.85,
  circularRpm: 60,
  flatPassesPerMinute: 30,
  flatSystems: 2,
  wasteAllowance: 0.05,
  makingUp: { cutting: 0.3, linking: 1.2, dyeing: 0.9, heatSetting: 0.25 },
  trimUnitCost: { 'heat-transfer': 0.35, 'woven-label': 0.12, 'printed-tag': 0.05, 'care-label': 0.06, 'knitted-logo': 0 },
};

/** Which rates a studio has set; the others are the example defaults. */
export type RatesSet = { [K in keyof CostRates]?: CostRates[K] extends Record<string, number> ? Partial<CostRates[K]> : CostRates[K] };

/** A change to the studio rates: an absent key keeps the stored value, null puts it back to the example default. */
export type RatesChange = {
  [K in keyof CostRates]?: CostRates[K] extends Record<string, number> ? { [P in keyof CostRates[K]]?: number | null } : CostRates[K] | null;
};

/**
 * The stored rates with a change written onto them: given keys replace the stored ones (in making-up
 * and trims, key by key), null removes a key so it takes the example default again, absent keys stay.
 */
export function applyRatesChange(stored: RatesSet | null | undefined, change: RatesChange): RatesSet {
  const merge = (into: Record<string, unknown>, from: Record<string, unknown>): Record<string, unknown> => {
    const out = { ...into };
    for (const [k, v] of Object.entries(from)) {
      if (v === undefined) continue;
      if (v === null) delete out[k];
      else if (typeof v === 'object') {
        const inner = out[k];
        const merged = merge(inner && typeof inner === 'object' ? (inner as Record<string, unknown>) : {}, v as Record<string, unknown>);
        if (Object.keys(merged).length) out[k] = merged;
        else delete out[k];
      } else out[k] = v;
    }
    return out;
  };
  return merge({ ...(stored ?? {}) }, change) as RatesSet;
}

/** The studio's rates over the defaults, with the keys still at their example value. */
export function resolveRates(set: RatesSet | null | undefined): { rates: CostRates; defaults: string[] } {
  const s = set ?? {};
  const defaults: string[] = [];
  const pick = <K extends keyof CostRates>(k: K): CostRates[K] => {
    const v = s[k];
    if (v === undefined || v === null) {
      defaults.push(k);
      return defaultCostRates[k];
    }
    return v as CostRates[K];
  };
  const rates: CostRates = {
    currency: pick('currency'),
    machineMinuteRate: pick('machineMinuteRate'),
    efficiency: pick('efficiency'),
    circularRpm: pick('circularRpm'),
    flatPassesPerMinute: pick('flatPassesPerMinute'),
    flatSystems: pick('flatSystems'),
    wasteAllowance: pick('wasteAllowance'),
    makingUp: { ...defaultCostRates.makingUp },
    trimUnitCost: { ...defaultCostRates.trimUnitCost },
  };
  for (const k of makingUpKeys) {
    const v = s.makingUp?.[k];
    if (typeof v === 'number') rates.makingUp[k] = v;
    else defaults.push(`makingUp.${k}`);
  }
  for (const k of trimCostKinds) {
    const v = s.trimUnitCost?.[k];
    if (typeof v === 'number') rates.trimUnitCost[k] = v;
    else defaults.push(`trimUnitCost.${k}`);
  }
  return { rates, defaults };
}

/** Plain names of the rates, for saying which are still example values. */
export const rateLabels: Record<string, string> = {
  currency: 'currency',
  machineMinuteRate: 'machine-minute rate',
  efficiency: 'efficiency',
  circularRpm: 'circular machine speed',
  flatPassesPerMinute: 'V-bed passes per minute',
  flatSystems: 'V-bed systems',
  wasteAllowance: 'yarn waste allowance',
  ...Object.fromEntries(makingUpKeys.map((k) => [`makingUp.${k}`, makingUpLabels[k].toLowerCase()])),
  ...Object.fromEntries(trimCostKinds.map((k) => [`trimUnitCost.${k}`, `${k} trims`])),
};
