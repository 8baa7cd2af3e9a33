import type { Knex } from 'knex';
import { db, type Db } from './knex';
import { changedKeys } from './changed-keys';
import { studioSettings, writeStudioSetting } from './studio-settings';
import type { SessionUser } from './users';
import { conflict, forbidden, HttpError, notFound } from '@/lib/api/errors';
import { can, canSeeCosts } from '@/lib/auth/roles';
import { findStyle, type Style } from './styles';
import { listTrims } from './trims';
import { briefAnswersForStudio } from './briefs';
import { coursesPerGarment, loadStylePlan, sizeScales } from './plan-figures';
import { applyRatesChange, computeQuote, exampleValueNote, resolveRates, trimCostKinds, type CostRates, type RatesSet, type Quote, type QuoteMachine, type TrimCostKind } from '@/lib/cost';
import { quoteInputsSchema, type CostRatesInput, type QuoteInputs } from '@/lib/validations/quote';
import { briefFieldLabels } from '@/lib/validations/brief';

/** One of the studio's mills with the machine-minute rate it charges (null while none is set). */
export interface MillRate {
  id: string;
  name: string;
  minuteRate: number | null;
}

export interface StudioCostRates {
  rates: CostRates;
  /** Keys still at their example value (dotted for making-up and trims). */
  defaults: string[];
  note: string;
  /** The studio's mills and their machine-minute rates (organisations.settings.costing). */
  mills: MillRate[];
}

export interface StyleQuote {
  styleId: string;
  styleCode: string;
  styleName: string;
  /** The quote entries' version: 0 while none are saved. */
  version: number;
  inputs: QuoteInputs;
  studio: StudioCostRates;
  /** The machine figures used, after the entries and the studio rates. */
  machine: QuoteMachine & { kind: 'circular' | 'flat' };
  quote: Quote;
  /** How the sizes were scaled from the mapped base size, in words. */
  basis: string[];
  updatedAt: string | null;
}

/** Costs are studio staff's only: the mill and the client get 403 before anything is read. */
function assertCosts(user: SessionUser) {
  if (!canSeeCosts(user.role)) throw forbidden();
}

export async function studioCostRates(user: SessionUser, q: Db = db()): Promise<StudioCostRates> {
  assertCosts(user);
  const { rates, defaults } = resolveRates(((await studioSettings(user.studioId, q)).costing as Parameters<typeof resolveRates>[0] | undefined) ?? null);
  const mills = (await q('organisations').where({ studio_id: user.studioId, kind: 'mill' }).orderBy('name')
    .select('id', 'name', q.raw("settings #> '{costing,machineMinuteRate}' as minute_rate"))) as { id: string; name: string; minute_rate: unknown }[];
  return {
    rates, defaults, note: exampleValueNote,
    mills: mills.map((m) => ({ id: m.id, name: m.name, minuteRate: typeof m.minute_rate === 'number' ? m.minute_rate : null })),
  };
}

/** 400 unless every id is one of the studio's mill organisations. */
async function assertStudioMills(studioId: string, ids: readonly string[], field: (id: string) => string, q: Db): Promise<void> {
  if (ids.length === 0) return;
  const found = new Set((await q('organisations').where({ studio_id: studioId, kind: 'mill' }).whereIn('id', ids).pluck('id')) as string[]);
  const unknown = ids.filter((id) => !found.has(id));
  if (unknown.length) {
    throw new HttpError(400, 'Some fields need attention.', { fieldErrors: Object.fromEntries(unknown.map((id) => [field(id), ['Not one of the studio mills']])) });
  }
}

/**
 * Writes the given rates onto studios.settings.costing (absent keys keep their stored value, null puts
 * one back to its example default) and the given mills' machine-minute rates (organisations.settings.costing;
 * null clears one, absent mills keep theirs).
 */
export async function setStudioCostRates(user: SessionUser, input: CostRatesInput, millRates: Readonly<Record<string, number | null>> = {}, q: Knex = db()): Promise<StudioCostRates> {
  if (!can(user.role, 'quote:edit')) throw forbidden();
  const given = Object.entries(input).filter(([, v]) => v !== undefined).map(([k]) => k);
  const fields = [...given, ...(Object.keys(millRates).length ? ['millRates'] : [])];
  // Nothing named: nothing to write, and no history entry for it.
  if (fields.length === 0) return studioCostRates(user, q);
  await q.transaction(async (trx) => {
    await assertStudioMills(user.studioId, Object.keys(millRates), (id) => `mills.${id}`, trx);
    const stored = (await studioSettings(user.studioId, trx, { forUpdate: true })).costing as RatesSet | undefined;
    const costing = applyRatesChange(stored, input);
    await writeStudioSetting(user.studioId, 'costing', costing, trx);
    for (const [id, rate] of Object.entries(millRates)) {
      await trx('organisations').where({ id, studio_id: user.studioId }).update({
        settings: rate === null
          ? trx.raw("coalesce(settings, '{}'::jsonb) #- '{costing,machineMinuteRate}'")
          : trx.raw("jsonb_set(jsonb_set(coalesce(settings, '{}'::jsonb), '{costing}', coalesce(settings -> 'costing', '{}'::jsonb), true), '{costing,machineMinuteRate}', ?::jsonb, true)", [JSON.stringify(rate)]),
      });
    }
    await trx('audit_log').insert({ studio_id: user.studioId, user_id: user.id, action: 'studio.costing', details: JSON.stringify({ fields }) });
  });
  return studioCostRates(user, q);
}

interface QuoteRow { inputs: unknown; version: number; updated_at: Date }

async function quoteRow(styleId: string, q: Db): Promise<{ inputs: QuoteInputs; version: number; updatedAt: string | null }> {
  const row = (await q('quotes').where({ style_id: styleId }).first('inputs', 'version', 'updated_at')) as QuoteRow | undefined;
  if (!row) return { inputs: quoteInputsSchema.parse({}), version: 0, updatedAt: null };
  const parsed = quoteInputsSchema.safeParse(row.inputs);
  return { inputs: parsed.success ? parsed.data : quoteInputsSchema.parse({}), version: row.version, updatedAt: row.updated_at.toISOString() };
}

/** The machine-minute rate of the quote and whose it is: entered for the style, else the chosen mill's, else the studio's. */
function minuteRateFor(inputs: QuoteInputs, studio: StudioCostRates): { minuteRate: number; minuteRateFrom: string; problem: string | null } {
  if (inputs.minuteRate !== null) return { minuteRate: inputs.minuteRate, minuteRateFrom: 'rate entered for this style', problem: null };
  const studioRate = {
    minuteRate: studio.rates.machineMinuteRate,
    minuteRateFrom: studio.defaults.includes('machineMinuteRate') ? `studio rate, ${studio.note}` : 'studio rate',
  };
  if (inputs.millId === null) return { ...studioRate, problem: null };
  const mill = studio.mills.find((m) => m.id === inputs.millId);
  if (!mill) return { ...studioRate, problem: 'The mill chosen for the machine-minute rate is no longer one of the studio mills: the studio rate is used.' };
  if (mill.minuteRate === null) return { ...studioRate, problem: `${mill.name} has no machine-minute rate under Studio rates: the studio rate is used.` };
  return { minuteRate: mill.minuteRate, minuteRateFrom: `rate of ${mill.name}`, problem: null };
}

function machineFor(style: Style, inputs: QuoteInputs, studio: StudioCostRates): QuoteMachine & { kind: 'circular' | 'flat' } {
  const { rates } = studio;
  const circular = style.machine.kind === 'circular';
  const feeders = style.machine.kind === 'circular' ? style.machine.feeders : rates.flatSystems;
  const { minuteRate, minuteRateFrom } = minuteRateFor(inputs, studio);
  return {
    kind: style.machine.kind,
    speedPerMinute: inputs.speedPerMinute ?? (circular ? rates.circularRpm : rates.flatPassesPerMinute),
    feeders,
    feedersPerCourse: Math.min(inputs.feedersPerCourse, feeders),
    efficiency: inputs.efficiency ?? rates.efficiency,
    minuteRate,
    minuteRateFrom,
  };
}

/**
 * The quote of a style: the body map's yarn grams (scaled per size by the size spec), its courses,
 * the machine, making-up, trims, the brief's target price and order by size. Staff only.
 */
export async function loadQuote(user: SessionUser, styleId: string, q: Knex = db()): Promise<StyleQuote> {
  assertCosts(user);
  const style = await findStyle(user, styleId, q);
  if (!style) throw notFound('Style not found.');
  const [studio, stored, brief, trims] = await Promise.all([
    studioCostRates(user, q), quoteRow(styleId, q), briefAnswersForStudio(user.studioId, styleId, q), listTrims(user, styleId, q),
  ]);
  const { rates } = studio;
  const answers = brief?.answers ?? null;
  const plan = await loadStylePlan(user, styleId, rates.wasteAllowance, q);
  const { scales, fromSpec } = await sizeScales(user, style, q);
  const machine = machineFor(style, stored.inputs, studio);
  const baseCourses = coursesPerGarment(style, plan.panels);
  const knitted = Object.fromEntries(Object.entries(plan.summary.consumption?.yarns ?? {}).map(([id, y]) => [id, y.knittedGrams]));
  const basis = [
    `Yarn grams and courses come from the body map of size ${style.sizes.base} (${Math.round(baseCourses)} courses${style.construction === 'seamless' ? ', front and back knitted as one tube' : ''}).`,
    fromSpec
      ? 'Other sizes scale by the size spec: grams by width × length, courses by length.'
      : 'No size spec is saved: every size is costed as the base size.',
    ...plan.summary.problems,
  ];
  const makingUp = { ...rates.makingUp };
  for (const [k, v] of Object.entries(stored.inputs.makingUp)) if (typeof v === 'number') makingUp[k as keyof typeof makingUp] = v;
  const quote = computeQuote({
    currency: rates.currency,
    yarns: plan.yarns.map((y) => ({ id: y.id, name: y.name, pricePerKg: y.pricePerKg })),
    wasteAllowance: rates.wasteAllowance,
    machine,
    makingUp,
    trims: stored.inputs.includeTrims
      ? trims.map((t) => ({ name: t.name, kind: t.kind, unitCost: (trimCostKinds as readonly string[]).includes(t.kind) ? rates.trimUnitCost[t.kind as TrimCostKind] : 0 }))
      : [],
    targetPricePerGarment: answers?.targetPrice ?? null,
    sizes: scales.map((s) => ({
      size: s.size,
      knittedGrams: Object.fromEntries(Object.entries(knitted).map(([id, g]) => [id, g * s.width * s.length])),
      courses: baseCourses * s.length,
      garments: answers?.orderBySize[s.size] ?? 0,
    })),
  });
  const rateProblem = minuteRateFor(stored.inputs, studio).problem;
  if (rateProblem) quote.problems.push(rateProblem);
  if (brief?.repaired.length) {
    quote.problems.push(`The saved brief had answers that no longer pass its checks (${brief.repaired.map((f) => briefFieldLabels[f].toLowerCase()).join(', ')}): they are left empty here. Open the brief and save it again.`);
  }
  return {
    styleId, styleCode: style.code, styleName: style.name, version: stored.version, inputs: stored.inputs, studio, machine, quote, basis, updatedAt: stored.updatedAt,
  };
}

/** Saves the quote entries when `version` is the stored one (0 for the first save); otherwise 409. */
export async function saveQuoteInputs(user: SessionUser, styleId: string, input: { version: number; inputs: QuoteInputs }, q: Knex = db()): Promise<StyleQuote> {
  if (!can(user.role, 'quote:edit')) throw forbidden();
  if (!(await findStyle(user, styleId, q))) throw notFound('Style not found.');
  await assertStudioMills(user.studioId, input.inputs.millId ? [input.inputs.millId] : [], () => 'inputs.millId', q);
  await q.transaction(async (trx) => {
    const current = (await trx('quotes').where({ style_id: styleId }).forUpdate().first('version', 'inputs')) as { version: number; inputs: unknown } | undefined;
    const stale = () => conflict('Someone saved this quote after you opened it. Reload to see their entries.', { currentVersion: current?.version ?? 0 });
    if (!current) {
      if (input.version !== 0) throw stale();
      const ins = await trx('quotes').insert({ style_id: styleId, studio_id: user.studioId, inputs: JSON.stringify(input.inputs), updated_by: user.id }).onConflict('style_id').ignore().returning('style_id');
      if (ins.length === 0) throw stale();
    } else {
      const n = await trx('quotes').where({ style_id: styleId, version: input.version })
        .update({ inputs: JSON.stringify(input.inputs), version: trx.raw('version + 1'), updated_by: user.id, updated_at: trx.fn.now() });
      if (n === 0) throw stale();
    }
    // Entry names only, never their values: the history is read by client reviewers too.
    const before = quoteInputsSchema.safeParse(current?.inputs ?? {});
    const fields = changedKeys(before.success ? before.data : {}, input.inputs);
    await trx('audit_log').insert({ studio_id: user.studioId, style_id: styleId, user_id: user.id, action: 'quote.save', details: JSON.stringify({ fields }) });
  });
  return loadQuote(user, styleId, q);
}
