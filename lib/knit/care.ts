/**
 * The care-label draft: care instructions in this product's own plain words, chosen from a short
 * list suited to the garment's fibres, with the strictest fibre winning in every category (the
 * lowest wash temperature, no tumble drying where elastane is present, and so on).
 *
 * Sources (see ../shared/references.md §3 and §8):
 * - 16 CFR 423 (the US Care Labeling Rule): §423.1(a) a care label is permanent and stays legible
 *   for the useful life of the product (verified); §423.6(b) wearing apparel needs a washing or a
 *   dry-cleaning instruction (verified); Appendix A water temperatures: cold up to 86 °F, warm
 *   87–111 °F, hot 112–145 °F (verified-2nd). These fix the words "cold", "warm" and "hot" below.
 * - The fibre limits in `fibreCareLimits` are common practice for knitted performance garments or
 *   from memory; each names its status. No published care table was read, so no limit is marked
 *   verified. Where references.md records a fact behind a limit, its reason names it (the limit
 *   itself keeps its own status):
 *   - polylactide: "a melting temperature of at least 135 °C", Regulation (EU) No 1007/2011
 *     Annex I No 34 (verified);
 *   - elastane: dyeing polyester/elastane at 130 °C draws the elastane permanently and costs its
 *     recovery, BASF Technical Information EFT/TS 181 (verified-2nd); its dry-heat limit of 180 °C
 *     (verified-2nd, low authority) and heat-setting at about 190 °C, beyond which it is damaged
 *     (verified-2nd, an abstract), references.md §8;
 *   - polyester: disperse dyeing at up to 130 °C in a pressurised bath (verified-2nd, §8).
 *   They are kept consistent with the fibre registry's wet and dry heat limits (lib/knit/fibres.ts):
 *   no iron setting goes above a fibre's dry-heat limit and no wash goes above its wet-processing
 *   limit.
 *
 * The wording is the product's own and uses no symbol system. Care labelling follows each market's
 * own rules; this is a draft for the technical designer to check, not a compliance statement.
 */
import { fibres, isFibreId, type FibreId } from './fibres';
import type { FibreShares } from './content';

export const careCategories = ['wash', 'bleach', 'dry', 'iron', 'dryClean'] as const;
export type CareCategory = (typeof careCategories)[number];

export const careCategoryLabels: Record<CareCategory, string> = {
  wash: 'Washing',
  bleach: 'Bleach',
  dry: 'Drying',
  iron: 'Ironing',
  dryClean: 'Dry cleaning',
};

/** Where a care value comes from, in the words the tests and the screen use. */
export type CareSourceStatus = 'verified' | 'verified-2nd' | 'common-practice' | 'memory';

/** One wording of the list; `rank` orders the options of a category from the strictest (0) up. */
export interface CareOption {
  id: string;
  category: CareCategory;
  /** 0 = the strictest option of its category; higher = more permissive. */
  rank: number;
  /** The words on an EU-market label (temperatures in °C). */
  eu: string;
  /** The words on a US label (water temperatures as the Care Labeling Rule's cold / warm / hot). */
  us: string;
  /** Wash: the highest water temperature the option allows, °C. Iron: the highest sole temperature, °C. */
  maxC?: number;
}

/**
 * The product's own list of care wordings, strictest first in each category.
 * Water temperatures: 30 °C = 86 °F, the top of "cold"; 40 °C = 104 °F, inside "warm" (87–111 °F);
 * 60 °C = 140 °F, inside "hot" (112–145 °F) — 16 CFR 423 Appendix A (verified-2nd).
 * Iron sole temperatures of about 110, 150 and 200 °C for a cool, warm and hot iron: from memory.
 */
export const careOptions: Record<CareCategory, readonly CareOption[]> = {
  wash: [
    { id: 'hand-30', category: 'wash', rank: 0, maxC: 30, eu: 'Hand wash at 30 °C', us: 'Hand wash cold' },
    { id: 'machine-30-gentle', category: 'wash', rank: 1, maxC: 30, eu: 'Machine wash at 30 °C, gentle cycle', us: 'Machine wash cold, gentle cycle' },
    { id: 'machine-40', category: 'wash', rank: 2, maxC: 40, eu: 'Machine wash at 40 °C', us: 'Machine wash warm' },
    { id: 'machine-60', category: 'wash', rank: 3, maxC: 60, eu: 'Machine wash at 60 °C', us: 'Machine wash hot' },
  ],
  bleach: [
    { id: 'no-bleach', category: 'bleach', rank: 0, eu: 'Do not bleach', us: 'Do not bleach' },
    { id: 'non-chlorine', category: 'bleach', rank: 1, eu: 'Only non-chlorine bleach, when needed', us: 'Only non-chlorine bleach, when needed' },
    { id: 'any-bleach', category: 'bleach', rank: 2, eu: 'Any bleach, when needed', us: 'Bleach when needed' },
  ],
  dry: [
    { id: 'dry-flat', category: 'dry', rank: 0, eu: 'Do not tumble dry; dry flat', us: 'Do not tumble dry; dry flat' },
    { id: 'line-dry', category: 'dry', rank: 1, eu: 'Do not tumble dry; line dry in the shade', us: 'Do not tumble dry; line dry in shade' },
    { id: 'tumble-low', category: 'dry', rank: 2, eu: 'Tumble dry, low heat', us: 'Tumble dry low' },
    { id: 'tumble-medium', category: 'dry', rank: 3, eu: 'Tumble dry, medium heat', us: 'Tumble dry medium' },
  ],
  iron: [
    { id: 'no-iron', category: 'iron', rank: 0, eu: 'Do not iron', us: 'Do not iron' },
    { id: 'iron-cool', category: 'iron', rank: 1, maxC: 110, eu: 'Cool iron, up to 110 °C', us: 'Cool iron' },
    { id: 'iron-warm', category: 'iron', rank: 2, maxC: 150, eu: 'Warm iron, up to 150 °C', us: 'Warm iron' },
    { id: 'iron-hot', category: 'iron', rank: 3, maxC: 200, eu: 'Hot iron, up to 200 °C', us: 'Hot iron' },
  ],
  dryClean: [
    { id: 'no-dry-clean', category: 'dryClean', rank: 0, eu: 'Do not dry clean', us: 'Do not dryclean' },
    { id: 'dry-clean-mild', category: 'dryClean', rank: 1, eu: 'Professional dry clean, mild process', us: 'Professional dryclean, gentle cycle' },
    { id: 'dry-clean', category: 'dryClean', rank: 2, eu: 'Professional dry clean', us: 'Dryclean' },
  ],
};

/** Extra lines a designer can add; defaults depend on the garment (see `careAdvice`). */
export const careExtras = [
  { id: 'like-colours', eu: 'Wash with similar colours', us: 'Wash with like colors' },
  { id: 'inside-out', eu: 'Wash and iron inside out', us: 'Wash and iron inside out' },
  { id: 'no-iron-trim', eu: 'Do not iron on the print or transfer', us: 'Do not iron print or transfer' },
  { id: 'no-softener', eu: 'Do not use fabric softener', us: 'Do not use fabric softener' },
] as const;
export type CareExtraId = (typeof careExtras)[number]['id'];

/** The most permissive care a fibre takes, per category, with where each value comes from. */
export interface FibreCareLimits {
  /** Highest `careOptions.wash` rank the fibre takes. */
  wash: string;
  bleach: string;
  dry: string;
  iron: string;
  dryClean: string;
  /** Status and reason per category. */
  sources: Record<CareCategory, { status: CareSourceStatus; why: string }>;
}

const cp = (why: string) => ({ status: 'common-practice' as const, why });
const mem = (why: string) => ({ status: 'memory' as const, why });

/**
 * Care limits per fibre. Every value is common practice for knitted performance garments or from
 * memory (marked per value); none is taken from a published table. A reason that rests on a
 * recorded fact names its source (see the file comment). Iron settings stay at or below
 * the fibre registry's dry-heat limit (lib/knit/fibres.ts `heatLimitC`).
 */
export const fibreCareLimits: Record<FibreId, FibreCareLimits> = {
  polyamide: {
    wash: 'machine-40', bleach: 'non-chlorine', dry: 'tumble-low', iron: 'iron-cool', dryClean: 'dry-clean-mild',
    sources: {
      wash: cp('polyamide knits keep their shape and colour at 40 °C'),
      bleach: mem('chlorine bleach yellows and weakens polyamide'),
      dry: cp('polyamide softens and shrinks in a hot dryer; low heat only'),
      iron: mem('polyamide glazes under a warm iron; a cool iron stays well below its dry-heat limit'),
      dryClean: mem('polyamide takes a mild solvent process'),
    },
  },
  polyester: {
    wash: 'machine-60', bleach: 'non-chlorine', dry: 'tumble-low', iron: 'iron-warm', dryClean: 'dry-clean',
    sources: {
      wash: mem('polyester takes a 60 °C wash; the fibre itself is dyed at up to 130 °C in a pressurised bath (secondary source)'),
      bleach: mem('chlorine bleach is not needed on polyester and strips finishes; non-chlorine only'),
      dry: cp('low heat keeps a polyester knit from setting creases and pilling'),
      iron: mem('polyester takes a warm iron'),
      dryClean: mem('polyester takes the usual solvents'),
    },
  },
  'polyester-cd': {
    wash: 'machine-40', bleach: 'non-chlorine', dry: 'tumble-low', iron: 'iron-warm', dryClean: 'dry-clean',
    sources: {
      wash: mem('cationic-dyeable polyester bleeds above 40 °C more readily than regular polyester'),
      bleach: mem('as polyester'),
      dry: cp('as polyester'),
      iron: mem('as polyester'),
      dryClean: mem('as polyester'),
    },
  },
  elastane: {
    wash: 'machine-40', bleach: 'no-bleach', dry: 'line-dry', iron: 'iron-cool', dryClean: 'no-dry-clean',
    sources: {
      wash: cp('elastane loses recovery with hot washing; 40 °C at most (a 130 °C dye bath draws it for good: a dye maker note, secondary source)'),
      bleach: mem('chlorine breaks down elastane (the yarn turns brittle and yellow)'),
      dry: cp('tumble-drying heat costs elastane its recovery: no tumble drying where elastane is present'),
      iron: cp('a cool iron only, and rarely; elastane is damaged well below its dry-heat limit (180 °C, low-authority secondary source) under pressure'),
      dryClean: mem('dry-cleaning solvents swell and weaken elastane'),
    },
  },
  cotton: {
    wash: 'machine-60', bleach: 'non-chlorine', dry: 'tumble-medium', iron: 'iron-hot', dryClean: 'dry-clean',
    sources: {
      wash: mem('cotton takes a 60 °C wash'),
      bleach: mem('coloured cotton fades with chlorine bleach; non-chlorine only'),
      dry: mem('cotton takes medium heat'),
      iron: mem('cotton takes a hot iron'),
      dryClean: mem('cotton takes the usual solvents'),
    },
  },
  wool: {
    wash: 'hand-30', bleach: 'no-bleach', dry: 'dry-flat', iron: 'iron-warm', dryClean: 'dry-clean',
    sources: {
      wash: cp('wool felts with heat and agitation; hand wash cool'),
      bleach: mem('chlorine bleach damages wool'),
      dry: cp('wool knits are dried flat to keep their shape'),
      iron: mem('wool takes a warm iron, best with steam'),
      dryClean: mem('wool takes the usual solvents'),
    },
  },
  viscose: {
    wash: 'machine-30-gentle', bleach: 'non-chlorine', dry: 'line-dry', iron: 'iron-warm', dryClean: 'dry-clean-mild',
    sources: {
      wash: cp('viscose is weak when wet; cool and gentle'),
      bleach: mem('as cotton'),
      dry: cp('viscose knits shrink in a dryer'),
      iron: mem('viscose takes a warm iron'),
      dryClean: mem('viscose takes a mild solvent process'),
    },
  },
  modal: {
    wash: 'machine-40', bleach: 'non-chlorine', dry: 'tumble-low', iron: 'iron-warm', dryClean: 'dry-clean-mild',
    sources: {
      wash: mem('modal is stronger wet than viscose and takes 40 °C'),
      bleach: mem('as cotton'),
      dry: mem('modal takes low heat'),
      iron: mem('modal takes a warm iron'),
      dryClean: mem('as viscose'),
    },
  },
  lyocell: {
    wash: 'machine-40', bleach: 'non-chlorine', dry: 'tumble-low', iron: 'iron-warm', dryClean: 'dry-clean-mild',
    sources: {
      wash: mem('lyocell takes 40 °C'),
      bleach: mem('as cotton'),
      dry: mem('lyocell fibrillates with hot tumbling; low heat'),
      iron: mem('lyocell takes a warm iron'),
      dryClean: mem('as viscose'),
    },
  },
  acrylic: {
    wash: 'machine-30-gentle', bleach: 'non-chlorine', dry: 'tumble-low', iron: 'iron-cool', dryClean: 'dry-clean-mild',
    sources: {
      wash: mem('acrylic knits stretch out when washed hot'),
      bleach: mem('non-chlorine only'),
      dry: mem('low heat'),
      iron: mem('acrylic glazes under a warm iron'),
      dryClean: mem('acrylic takes a mild process'),
    },
  },
  polypropylene: {
    wash: 'machine-40', bleach: 'non-chlorine', dry: 'line-dry', iron: 'no-iron', dryClean: 'no-dry-clean',
    sources: {
      wash: mem('polypropylene takes 40 °C'),
      bleach: mem('non-chlorine only'),
      dry: mem('polypropylene shrinks and softens in a dryer'),
      iron: mem('polypropylene softens well below a cool iron; its dry-heat limit is low'),
      dryClean: mem('chlorinated solvents swell polypropylene'),
    },
  },
  elastomultiester: {
    wash: 'machine-40', bleach: 'non-chlorine', dry: 'tumble-low', iron: 'iron-cool', dryClean: 'dry-clean-mild',
    sources: {
      wash: mem('an elastic polyester; 40 °C keeps its recovery'),
      bleach: mem('as polyester'),
      dry: mem('low heat'),
      iron: mem('cool iron'),
      dryClean: mem('mild process'),
    },
  },
  polylactide: {
    wash: 'machine-30-gentle', bleach: 'non-chlorine', dry: 'line-dry', iron: 'no-iron', dryClean: 'dry-clean-mild',
    sources: {
      wash: mem('polylactide softens in hot water; 30 °C'),
      bleach: mem('non-chlorine only'),
      dry: mem('polylactide shrinks with heat'),
      iron: mem('the EU definition puts its melting temperature at 135 °C or more (Regulation (EU) No 1007/2011, Annex I No 34), yet it softens far lower: do not iron'),
      dryClean: mem('mild process'),
    },
  },
};

/** The option of a category by id. */
export function careOption(category: CareCategory, id: string): CareOption {
  const o = careOptions[category].find((x) => x.id === id);
  if (!o) throw new Error(`Unknown ${category} care option "${id}".`);
  return o;
}

export interface CategoryAdvice {
  category: CareCategory;
  /** The options allowed by every fibre present, strictest first. */
  allowed: CareOption[];
  /** The most permissive option every fibre allows: the default choice. */
  limit: CareOption;
  /** The fibres whose own limit is that option (the strictest fibres). */
  decidedBy: FibreId[];
  /** Why, in words: the fibres, then `why`. */
  reason: string;
  /** Why the deciding fibre takes no more. */
  why: string;
  status: CareSourceStatus;
}

export interface CareAdvice {
  categories: Record<CareCategory, CategoryAdvice>;
  /** Extra lines suggested for this garment. */
  extras: CareExtraId[];
  notes: string[];
}

const statusWords: Record<CareSourceStatus, string> = {
  verified: 'verified',
  'verified-2nd': 'secondary source',
  'common-practice': 'common practice, no published source',
  memory: 'from memory',
};

/** The status words the screen shows beside a limit. */
export function careStatusWords(status: CareSourceStatus): string {
  return statusWords[status];
}

/**
 * Care advice for a garment of these fibre shares: for each category, the strictest fibre's limit
 * wins (every fibre present counts, however small its share); the options at or below that limit
 * are allowed. `heatTransfer` adds the line against ironing on prints and transfers.
 */
export function careAdvice(shares: FibreShares, opts: { heatTransfer?: boolean } = {}): CareAdvice {
  const present: FibreId[] = [];
  for (const [id, share] of Object.entries(shares)) {
    if (!isFibreId(id)) throw new Error(`Unknown fibre "${id}".`);
    if (share === undefined) continue;
    if (!Number.isFinite(share) || share < 0) throw new RangeError(`Share of ${id} must be ≥ 0 (got ${share}).`);
    if (share > 0) present.push(id);
  }
  if (present.length === 0) throw new RangeError('The garment has no fibre content.');
  // Largest share first, so reasons name the main fibre first among equals.
  present.sort((a, b) => (shares[b] ?? 0) - (shares[a] ?? 0));

  const categories = {} as Record<CareCategory, CategoryAdvice>;
  for (const category of careCategories) {
    let limit: CareOption | undefined;
    let decidedBy: FibreId[] = [];
    for (const f of present) {
      const own = careOption(category, fibreCareLimits[f][category]);
      if (!limit || own.rank < limit.rank) {
        limit = own;
        decidedBy = [f];
      } else if (own.rank === limit.rank) {
        decidedBy.push(f);
      }
    }
    if (!limit) throw new Error('unreachable: no fibre');
    const first = decidedBy[0] as FibreId;
    const src = fibreCareLimits[first].sources[category];
    const names = decidedBy.map((f) => fibres[f].names.eu);
    categories[category] = {
      category,
      allowed: careOptions[category].filter((o) => o.rank <= (limit as CareOption).rank),
      limit,
      decidedBy,
      reason: `${names.join(', ')}: ${src.why}`,
      why: src.why,
      status: src.status,
    };
  }

  const extras: CareExtraId[] = ['like-colours'];
  if (opts.heatTransfer) extras.push('inside-out', 'no-iron-trim');
  const synthetic = present.reduce((s, f) => s + (fibres[f].kind === 'synthetic' || fibres[f].kind === 'elastomeric' ? (shares[f] ?? 0) : 0), 0);
  const total = present.reduce((s, f) => s + (shares[f] ?? 0), 0);
  // Softener coats synthetic performance knits and slows their wicking: common practice.
  if (synthetic / total >= 0.5) extras.push('no-softener');

  const notes = [
    'Every fibre present counts: the strictest one sets each instruction, however small its share.',
    'A wearing garment needs a washing or a dry-cleaning instruction (16 CFR 423.6(b)), on a permanent label that stays legible for the life of the garment (16 CFR 423.1(a)).',
    'Cold, warm and hot on US labels mean up to 86 °F (30 °C), 87–111 °F and 112–145 °F (16 CFR 423, Appendix A).',
    'Care labelling follows each market’s own rules: check the wording and the form of the label for every market before sale. This is a draft.',
  ];
  return { categories, extras, notes };
}

export type CareChoices = Partial<Record<CareCategory, string>>;

/**
 * The care lines for a region: each category's chosen option (the advice's limit unless a stricter
 * allowed one is chosen; a choice beyond the limit is refused), then the extras.
 */
export function careLines(advice: CareAdvice, region: 'eu' | 'us', choices: CareChoices = {}, extras: readonly CareExtraId[] = advice.extras): string[] {
  const lines: string[] = [];
  for (const category of careCategories) {
    const a = advice.categories[category];
    const id = choices[category];
    const chosen = id ? a.allowed.find((o) => o.id === id) : a.limit;
    if (!chosen) throw new RangeError(`"${id}" goes beyond what the fibres allow for ${careCategoryLabels[category].toLowerCase()}.`);
    lines.push(chosen[region]);
  }
  for (const e of careExtras) if (extras.includes(e.id)) lines.push(e[region]);
  return lines;
}
