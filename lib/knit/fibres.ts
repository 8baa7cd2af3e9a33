/**
 * The fibre registry: label names, dye classes, moisture regain, EU agreed allowances and heat limits.
 *
 * Status of each value (see ../shared/references.md):
 * - EU names: Regulation (EU) No 1007/2011, Annex I — verified for every fibre here.
 * - EU agreed allowances: Regulation (EU) No 1007/2011, Annex IX (original 2011 text) — verified.
 * - US names: 16 CFR 303.7 and the ISO 2076 names it incorporates. 'nylon' and 'rayon' are verified
 *   (§303.6 example); 'spandex', 'olefin', 'PLA' and the rayon subclasses are from memory;
 *   'elasterell-p' is verified (67 FR 70835 abstract).
 * - Commercial moisture regain (ASTM D1909): cotton and wool verified in a secondary source; the rest
 *   are from memory.
 * - Dye classes: product design and references.md §8 (secondary sources); cationic-dyeable polyester,
 *   polylactide and elastomultiester from memory.
 * - Wet and dry heat limits: from memory / common practice unless a comment says otherwise.
 */

export const dyeClasses = ['acid', 'disperse', 'cationic', 'reactive', 'direct', 'vat'] as const;
export type DyeClass = (typeof dyeClasses)[number];

export const fibreKinds = ['synthetic', 'cellulosic', 'animal', 'elastomeric'] as const;
export type FibreKind = (typeof fibreKinds)[number];

/** How much a stated value can be trusted. */
export type ValueStatus = 'verified' | 'verified-2nd' | 'computed' | 'memory';

export interface FibreNames {
  /** Name for EU labels, from Regulation (EU) No 1007/2011 Annex I. */
  eu: string;
  /** Default generic name for US labels (16 CFR 303.7, incl. the ISO 2076 names it incorporates). */
  us: string;
  /** Other names the region also accepts (e.g. Annex I No 30 "polyamide or nylon"). */
  euAlternatives?: readonly string[];
  usAlternatives?: readonly string[];
  /**
   * The US generic fibre the default name belongs to, where it differs from `us`: its share is
   * counted with the other members of that generic for the 5 % rule (16 CFR 303.6).
   */
  usGeneric?: string;
}

export interface Fibre {
  id: string;
  names: FibreNames;
  /** ISO 2076 / common code, e.g. PA, EL (from memory). */
  code: string;
  kind: FibreKind;
  natural: boolean;
  /** Dye classes that colour this fibre. Empty when it takes no dye (see the flags below). */
  dyeClasses: readonly DyeClass[];
  /** Dye classes that stain it without giving a fast, full shade (disperse on polyamide and elastane). */
  stainedBy: readonly DyeClass[];
  /** Takes little dye in a garment-dyeing run (elastane): its colour follows the ground yarn loosely. */
  takesLittleDye: boolean;
  /** Cannot be dyed in the piece; coloured only in the melt (dope-dyed, polypropylene). */
  dopeDyedOnly: boolean;
  /** Commercial moisture regain, % of dry mass (ASTM D1909 values). */
  regainPct: number;
  regainStatus: ValueStatus;
  /** EU agreed allowance, % (Annex IX) for the form usually met in knitwear (filament for polyamide). */
  euAllowancePct: number;
  /** Annex IX values where the allowance depends on the fibre form. */
  euAllowanceByForm?: { staple: number; filament: number };
  /** Highest wet-processing (dyeing) temperature, °C, where one applies. */
  wetLimitC?: number;
  wetLimitStatus?: ValueStatus;
  /** Highest dry-heat contact temperature for heat-applied trims, °C, where known. */
  heatLimitC?: number;
  heatLimitStatus?: ValueStatus;
}

function fibre<const Id extends string>(f: Fibre & { id: Id }): Fibre & { id: Id } {
  return f;
}

const cellulosicDyes = ['reactive', 'direct', 'vat'] as const;

/** The registry, keyed by fibre id. */
export const fibres = {
  polyamide: fibre({
    id: 'polyamide',
    names: { eu: 'polyamide', us: 'nylon', euAlternatives: ['nylon'], usAlternatives: ['polyamide'] },
    code: 'PA',
    kind: 'synthetic',
    natural: false,
    dyeClasses: ['acid'],
    // Disperse: references.md §8 (verified-2nd). Cationic: from memory; the carboxyl end groups of
    // polyamide take up some basic dye, a stain of poor fastness in a cationic bath.
    stainedBy: ['disperse', 'cationic'],
    takesLittleDye: false,
    dopeDyedOnly: false,
    regainPct: 4.5, // memory
    regainStatus: 'memory',
    euAllowancePct: 5.75, // Annex IX, filament
    euAllowanceByForm: { staple: 6.25, filament: 5.75 }, // Annex IX "discontinuous fibre / filament"
    heatLimitC: 180, // memory
    heatLimitStatus: 'memory',
  }),
  polyester: fibre({
    id: 'polyester',
    names: { eu: 'polyester', us: 'polyester' },
    code: 'PES',
    kind: 'synthetic',
    natural: false,
    dyeClasses: ['disperse'],
    stainedBy: [],
    takesLittleDye: false,
    dopeDyedOnly: false,
    regainPct: 0.4, // memory
    regainStatus: 'memory',
    euAllowancePct: 1.5,
    heatLimitC: 200, // memory
    heatLimitStatus: 'memory',
  }),
  'polyester-cd': fibre({
    id: 'polyester-cd',
    // Cationic-dyeable polyester is still polyester on the label (Annex I No 35).
    names: { eu: 'polyester', us: 'polyester' },
    code: 'PES',
    kind: 'synthetic',
    natural: false,
    dyeClasses: ['cationic'], // memory
    stainedBy: ['disperse'], // memory: disperse dyes also colour it, as on regular polyester
    takesLittleDye: false,
    dopeDyedOnly: false,
    regainPct: 0.4, // memory
    regainStatus: 'memory',
    euAllowancePct: 1.5,
    heatLimitC: 190, // memory
    heatLimitStatus: 'memory',
  }),
  elastane: fibre({
    id: 'elastane',
    names: { eu: 'elastane', us: 'spandex', usAlternatives: ['elastane'] },
    code: 'EL',
    kind: 'elastomeric',
    natural: false,
    dyeClasses: [],
    // references.md §8: elastane has "higher affinity for disperse dyes than do polyester fibres;
    // Heavy staining" (verified-2nd).
    stainedBy: ['disperse'],
    takesLittleDye: true,
    dopeDyedOnly: false,
    regainPct: 1.3, // memory
    regainStatus: 'memory',
    euAllowancePct: 1.5,
    // Common practice, no published source: keep baths at or below 120 °C; references.md §8 records
    // (verified-2nd) that dyeing at 130 °C draws the elastane permanently and costs recovery.
    wetLimitC: 120,
    wetLimitStatus: 'memory',
    // Low-authority secondary source: "may be affected or be damaged at a temperature above 180".
    heatLimitC: 180,
    heatLimitStatus: 'verified-2nd',
  }),
  cotton: fibre({
    id: 'cotton',
    names: { eu: 'cotton', us: 'cotton' },
    code: 'CO',
    kind: 'cellulosic',
    natural: true,
    dyeClasses: cellulosicDyes,
    stainedBy: [],
    takesLittleDye: false,
    dopeDyedOnly: false,
    regainPct: 8.5, // ASTM D1909-13, verified-2nd
    regainStatus: 'verified-2nd',
    euAllowancePct: 8.5, // Annex IX normal fibres (mercerised 10.50)
    heatLimitC: 200, // memory
    heatLimitStatus: 'memory',
  }),
  wool: fibre({
    id: 'wool',
    names: { eu: 'wool', us: 'wool' },
    code: 'WO',
    kind: 'animal',
    natural: true,
    dyeClasses: ['acid', 'reactive'],
    stainedBy: [],
    takesLittleDye: false,
    dopeDyedOnly: false,
    regainPct: 13.6, // ASTM D1909-13, verified-2nd
    regainStatus: 'verified-2nd',
    // Annex IX: 17.00 carded, and "where it is impossible to ascertain whether … combed or carded";
    // 18.25 combed.
    euAllowancePct: 17.0,
    heatLimitC: 150, // memory
    heatLimitStatus: 'memory',
  }),
  viscose: fibre({
    id: 'viscose',
    names: { eu: 'viscose', us: 'rayon', usAlternatives: ['viscose'] },
    code: 'CV',
    kind: 'cellulosic',
    natural: false,
    dyeClasses: cellulosicDyes,
    stainedBy: [],
    takesLittleDye: false,
    dopeDyedOnly: false,
    regainPct: 11.0, // memory
    regainStatus: 'memory',
    euAllowancePct: 13.0,
    heatLimitC: 180, // memory
    heatLimitStatus: 'memory',
  }),
  modal: fibre({
    id: 'modal',
    // US: ISO 2076 name 'modal' (incorporated into §303.7, verified-2nd); FTC generic 'rayon' (memory).
    names: { eu: 'modal', us: 'modal', usAlternatives: ['rayon'], usGeneric: 'rayon' },
    code: 'CMD',
    kind: 'cellulosic',
    natural: false,
    dyeClasses: cellulosicDyes,
    stainedBy: [],
    takesLittleDye: false,
    dopeDyedOnly: false,
    regainPct: 11.0, // memory
    regainStatus: 'memory',
    euAllowancePct: 13.0,
    heatLimitC: 180, // memory
    heatLimitStatus: 'memory',
  }),
  lyocell: fibre({
    id: 'lyocell',
    // US: subclass of rayon, §303.7(d)(1) (memory).
    names: { eu: 'lyocell', us: 'lyocell', usAlternatives: ['rayon'], usGeneric: 'rayon' },
    code: 'CLY',
    kind: 'cellulosic',
    natural: false,
    dyeClasses: cellulosicDyes,
    stainedBy: [],
    takesLittleDye: false,
    dopeDyedOnly: false,
    regainPct: 11.0, // memory
    regainStatus: 'memory',
    euAllowancePct: 13.0,
    heatLimitC: 180, // memory
    heatLimitStatus: 'memory',
  }),
  acrylic: fibre({
    id: 'acrylic',
    names: { eu: 'acrylic', us: 'acrylic' },
    code: 'PAN',
    kind: 'synthetic',
    natural: false,
    dyeClasses: ['cationic'],
    stainedBy: [],
    takesLittleDye: false,
    dopeDyedOnly: false,
    regainPct: 1.5, // memory
    regainStatus: 'memory',
    euAllowancePct: 2.0,
    heatLimitC: 150, // memory
    heatLimitStatus: 'memory',
  }),
  polypropylene: fibre({
    id: 'polypropylene',
    // US: FTC generic 'olefin' (memory); ISO 2076 'polypropylene'.
    names: { eu: 'polypropylene', us: 'olefin', usAlternatives: ['polypropylene'] },
    code: 'PP',
    kind: 'synthetic',
    natural: false,
    // references.md §8: "Unmodified polypropylene fiber is difficult to dye" (verified-2nd).
    dyeClasses: [],
    stainedBy: [],
    takesLittleDye: false,
    dopeDyedOnly: true,
    regainPct: 0.0, // memory
    regainStatus: 'memory',
    euAllowancePct: 2.0,
    heatLimitC: 120, // memory: it softens well below its melting point
    heatLimitStatus: 'memory',
  }),
  elastomultiester: fibre({
    id: 'elastomultiester',
    // US: polyester subclass 'elasterell-p' (verified, 67 FR 70835 abstract); ISO 'elastomultiester'.
    names: { eu: 'elastomultiester', us: 'elasterell-p', usAlternatives: ['elastomultiester'] },
    code: 'ELE',
    kind: 'elastomeric',
    natural: false,
    dyeClasses: ['disperse'], // memory
    stainedBy: [],
    takesLittleDye: false,
    dopeDyedOnly: false,
    regainPct: 0.4, // memory
    regainStatus: 'memory',
    euAllowancePct: 1.5,
    heatLimitC: 180, // memory
    heatLimitStatus: 'memory',
  }),
  polylactide: fibre({
    id: 'polylactide',
    // US: FTC generic 'PLA', §303.7(y) (memory).
    names: { eu: 'polylactide', us: 'PLA', usAlternatives: ['polylactide'] },
    code: 'PLA',
    kind: 'synthetic',
    natural: false,
    dyeClasses: ['disperse'], // memory
    stainedBy: [],
    takesLittleDye: false,
    dopeDyedOnly: false,
    regainPct: 0.5, // memory
    regainStatus: 'memory',
    euAllowancePct: 1.5,
    wetLimitC: 115, // memory: it loses strength in hot water above about this
    wetLimitStatus: 'memory',
    // Annex I No 34 requires "a melting temperature of at least 135 °C" (verified); keep below it.
    heatLimitC: 130,
    heatLimitStatus: 'computed',
  }),
} as const satisfies Record<string, Fibre>;

export type FibreId = keyof typeof fibres;

export const fibreIds = Object.keys(fibres) as FibreId[];

/** True if `id` names a fibre of the registry. */
export function isFibreId(id: string): id is FibreId {
  return Object.prototype.hasOwnProperty.call(fibres, id);
}

/**
 * The EU agreed allowance (%) of a fibre, Regulation (EU) No 1007/2011 Annex IX.
 * Polyamide is taken as filament (5.75) unless `staple` is true (6.25).
 */
export function euAllowancePct(fibreId: FibreId, opts: { staple?: boolean } = {}): number {
  const f: Fibre = fibres[fibreId];
  if (f.euAllowanceByForm) return opts.staple ? f.euAllowanceByForm.staple : f.euAllowanceByForm.filament;
  return f.euAllowancePct;
}
