import type { Knex } from 'knex';
import type { SessionUser } from '../../lib/db/users';
import { createYarn } from '../../lib/db/yarns';
import { createTexture } from '../../lib/db/textures';
import { textureInputSchema, yarnInputSchema, type TextureEntry, type YarnEntry } from '../../lib/validations/library';

/**
 * Demo data: the studio library of the demo studio (runs after 01_demo_studio, looks its rows up by
 * name). Yarns, textures, the textures each demo style uses, and two trims. Every name and supplier
 * reference here is invented for the demo.
 *
 * Textures are for a 28-gauge body-size circular machine (pitch 25.4 / 28 = 0.91 mm). What is common
 * practice and what is invented:
 * - Common practice, no published source: plating bare elastane in every course of compression
 *   structures, at a draft of about 2.5 to 3; tuck loops shorter than knit loops; tucks stacked
 *   two or three high at most; floats kept well under 6 mm; mock ribs from knit/tuck, mesh from
 *   tuck and miss, piqué from paired tucks, float jacquard from knit/miss in two ground yarns,
 *   rib-like columns from a needle that misses in alternate courses.
 * - Invented for the demo, within the ranges usual for relaxed plated fabric at this gauge: every
 *   density (wales and courses per cm), every loop length, every force–extension curve, every price.
 */

const yarns: YarnEntry[] = [
  {
    name: 'Polyamide 6.6 78/68 semi-dull', supplierRef: 'HFY-PA78-68SD', count: '78 dtex f68', lustre: 'semi-dull',
    makeUp: { kind: 'single', fibre: 'polyamide' }, colour: { state: 'dyeable' }, pricePerKg: 7.4,
  },
  {
    name: 'Polyamide 44/34 full-dull', supplierRef: 'HFY-PA44-34FD', count: { value: 44, unit: 'dtex' }, filaments: 34, lustre: 'full-dull',
    makeUp: { kind: 'single', fibre: 'polyamide' }, colour: { state: 'dyeable' }, pricePerKg: 8.1,
  },
  {
    name: 'Bare elastane 22 dtex', supplierRef: 'HFY-EL22-B', count: { value: 22, unit: 'dtex' },
    makeUp: { kind: 'single', fibre: 'elastane' }, colour: { state: 'dyeable' }, pricePerKg: 11.5,
  },
  {
    name: 'Bare elastane 44 dtex', supplierRef: 'HFY-EL44-B', count: { value: 44, unit: 'dtex' },
    makeUp: { kind: 'single', fibre: 'elastane' }, colour: { state: 'dyeable' }, pricePerKg: 9.8,
  },
  {
    name: 'Covered 20 den elastane / 40 den polyamide', supplierRef: 'HFY-SCY-2040',
    makeUp: {
      kind: 'covered',
      core: { fibre: 'elastane', count: { value: 20, unit: 'den' }, draft: 3.2 },
      cover: { fibre: 'polyamide', count: { value: 40, unit: 'den' }, takeUpPct: 12 },
    },
    colour: { state: 'dyeable' }, pricePerKg: 10.2,
  },
  {
    name: 'Polyester 84/72 recycled', supplierRef: 'HFY-PES84-72R', count: '84 dtex f72', lustre: 'semi-dull',
    makeUp: { kind: 'single', fibre: 'polyester' }, colour: { state: 'dyeable' }, pricePerKg: 3.9, recycledPct: 100,
  },
  {
    name: 'Cationic-dyeable polyester 84/72', supplierRef: 'HFY-CD84-72', count: '84 dtex f72', lustre: 'semi-dull',
    makeUp: { kind: 'single', fibre: 'polyester-cd' }, colour: { state: 'dyeable' }, pricePerKg: 4.6,
  },
  {
    name: 'Polypropylene 110/48 dope-dyed black', supplierRef: 'HFY-PP110-48K', count: '110 dtex f48', lustre: 'full-dull',
    makeUp: { kind: 'single', fibre: 'polypropylene' }, colour: { state: 'dope-dyed', lab: { L: 18.5, a: 0.4, b: -1.2 } }, pricePerKg: 3.2,
  },
  {
    name: 'Modal Ne 40/1', supplierRef: 'HFY-CMD-NE40', count: 'Ne 40/1', staple: true,
    makeUp: { kind: 'single', fibre: 'modal' }, colour: { state: 'dyeable' }, pricePerKg: 6.1,
  },
];

type YarnKey = 'pa78' | 'pa44' | 'el22' | 'el44' | 'covered' | 'pes84' | 'cd84' | 'pp110' | 'modal';
const yarnKeys: YarnKey[] = ['pa78', 'pa44', 'el22', 'el44', 'covered', 'pes84', 'cd84', 'pp110', 'modal'];

interface TextureSpec extends Omit<TextureEntry, 'feeders' | 'forceExtension'> {
  /** One feeder per course: ground yarn key, optional plated yarn key and draft. */
  feeders: { ground: YarnKey; plated?: [YarnKey, number] }[];
  forceExtension?: { extension: number; tensionNPerCm: number }[];
}

const every = (courses: number, f: TextureSpec['feeders'][number]) => Array.from({ length: courses }, () => f);

/** Force–extension points (extension as a fraction, N per cm width): invented for the demo. */
const compressionCurve = [
  { extension: 0.1, tensionNPerCm: 0.3 },
  { extension: 0.2, tensionNPerCm: 0.7 },
  { extension: 0.3, tensionNPerCm: 1.2 },
  { extension: 0.4, tensionNPerCm: 1.8 },
  { extension: 0.6, tensionNPerCm: 3.3 },
];
const firmCurve = [
  { extension: 0.1, tensionNPerCm: 0.5 },
  { extension: 0.2, tensionNPerCm: 1.1 },
  { extension: 0.3, tensionNPerCm: 1.9 },
  { extension: 0.4, tensionNPerCm: 2.8 },
  { extension: 0.6, tensionNPerCm: 5.0 },
];

const textures: TextureSpec[] = [
  {
    name: 'Plain plated jersey', family: 'jersey', function: null,
    repeat: { needles: 4, courses: 4, cells: ['kkkk', 'kkkk', 'kkkk', 'kkkk'] },
    feeders: every(4, { ground: 'pa78', plated: ['el22', 2.6] }),
    density: { walesPerCm: 21, coursesPerCm: 29 }, loopMm: { knit: 2.4, tuck: 1.8 },
    notes: 'The ground of most bodies: every course plated with 22 dtex elastane.',
  },
  {
    name: '1×1 mock rib', family: 'mock-rib', function: 'support',
    repeat: { needles: 2, courses: 2, cells: ['kt', 'kk'] },
    feeders: every(2, { ground: 'pa78', plated: ['el22', 2.6] }),
    density: { walesPerCm: 22, coursesPerCm: 31 }, loopMm: { knit: 2.3, tuck: 1.7 },
    notes: 'Tuck on every second needle in every second course: a soft vertical line.',
  },
  {
    name: '2×1 mock rib compression', family: 'mock-rib', function: 'compression',
    repeat: { needles: 3, courses: 2, cells: ['kkt', 'kkk'] },
    feeders: every(2, { ground: 'pa78', plated: ['el44', 2.8] }),
    density: { walesPerCm: 24, coursesPerCm: 33 }, loopMm: { knit: 2.2, tuck: 1.6 },
    forceExtension: compressionCurve,
    notes: 'Compression panels: 44 dtex elastane plated in every course. Force–extension points are invented demo values.',
  },
  {
    name: 'Firm compression jersey', family: 'jersey', function: 'compression',
    repeat: { needles: 4, courses: 4, cells: ['kkkk', 'kkkk', 'kkkk', 'kkkk'] },
    feeders: every(4, { ground: 'covered', plated: ['el22', 2.8] }),
    density: { walesPerCm: 28, coursesPerCm: 40 }, loopMm: { knit: 2.0, tuck: 1.5 },
    forceExtension: firmCurve,
    notes: 'Covered-elastane ground with bare elastane plated: the firmest hold in the library. Force–extension points are invented demo values.',
  },
  {
    // Rib-like: a knit/miss column structure in single jersey. Common practice, no published source:
    // one needle in four missing every second course, so its loop is held over two courses and the
    // three knitted wales between stand out as rib-like columns; 22 dtex elastane plated in every
    // course for recovery. Invented for the demo: the density (the missed column draws the fabric in
    // widthwise, so more wales per cm than the plain jersey), the loop lengths and the draft.
    name: 'Knit-miss rib-look columns', family: 'rib-like', function: 'support',
    repeat: { needles: 4, courses: 2, cells: ['kkkm', 'kkkk'] },
    feeders: every(2, { ground: 'pa78', plated: ['el22', 2.6] }),
    density: { walesPerCm: 24, coursesPerCm: 31 }, loopMm: { knit: 2.3, tuck: 1.7 },
    notes: 'One needle in four misses every second course: the held loop sinks and the knitted wales stand out as ribs. Floats of one needle (0.9 mm).',
  },
  {
    name: 'Micro-mesh tuck-miss', family: 'mesh', function: 'ventilation',
    repeat: { needles: 4, courses: 4, cells: ['tkmk', 'kkkk', 'mktk', 'kkkk'] },
    feeders: every(4, { ground: 'pa44', plated: ['el22', 2.5] }),
    density: { walesPerCm: 22, coursesPerCm: 30 }, loopMm: { knit: 2.3, tuck: 1.8 },
    notes: 'Open, light structure for back and underarm ventilation.',
  },
  {
    name: 'Piqué support', family: 'pique', function: 'support',
    repeat: { needles: 2, courses: 4, cells: ['kt', 'kt', 'tk', 'tk'] },
    feeders: every(4, { ground: 'pa78', plated: ['el22', 2.6] }),
    density: { walesPerCm: 19, coursesPerCm: 34 }, loopMm: { knit: 2.5, tuck: 1.9 },
    notes: 'Paired tucks alternating between needles: a firm cellular surface.',
  },
  {
    name: 'Float jacquard colour block', family: 'float-jacquard', function: 'colour-block',
    repeat: { needles: 8, courses: 4, cells: ['kkkkmmmm', 'mmmmkkkk', 'kkkkmmmm', 'mmmmkkkk'] },
    feeders: [
      { ground: 'pa78', plated: ['el22', 2.6] },
      { ground: 'cd84', plated: ['el22', 2.6] },
      { ground: 'pa78', plated: ['el22', 2.6] },
      { ground: 'cd84', plated: ['el22', 2.6] },
    ],
    density: { walesPerCm: 21, coursesPerCm: 40 }, loopMm: { knit: 2.4, tuck: 1.8 },
    notes: 'Polyamide and cationic-dyeable polyester alternate: one garment-dyeing run gives two tones. Floats of four needles (3.6 mm).',
  },
  {
    name: 'Terry-like support loops', family: 'terry', function: 'support',
    repeat: { needles: 4, courses: 4, cells: ['kkkk', 'tmtm', 'kkkk', 'mtmt'] },
    feeders: [
      { ground: 'pa78', plated: ['el22', 2.6] },
      { ground: 'modal' },
      { ground: 'pa78', plated: ['el22', 2.6] },
      { ground: 'modal' },
    ],
    density: { walesPerCm: 20, coursesPerCm: 36 }, loopMm: { knit: 2.4, tuck: 2.1 },
    notes: 'Modal held in tucks and short floats on the technical back: a soft cushioned face against the skin.',
  },
  {
    name: 'Eyelet ventilation mesh', family: 'mesh', function: 'ventilation',
    repeat: { needles: 4, courses: 8, cells: ['kkkk', 'ktkk', 'ktkk', 'ktkk', 'kkkk', 'kkkt', 'kkkt', 'kkkt'] },
    feeders: every(8, { ground: 'pa44', plated: ['el22', 2.5] }),
    density: { walesPerCm: 20, coursesPerCm: 30 }, loopMm: { knit: 2.3, tuck: 1.8 },
    notes: 'Three tucks stacked on one needle open an eyelet; the eyelets alternate by half a repeat.',
  },
  {
    name: 'Black wicking jersey', family: 'jersey', function: null,
    repeat: { needles: 4, courses: 4, cells: ['kkkk', 'kkkk', 'kkkk', 'kkkk'] },
    feeders: every(4, { ground: 'pp110', plated: ['el22', 2.6] }),
    density: { walesPerCm: 20, coursesPerCm: 27 }, loopMm: { knit: 2.6, tuck: 1.9 },
    notes: 'Dope-dyed black polypropylene: takes no dye, stays black through garment dyeing.',
  },
];

/** Which textures each demo style uses, by style code. */
const styleTextures: Record<string, string[]> = {
  'HF27-101': ['Plain plated jersey', '2×1 mock rib compression', 'Eyelet ventilation mesh', 'Float jacquard colour block'],
  'HF27-102': ['Plain plated jersey', 'Micro-mesh tuck-miss', 'Eyelet ventilation mesh'],
  'HF27-103': ['Firm compression jersey', '2×1 mock rib compression', 'Piqué support'],
  'HF27-104': ['1×1 mock rib', 'Micro-mesh tuck-miss', 'Terry-like support loops'],
  'HF27-105': ['Plain plated jersey', 'Micro-mesh tuck-miss', 'Piqué support'],
  'HF27-106': ['Plain plated jersey', 'Black wicking jersey'],
  'HF26-118': ['Plain plated jersey', 'Terry-like support loops', 'Black wicking jersey'],
};

export async function seed(knex: Knex): Promise<void> {
  await knex.raw('truncate table trims, style_textures, textures, yarns restart identity cascade');

  const studio = await knex('studios').where({ name: 'Hollowfell Knit Lab' }).first();
  const designer = await knex('users').where({ email: 'designer@hollowfell.example' }).first();
  if (!studio || !designer) throw new Error('Run 01_demo_studio first: the demo studio or its designer is missing.');
  const user: SessionUser = {
    id: designer.id, studioId: studio.id, studioName: studio.name, organisationId: null, organisationName: null,
    email: designer.email, name: designer.name, role: 'designer',
  };

  // Through the library's own schemas and data layer, so the demo data passes the same checks.
  const yarnIds = {} as Record<YarnKey, string>;
  for (const [i, entry] of yarns.entries()) {
    const created = await createYarn(user, yarnInputSchema.parse(entry), knex);
    yarnIds[yarnKeys[i]!] = created.id;
  }

  const textureIds = new Map<string, string>();
  for (const spec of textures) {
    const entry: TextureEntry = {
      ...spec,
      feeders: spec.feeders.map((f) => ({
        ground: yarnIds[f.ground],
        ...(f.plated ? { plated: { yarn: yarnIds[f.plated[0]], draft: f.plated[1] } } : {}),
      })),
    };
    const created = await createTexture(user, textureInputSchema.parse(entry), knex);
    textureIds.set(spec.name, created.id);
  }

  for (const [code, names] of Object.entries(styleTextures)) {
    const style = await knex('styles').where({ studio_id: studio.id, code }).first();
    if (!style) continue;
    await knex('style_textures').insert(
      names.map((name, position) => {
        const id = textureIds.get(name);
        if (!id) throw new Error(`Seed: no texture named ${name}`);
        return { style_id: style.id, texture_id: id, position, added_by: designer.id };
      }),
    );
  }

  // Two trims on the compression long sleeve: a heat-pressed logo on the front, a sewn care label at the back neck.
  const ridge = await knex('styles').where({ studio_id: studio.id, code: 'HF27-101' }).first();
  if (ridge) {
    await knex('trims').insert([
      {
        style_id: ridge.id, panel_kind: 'front', name: 'Chest logo', kind: 'heat-transfer', method: 'heat-press', temp_c: 150,
        box: JSON.stringify({ x: 420, y: 240, width: 90, height: 60 }), created_by: designer.id,
      },
      {
        style_id: ridge.id, panel_kind: 'back', name: 'Care label', kind: 'care-label', method: 'sewn', temp_c: null,
        box: JSON.stringify({ x: 288, y: 40, width: 40, height: 30 }), created_by: designer.id,
      },
    ]);
  }
}
