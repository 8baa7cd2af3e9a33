/**
 * The studio library's schemas (yarns, textures), a style's texture list and its trims: shared by
 * the route handlers and the forms. Counts are accepted in any unit and stored in dtex; the maths
 * comes from lib/knit (convertCount, parseCount, coveredYarn, validateYarn, validateTexture).
 */
import { z } from 'zod';
import { convertCount, countUnits, CountParseError, parseCount, type CountUnit } from '@/lib/knit/count';
import { fibreIds, fibres, type FibreId } from '@/lib/knit/fibres';
import { panelKinds } from '@/lib/knit/panel';
import {
  stitchActions, validateTexture, type Feeder, type ForceExtensionPoint, type StitchAction, type Texture,
} from '@/lib/knit/texture';
import { coveredYarn, validateYarn, type LabColour, type Yarn, type YarnColour, type YarnFibre } from '@/lib/knit/yarn';
import { trimKinds, trimMethods } from '@/lib/rules/trim';
import { chartLimits, decodeCourse, encodeCells } from '@/lib/library/chart';
import { readDecimal } from './number';

// ---------------------------------------------------------------------------------------------
// Small helpers

const isBlank = (v: unknown) => v === '' || v === null || v === undefined || (typeof v === 'number' && Number.isNaN(v));
const toNumber = (v: unknown) => (typeof v === 'string' && v.trim() !== '' ? readDecimal(v.replace(',', '.')) : v);

/** A required number between `min` and `max`; form strings are read as numbers. */
const num = (what: string, min: number, max: number, opts: { exclusiveMin?: boolean } = {}) =>
  z.preprocess(
    (v) => (isBlank(v) ? undefined : toNumber(v)),
    z
      .number({ error: (iss) => (iss.input === undefined ? `${what} is required` : `${what} must be a number`) })
      .refine((n) => (opts.exclusiveMin ? n > min : n >= min), {
        message: opts.exclusiveMin ? `${what} must be above ${min}` : `${what} must be at least ${min}`,
      })
      .refine((n) => n <= max, { message: `${what} must be at most ${max}` }),
  );

/** A whole number between `min` and `max`. */
const int = (what: string, min: number, max: number) =>
  num(what, min, max).refine((n) => Number.isInteger(n), { message: `${what} must be a whole number` });

/** An optional number: blank means null. */
const optionalNum = (what: string, min: number, max: number) =>
  z.preprocess(
    (v) => (isBlank(v) ? null : toNumber(v)),
    z
      .number({ error: `${what} must be a number` })
      .min(min, `${what} must be at least ${min}`)
      .max(max, `${what} must be at most ${max}`)
      .nullable(),
  );

const name = (what: string) => z.string({ error: `${what} is required` }).trim().min(2, `${what} needs at least 2 characters`).max(120, `${what} is at most 120 characters`);

export const idParamSchema = z.object({ id: z.string().uuid('Not a valid id') });
export const trimParamsSchema = z.object({ id: z.string().uuid('Not a valid id'), trimId: z.string().uuid('Not a valid id') });
const version = z.number({ error: 'The version you edited is required' }).int().positive('The version you edited is required');

// ---------------------------------------------------------------------------------------------
// Counts

export const countUnitLabels: Record<CountUnit, string> = { dtex: 'dtex', den: 'den', tex: 'tex', Nm: 'Nm', Ne: 'Ne' };

/** A count as the form sends it. */
export interface CountEntry {
  value: number;
  unit: CountUnit;
}

/** A count read as dtex, with the unit it was entered in. */
export interface ReadCount {
  dtex: number;
  unit: CountUnit;
  filaments?: number;
}

/**
 * A yarn count in any unit: `{ value, unit }` (unit one of tex, dtex, den, Nm, Ne) or a string as a
 * designer types it ("78 dtex f68", "Ne 40/1", "20D"). Read into dtex with lib/knit/count.ts.
 */
export const countEntrySchema = z
  .preprocess(
    (v, ctx) => {
      if (typeof v !== 'string') return v;
      try {
        const p = parseCount(v);
        return { value: convertCount(p.dtex, 'dtex', p.unit), unit: p.unit, ...(p.filaments !== undefined ? { filaments: p.filaments } : {}), dtex: p.dtex };
      } catch (err) {
        ctx.addIssue({ code: 'custom', message: err instanceof CountParseError ? err.message : 'Not a yarn count' });
        return z.NEVER;
      }
    },
    z.object({
      value: num('The count', 0, 100_000, { exclusiveMin: true }),
      unit: z.enum(countUnits, { error: 'Choose tex, dtex, den, Nm or Ne' }),
      filaments: z.number().int().positive().optional(),
      dtex: z.number().positive().optional(),
    }),
  )
  .transform((c): ReadCount => {
    const dtex = c.dtex ?? convertCount(c.value, c.unit, 'dtex');
    return c.filaments !== undefined ? { dtex, unit: c.unit, filaments: c.filaments } : { dtex, unit: c.unit };
  })
  .refine((c) => c.dtex >= 5 && c.dtex <= 5000, { message: 'A knitting yarn lies between 5 and 5000 dtex' });

/** A dtex value shown back in the unit it was entered in, rounded for the form. */
export function countEntryOf(dtex: number, unit: CountUnit): CountEntry {
  const v = convertCount(dtex, 'dtex', unit);
  return { value: Number(v.toPrecision(6)), unit };
}

// ---------------------------------------------------------------------------------------------
// Yarns

export const lustres = ['bright', 'semi-dull', 'full-dull'] as const;
export type Lustre = (typeof lustres)[number];
export const lustreLabels: Record<Lustre, string> = { bright: 'Bright', 'semi-dull': 'Semi-dull', 'full-dull': 'Full-dull' };

export const colourStates = ['dyeable', 'dope-dyed', 'yarn-dyed'] as const;
export type ColourState = (typeof colourStates)[number];
export const colourStateLabels: Record<ColourState, string> = { dyeable: 'Dyeable', 'dope-dyed': 'Dope-dyed', 'yarn-dyed': 'Yarn-dyed' };

export const makeUpKinds = ['single', 'blend', 'covered'] as const;
export type MakeUpKind = (typeof makeUpKinds)[number];
export const makeUpKindLabels: Record<MakeUpKind, string> = { single: 'Single fibre', blend: 'Blend', covered: 'Covered elastane' };

const fibreIdSchema = z.enum(fibreIds as [FibreId, ...FibreId[]], { error: 'Choose a fibre' });

const labSchema = z.object({
  L: num('L*', 0, 100),
  a: num('a*', -128, 128),
  b: num('b*', -128, 128),
});

const colourSchema = z.discriminatedUnion(
  'state',
  [
    z.object({ state: z.literal('dyeable') }),
    z.object({ state: z.literal('dope-dyed'), lab: labSchema }),
    z.object({ state: z.literal('yarn-dyed'), lab: labSchema }),
  ],
  { error: 'Choose dyeable, dope-dyed or yarn-dyed' },
);

const makeUpSchema = z.discriminatedUnion(
  'kind',
  [
    z.object({ kind: z.literal('single'), fibre: fibreIdSchema }),
    z.object({
      kind: z.literal('blend'),
      fibres: z
        .array(z.object({ fibre: fibreIdSchema, sharePct: num('Share', 0, 100, { exclusiveMin: true }) }))
        .min(2, 'A blend has at least two fibres')
        .max(6, 'A blend has at most six fibres'),
    }),
    z.object({
      kind: z.literal('covered'),
      core: z.object({ fibre: fibreIdSchema.default('elastane'), count: countEntrySchema, draft: num('Draft', 1, 8) }),
      cover: z.object({ fibre: fibreIdSchema, count: countEntrySchema, takeUpPct: num('Take-up', 0, 200) }),
    }),
  ],
  { error: 'Choose single fibre, blend or covered elastane' },
);

/** The make-up as stored: shares as fractions, counts in dtex with the unit they were entered in. */
export type StoredMakeUp =
  | { kind: 'single'; fibre: FibreId }
  | { kind: 'blend'; fibres: { fibre: FibreId; share: number }[] }
  | {
      kind: 'covered';
      core: { fibre: FibreId; dtex: number; unit: CountUnit; draft: number };
      cover: { fibre: FibreId; dtex: number; unit: CountUnit; takeUp: number };
    };

const yarnFields = {
  name: name('Name'),
  supplierRef: z.string().trim().max(60, 'At most 60 characters').default(''),
  /** The yarn's count; for a covered yarn it follows from core and cover and may be left out. */
  count: countEntrySchema.optional(),
  filaments: z.preprocess((v) => (isBlank(v) ? null : toNumber(v)), z.number({ error: 'Filaments must be a number' }).int('Filaments must be a whole number').min(1, 'At least one filament').max(2000).nullable()).optional(),
  lustre: z.preprocess((v) => (isBlank(v) ? null : v), z.enum(lustres, { error: 'Choose a lustre' }).nullable()).default(null),
  staple: z.boolean().default(false),
  makeUp: makeUpSchema,
  colour: colourSchema,
  pricePerKg: optionalNum('Price per kg', 0, 10_000).default(null),
  recycledPct: optionalNum('Recycled share', 0, 100).default(null),
};

/** A yarn as the library stores it: what createYarn and updateYarn write. */
export interface YarnInput {
  name: string;
  supplierRef: string;
  dtex: number;
  countUnit: CountUnit;
  filaments: number | null;
  lustre: Lustre | null;
  staple: boolean;
  makeUp: StoredMakeUp;
  fibres: YarnFibre[];
  colour: YarnColour;
  pricePerKg: number | null;
  recycledShare: number | null;
}

const SHARE_PCT_TOLERANCE = 0.05;

/**
 * A yarn entry: validated, counts read into dtex, blend shares and the covered yarn's make-up
 * (lib/knit/yarn.ts `coveredYarn`) turned into fibre shares, checked with `validateYarn`.
 */
export const yarnInputSchema = z
  .object(yarnFields)
  .superRefine((y, ctx) => {
    if (y.makeUp.kind !== 'covered' && !y.count) {
      ctx.addIssue({ code: 'custom', path: ['count'], message: 'Enter the count, e.g. 78 dtex' });
    }
    if (y.makeUp.kind === 'blend') {
      const sum = y.makeUp.fibres.reduce((s, f) => s + f.sharePct, 0);
      if (Math.abs(sum - 100) > SHARE_PCT_TOLERANCE) {
        ctx.addIssue({ code: 'custom', path: ['makeUp', 'fibres'], message: `Shares add up to ${Number(sum.toFixed(2))} %, not 100 %` });
      }
      const seen = new Set<string>();
      y.makeUp.fibres.forEach((f, i) => {
        if (seen.has(f.fibre)) ctx.addIssue({ code: 'custom', path: ['makeUp', 'fibres', i, 'fibre'], message: 'This fibre is listed twice' });
        seen.add(f.fibre);
      });
    }
    if (y.makeUp.kind === 'covered' && fibres[y.makeUp.core.fibre].kind !== 'elastomeric') {
      ctx.addIssue({ code: 'custom', path: ['makeUp', 'core', 'fibre'], message: 'The core of a covered yarn is an elastomeric fibre (elastane)' });
    }
    if (y.colour.state === 'dyeable') {
      const undyeable = makeUpFibres(y.makeUp).filter((f) => fibres[f].dopeDyedOnly);
      if (undyeable.length > 0) {
        ctx.addIssue({
          code: 'custom',
          path: ['colour', 'state'],
          message: `${undyeable.map((f) => fibres[f].names.eu).join(', ')} cannot be dyed in the piece: mark the yarn dope-dyed with its colour`,
        });
      }
    }
  })
  .transform((y, ctx): YarnInput => {
    let dtex: number;
    let countUnit: CountUnit;
    let shares: YarnFibre[];
    let makeUp: StoredMakeUp;
    let filaments = y.filaments ?? null;
    switch (y.makeUp.kind) {
      case 'single':
        dtex = y.count!.dtex;
        countUnit = y.count!.unit;
        makeUp = { kind: 'single', fibre: y.makeUp.fibre };
        shares = [{ fibre: y.makeUp.fibre, share: 1 }];
        break;
      case 'blend': {
        dtex = y.count!.dtex;
        countUnit = y.count!.unit;
        const sum = y.makeUp.fibres.reduce((s, f) => s + f.sharePct, 0);
        // Normalised so the shares sum to 1 exactly (entries like 33.3 + 33.3 + 33.4 are accepted).
        const blend = y.makeUp.fibres.map((f) => ({ fibre: f.fibre, share: f.sharePct / sum }));
        makeUp = { kind: 'blend', fibres: blend };
        shares = blend.map((f) => ({ ...f }));
        break;
      }
      case 'covered': {
        const { core, cover } = y.makeUp;
        const made = coveredYarn(
          { fibre: core.fibre, dtex: core.count.dtex, draft: core.draft },
          { fibre: cover.fibre, dtex: cover.count.dtex, takeUp: cover.takeUpPct / 100 },
        );
        dtex = made.dtex;
        countUnit = y.count?.unit ?? cover.count.unit;
        makeUp = {
          kind: 'covered',
          core: { fibre: core.fibre, dtex: core.count.dtex, unit: core.count.unit, draft: core.draft },
          cover: { fibre: cover.fibre, dtex: cover.count.dtex, unit: cover.count.unit, takeUp: cover.takeUpPct / 100 },
        };
        shares = made.fibres.map((f) => ({ fibre: f.fibre, share: f.share }));
        break;
      }
    }
    if (filaments === null && y.count?.filaments !== undefined) filaments = y.count.filaments;
    const colour: YarnColour = y.colour.state === 'dyeable' ? { state: 'dyeable' } : { state: y.colour.state, lab: y.colour.lab as LabColour };
    const out: YarnInput = {
      name: y.name,
      supplierRef: y.supplierRef,
      dtex,
      countUnit,
      filaments,
      lustre: y.lustre,
      staple: y.staple,
      makeUp,
      fibres: shares,
      colour,
      pricePerKg: y.pricePerKg,
      recycledShare: y.recycledPct === null ? null : y.recycledPct / 100,
    };
    const yarn: Yarn = { id: 'new', name: y.name, dtex, fibres: shares, colour, ...(y.staple ? { staple: true } : {}) };
    for (const problem of validateYarn(yarn, 1e-6)) ctx.addIssue({ code: 'custom', path: ['makeUp'], message: problem });
    return out;
  });

/** What the yarn form and the API take (before reading counts and shares). */
export type YarnEntry = z.input<typeof yarnInputSchema>;

/** The fibres a make-up entry names. */
function makeUpFibres(m: z.output<typeof makeUpSchema>): FibreId[] {
  switch (m.kind) {
    case 'single':
      return [m.fibre];
    case 'blend':
      return m.fibres.map((f) => f.fibre);
    case 'covered':
      return [m.core.fibre, m.cover.fibre];
  }
}

/** PATCH: the yarn's version and any fields to change; the result is validated whole. */
export const yarnPatchSchema = z
  .object({
    version,
    name: z.unknown().optional(),
    supplierRef: z.unknown().optional(),
    count: z.unknown().optional(),
    filaments: z.unknown().optional(),
    lustre: z.unknown().optional(),
    staple: z.unknown().optional(),
    makeUp: z.unknown().optional(),
    colour: z.unknown().optional(),
    pricePerKg: z.unknown().optional(),
    recycledPct: z.unknown().optional(),
  })
  .strict();
export type YarnPatch = z.infer<typeof yarnPatchSchema>;

/** The stored yarn as a form entry (counts shown back in the unit they were entered in). */
export function yarnEntryOf(y: {
  name: string; supplierRef: string; dtex: number; countUnit: CountUnit; filaments?: number | null; lustre: Lustre | null;
  staple: boolean; makeUp: StoredMakeUp; colour: YarnColour; pricePerKg: number | null; recycledShare: number | null;
}): YarnEntry {
  let makeUp: YarnEntry['makeUp'];
  switch (y.makeUp.kind) {
    case 'single':
      makeUp = { kind: 'single', fibre: y.makeUp.fibre };
      break;
    case 'blend':
      makeUp = { kind: 'blend', fibres: y.makeUp.fibres.map((f) => ({ fibre: f.fibre, sharePct: Number((f.share * 100).toFixed(4)) })) };
      break;
    case 'covered':
      makeUp = {
        kind: 'covered',
        core: { fibre: y.makeUp.core.fibre, count: countEntryOf(y.makeUp.core.dtex, y.makeUp.core.unit), draft: y.makeUp.core.draft },
        cover: { fibre: y.makeUp.cover.fibre, count: countEntryOf(y.makeUp.cover.dtex, y.makeUp.cover.unit), takeUpPct: Number((y.makeUp.cover.takeUp * 100).toFixed(4)) },
      };
      break;
  }
  return {
    name: y.name,
    supplierRef: y.supplierRef,
    ...(y.makeUp.kind === 'covered' ? {} : { count: countEntryOf(y.dtex, y.countUnit) }),
    filaments: y.filaments ?? null,
    lustre: y.lustre,
    staple: y.staple,
    makeUp,
    colour: y.colour.state === 'dyeable' ? { state: 'dyeable' } : { state: y.colour.state, lab: { ...y.colour.lab } },
    pricePerKg: y.pricePerKg,
    recycledPct: y.recycledShare === null ? null : Number((y.recycledShare * 100).toFixed(4)),
  };
}

// ---------------------------------------------------------------------------------------------
// Textures

export const textureFamilies = ['jersey', 'mock-rib', 'rib-like', 'mesh', 'pique', 'float-jacquard', 'terry'] as const;
export type TextureFamily = (typeof textureFamilies)[number];
export const textureFamilyLabels: Record<TextureFamily, string> = {
  jersey: 'Jersey',
  'mock-rib': 'Mock rib',
  'rib-like': 'Rib-like',
  mesh: 'Mesh',
  pique: 'Piqué',
  'float-jacquard': 'Float jacquard',
  terry: 'Terry-like',
};

export const textureFunctions = ['compression', 'ventilation', 'support', 'colour-block'] as const;
export type TextureFunction = (typeof textureFunctions)[number];
export const textureFunctionLabels: Record<TextureFunction, string> = {
  compression: 'Compression',
  ventilation: 'Ventilation',
  support: 'Support',
  'colour-block': 'Colour block',
};

/** A course of the chart: a string of k/t/m, or a list of actions. */
const courseSchema = z.preprocess((v, ctx) => {
  if (typeof v !== 'string') return v;
  const row = decodeCourse(v);
  if (!row) {
    ctx.addIssue({ code: 'custom', message: 'Use k (knit), t (tuck) or m (miss) for each needle' });
    return z.NEVER;
  }
  return row;
}, z.array(z.enum(stitchActions, { error: 'Each cell is knit, tuck or miss' })));

const feederSchema = z.object({
  ground: z.string({ error: 'Choose the ground yarn' }).uuid('Choose the ground yarn'),
  plated: z
    .object({
      yarn: z.string({ error: 'Choose the plated yarn' }).uuid('Choose the plated yarn'),
      draft: num('Draft', 1, 6),
    })
    .nullable()
    .optional(),
});

const forceExtensionSchema = z
  .array(z.object({ extension: num('Extension', 0, 4, { exclusiveMin: true }), tensionNPerCm: num('Tension', 0, 100) }))
  .max(24, 'At most 24 points')
  .superRefine((pts, ctx) => {
    pts.forEach((p, i) => {
      const prev = pts[i - 1];
      if (prev && p.extension <= prev.extension) {
        ctx.addIssue({ code: 'custom', path: [i, 'extension'], message: 'Extensions must rise from one point to the next' });
      }
    });
  });

const textureFields = {
  name: name('Name'),
  family: z.enum(textureFamilies, { error: 'Choose a structure family' }),
  function: z.preprocess((v) => (isBlank(v) ? null : v), z.enum(textureFunctions, { error: 'Choose a function' }).nullable()).default(null),
  gauge: num('Gauge', 5, 60).default(28),
  repeat: z.object({
    needles: int('Repeat width', 1, chartLimits.maxNeedles),
    courses: int('Repeat height', 1, chartLimits.maxCourses),
    cells: z.array(courseSchema, { error: 'The chart is required' }).min(1, 'The chart needs at least one course'),
  }),
  feeders: z.array(feederSchema, { error: 'Each course needs a feeder' }).min(1, 'Each course needs a feeder'),
  density: z.object({ walesPerCm: num('Wales per cm', 1, 80), coursesPerCm: num('Courses per cm', 1, 100) }),
  loopMm: z.object({ knit: num('Knit loop length', 0.3, 20), tuck: num('Tuck loop length', 0.2, 20) }),
  forceExtension: z.preprocess((v) => (Array.isArray(v) && v.length === 0 ? null : v), forceExtensionSchema.nullable()).optional(),
  notes: z.string().max(4000, 'Notes are at most 4000 characters').default(''),
};

/** A texture as the library stores it (cells as actions, feeders without empty plating). */
export interface TextureInput {
  name: string;
  family: TextureFamily;
  function: TextureFunction | null;
  gauge: number;
  repeat: { needles: number; courses: number; cells: StitchAction[][] };
  feeders: Feeder[];
  density: { walesPerCm: number; coursesPerCm: number };
  loopMm: { knit: number; tuck: number };
  forceExtension: ForceExtensionPoint[] | null;
  notes: string;
}

/**
 * A texture entry: the chart matches the repeat, one feeder per course, and lib/knit's
 * `validateTexture` passes. Whether the feeders' yarns are the studio's is checked by the data layer.
 */
export const textureInputSchema = z
  .object(textureFields)
  .superRefine((t, ctx) => {
    const { needles, courses, cells } = t.repeat;
    if (cells.length !== courses) {
      ctx.addIssue({ code: 'custom', path: ['repeat', 'cells'], message: `The chart has ${cells.length} courses; the repeat says ${courses}` });
    }
    cells.forEach((row, c) => {
      if (row.length !== needles) {
        ctx.addIssue({ code: 'custom', path: ['repeat', 'cells', c], message: `Course ${c + 1} has ${row.length} needles; the repeat says ${needles}` });
      }
    });
    if (t.feeders.length !== courses) {
      ctx.addIssue({ code: 'custom', path: ['feeders'], message: `Each of the ${courses} courses needs a feeder (${t.feeders.length} given)` });
    }
  })
  .transform((t, ctx): TextureInput => {
    const feeders: Feeder[] = t.feeders.map((f) => (f.plated ? { ground: f.ground, plated: { yarn: f.plated.yarn, draft: f.plated.draft } } : { ground: f.ground }));
    const out: TextureInput = {
      name: t.name,
      family: t.family,
      function: t.function,
      gauge: t.gauge,
      repeat: { needles: t.repeat.needles, courses: t.repeat.courses, cells: t.repeat.cells },
      feeders,
      density: { ...t.density },
      loopMm: { ...t.loopMm },
      forceExtension: t.forceExtension ?? null,
      notes: t.notes,
    };
    for (const problem of validateTexture(toDomainTexture('new', out))) ctx.addIssue({ code: 'custom', path: ['repeat'], message: problem });
    return out;
  });

export type TextureEntry = z.input<typeof textureInputSchema>;

/** PATCH: the texture's version and any fields to change; the result is validated whole. */
export const texturePatchSchema = z
  .object({
    version,
    name: z.unknown().optional(),
    family: z.unknown().optional(),
    function: z.unknown().optional(),
    gauge: z.unknown().optional(),
    repeat: z.unknown().optional(),
    feeders: z.unknown().optional(),
    density: z.unknown().optional(),
    loopMm: z.unknown().optional(),
    forceExtension: z.unknown().optional(),
    notes: z.unknown().optional(),
  })
  .strict();
export type TexturePatch = z.infer<typeof texturePatchSchema>;

/** The lib/knit domain texture of a stored texture. */
export function toDomainTexture(id: string, t: TextureInput): Texture {
  const texture: Texture = {
    id,
    name: t.name,
    repeat: { needles: t.repeat.needles, courses: t.repeat.courses, cells: t.repeat.cells },
    feeders: t.feeders,
    density: t.density,
    loopMm: t.loopMm,
  };
  if (t.forceExtension && t.forceExtension.length > 0) texture.forceExtension = t.forceExtension;
  if (t.notes) texture.notes = t.notes;
  return texture;
}

/** The stored texture as an API entry (chart compact, one string per course). */
export function textureEntryOf(t: TextureInput): TextureEntry {
  return {
    name: t.name,
    family: t.family,
    function: t.function,
    gauge: t.gauge,
    repeat: { needles: t.repeat.needles, courses: t.repeat.courses, cells: encodeCells(t.repeat.cells) },
    feeders: t.feeders.map((f) => (f.plated ? { ground: f.ground, plated: { ...f.plated } } : { ground: f.ground })),
    density: { ...t.density },
    loopMm: { ...t.loopMm },
    forceExtension: t.forceExtension ? t.forceExtension.map((p) => ({ ...p })) : null,
    notes: t.notes,
  };
}

// ---------------------------------------------------------------------------------------------
// A style's textures

export const styleTexturesPutSchema = z
  .object({
    version,
    textureIds: z
      .array(z.string().uuid('Not a texture id'))
      .max(100, 'At most 100 textures per style')
      .refine((ids) => new Set(ids).size === ids.length, { message: 'A texture is listed twice' }),
  })
  .strict();
export type StyleTexturesPut = z.infer<typeof styleTexturesPutSchema>;

// ---------------------------------------------------------------------------------------------
// Trims

export const trimKindLabels: Record<(typeof trimKinds)[number], string> = {
  'heat-transfer': 'Heat transfer',
  'woven-label': 'Woven label',
  'printed-tag': 'Printed tag',
  'care-label': 'Care label',
  'knitted-logo': 'Knitted logo',
};
export const trimMethodLabels: Record<(typeof trimMethods)[number], string> = {
  'heat-press': 'Heat press',
  bonded: 'Bonded',
  sewn: 'Sewn',
  printed: 'Printed',
  knitted: 'Knitted in',
};

/**
 * Field errors when kind and method do not go together: a knitted logo is knitted in, and only a
 * knitted logo is.
 */
export function trimPairingErrors(t: { kind: (typeof trimKinds)[number]; method: (typeof trimMethods)[number] }): Record<string, string[]> {
  if (t.kind === 'knitted-logo' && t.method !== 'knitted') return { method: ['A knitted logo is knitted in'] };
  if (t.kind !== 'knitted-logo' && t.method === 'knitted') return { method: ['Only a knitted logo is knitted in'] };
  return {};
}

const boxSchema = z.object({
  x: num('Box x', 0, 10_000),
  y: num('Box y', 0, 20_000),
  width: num('Box width', 0, 10_000, { exclusiveMin: true }),
  height: num('Box height', 0, 20_000, { exclusiveMin: true }),
});

const trimFields = {
  panelKind: z.enum(panelKinds, { error: 'Choose the panel' }),
  name: z.string().trim().max(80, 'At most 80 characters').default(''),
  kind: z.enum(trimKinds, { error: 'Choose heat transfer, woven label, printed tag, care label or knitted logo' }),
  method: z.enum(trimMethods, { error: 'Choose heat press, bonded, sewn, printed or knitted in' }),
  tempC: optionalNum('Temperature', 20, 400).default(null),
  /** Knitted logo: the artwork's finest line or gap, mm. */
  detailMm: optionalNum('Finest detail', 0.05, 100).default(null),
  box: boxSchema,
};

export const trimInputSchema = z
  .object(trimFields)
  .strict()
  .superRefine((t, ctx) => {
    for (const [path, messages] of Object.entries(trimPairingErrors(t))) {
      for (const message of messages) ctx.addIssue({ code: 'custom', path: [path], message });
    }
  });
export type TrimInput = z.infer<typeof trimInputSchema>;

export const trimPatchSchema = z
  .object({
    version,
    panelKind: trimFields.panelKind.optional(),
    name: z.string().trim().max(80, 'At most 80 characters').optional(),
    kind: trimFields.kind.optional(),
    method: trimFields.method.optional(),
    tempC: optionalNum('Temperature', 20, 400).optional(),
    detailMm: optionalNum('Finest detail', 0.05, 100).optional(),
    box: boxSchema.optional(),
  })
  .strict();
export type TrimPatch = z.infer<typeof trimPatchSchema>;

export const trimDeleteQuerySchema = z.object({
  version: z.preprocess((v) => (isBlank(v) ? undefined : toNumber(v)), z.number().int().positive().optional()),
});

/** `?version=` of archiving a library yarn or texture: the version the caller saw, required (a stale one gets 409). */
export const archiveQuerySchema = z.object({
  version: z.preprocess(
    (v) => (isBlank(v) ? undefined : toNumber(v)),
    z.number({ error: 'Give the version you saw (?version=)' }).int('The version is a whole number').positive('The version is a whole number'),
  ),
});
