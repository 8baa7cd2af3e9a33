import type { Knex } from 'knex';
import type { SessionUser } from '../../lib/db/users';
import { addSampleComment, createSampleRound, loadFit, proposeCorrection, saveSizeSpec } from '../../lib/db/fit';
import { sizeSpecSaveSchema, sampleRoundCreateSchema } from '../../lib/validations/fit';
import type { GirthKey, PointKey } from '../../lib/fit/points';

/**
 * Demo data: the size specs of the compression long sleeve (HF27-101) and the support legging
 * (HF27-103), with the body girths each size is meant for, and one proto round of HF27-101.
 * Runs after 01_demo_studio and 02_library and looks its rows up by style code.
 *
 * Every measurement, body girth, date and comment here is invented for the demo. The grade rules
 * and tolerances are the common-practice defaults of lib/fit/points.ts (no published source),
 * except where a value below says otherwise; the target bands are the common-practice defaults.
 * One size is overridden by hand on purpose (HF27-101 XL waist) so the sheet shows an override
 * and the compression finding it causes.
 */

type Girths = Partial<Record<GirthKey, number>>;

interface DemoSpec {
  code: string;
  base: Partial<Record<PointKey, number>>;
  grades?: Partial<Record<PointKey, number>>;
  overrides?: Partial<Record<PointKey, Record<string, number>>>;
  girths: Record<string, Girths>;
  cutAndSew?: Partial<Record<PointKey, Record<string, number>>>;
  compressionTexture: string;
}

const specs: DemoSpec[] = [
  {
    code: 'HF27-101',
    base: {
      'chest-half': 31, 'waist-half': 27, 'bottom-half': 32, 'body-length-hps': 66, 'sleeve-length': 62, 'across-shoulder': 38, armhole: 19,
    },
    overrides: { 'waist-half': { XL: 36.5 } },
    girths: {
      XS: { chest: 80, waist: 64, hip: 82 },
      S: { chest: 88, waist: 72, hip: 90 },
      M: { chest: 96, waist: 80, hip: 98 },
      L: { chest: 104, waist: 88, hip: 106 },
      XL: { chest: 112, waist: 96, hip: 114 },
    },
    // What a cut-and-sew top of the same client fits at (invented): its seamless equivalent is shown beside it.
    cutAndSew: { 'chest-half': { M: 33.5 }, 'waist-half': { M: 29 } },
    compressionTexture: '2×1 mock rib compression',
  },
  {
    code: 'HF27-103',
    base: {
      'waist-half': 26, 'hip-half': 33.5, 'thigh-half': 21, 'knee-half': 16.5, 'calf-half': 14.5, 'ankle-half': 11, inseam: 70, rise: 24,
    },
    girths: {
      XS: { waist: 62, hip: 86, thigh: 51, calf: 33.5 },
      S: { waist: 68, hip: 92, thigh: 54, calf: 35 },
      M: { waist: 74, hip: 98, thigh: 57, calf: 36.5 },
      L: { waist: 80, hip: 104, thigh: 60, calf: 38 },
    },
    compressionTexture: 'Firm compression jersey',
  },
];

export async function seed(knex: Knex): Promise<void> {
  await knex.raw(
    'truncate table sample_round_photos, sample_corrections, sample_comments, sample_measurements, sample_rounds, cut_and_sew_entries, size_body_girths, size_spec_overrides, size_spec_points, size_specs restart identity cascade',
  );
  // Round photos live in the object store, which the seed does not reach: the demo rounds have none.
  await knex('files').where({ purpose: 'sample-round-photo' }).del();

  const studio = await knex('studios').where({ name: 'Hollowfell Knit Lab' }).first();
  const designer = await knex('users').where({ email: 'designer@hollowfell.example' }).first();
  if (!studio || !designer) throw new Error('Run 01_demo_studio first: the demo studio or its designer is missing.');
  const user: SessionUser = {
    id: designer.id, studioId: studio.id, studioName: studio.name, organisationId: null, organisationName: null,
    email: designer.email, name: designer.name, role: 'designer',
  };

  // Through the fit schemas and data layer, so the demo data passes the same checks as the API.
  for (const demo of specs) {
    const style = await knex('styles').where({ studio_id: studio.id, code: demo.code }).first('id');
    if (!style) continue;
    const fit = await loadFit(user, style.id, knex);
    const compression = fit.textures.find((t) => t.name === demo.compressionTexture);
    const input = sizeSpecSaveSchema.parse({
      version: fit.version,
      baseSize: fit.spec.baseSize,
      points: fit.spec.points.map((p) => ({
        ...p,
        baseCm: demo.base[p.point] ?? null,
        gradeCm: demo.grades?.[p.point] ?? p.gradeCm,
        overrides: demo.overrides?.[p.point] ?? {},
      })),
      girths: demo.girths,
      cutAndSew: demo.cutAndSew ?? {},
      baseTextureId: fit.spec.baseTextureId,
      compressionTextureId: compression?.id ?? fit.spec.compressionTextureId,
      cylinderDiametersIn: fit.spec.cylinderDiametersIn,
      target: fit.spec.target,
    });
    await saveSizeSpec(user, style.id, input, knex);
  }

  // One proto round of HF27-101 in the base size, with a comment and a correction waiting to be decided.
  const ridge = await knex('styles').where({ studio_id: studio.id, code: 'HF27-101' }).first('id', 'version');
  if (ridge) {
    const { round, doc } = await createSampleRound(
      user,
      ridge.id,
      sampleRoundCreateSchema.parse({
        version: ridge.version,
        kind: 'proto',
        size: 'M',
        receivedOn: '2027-02-18',
        notes: 'First proto from the mill, steamed and relaxed 24 h before measuring, measured flat.',
        measurements: {
          'chest-half': 32.4, 'waist-half': 27.6, 'bottom-half': 32.9, 'body-length-hps': 65.2, 'sleeve-length': 62.5,
          'across-shoulder': 38.3, armhole: 19.9,
        },
      }),
      knex,
    );
    const afterComment = await addSampleComment(user, ridge.id, round.id, {
      version: doc.version,
      body: 'Chest came out 1.4 cm wide: the mill will tighten the stitch on the chest courses for the next round. On the fit model the armhole cuts in at the front.',
    }, knex);
    await proposeCorrection(user, ridge.id, round.id, {
      version: afterComment.version, point: 'armhole', size: 'M', toCm: 20, scope: 'point',
      reason: 'Fit session: open the armhole by 1 cm across the range.',
    }, knex);
  }
}
