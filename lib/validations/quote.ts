import { z } from 'zod';
import { makingUpKeys, trimCostKinds } from '@/lib/cost/rates';

const money = (what: string) => z.number({ error: `${what} must be a number` }).min(0, `${what} must be at least 0`).max(100_000, `${what} is too large`);
const maybe = <T extends z.ZodType>(s: T) => s.nullable().default(null);

/** A rate in a costing PUT: absent keeps the stored value, null puts it back to the example default. */
const keepOrReset = <T extends z.ZodType>(s: T) => s.nullable().optional();

/**
 * A change to the studio costing rates (studios.settings.costing): the given keys are written onto the
 * stored ones, absent keys keep theirs, null puts a key back to its example default.
 */
export const costRatesSchema = z
  .object({
    currency: keepOrReset(z.string().trim().regex(/^[A-Z]{3}$/, 'A three-letter currency code, such as EUR')),
    machineMinuteRate: keepOrReset(money('Machine-minute rate')),
    efficiency: keepOrReset(z.number({ error: 'Efficiency must be a number' }).gt(0, 'Efficiency must be above 0').max(1, 'Efficiency is at most 1 (100 %)')),
    circularRpm: keepOrReset(z.number({ error: 'Speed must be a number' }).positive('Speed must be above zero').max(200, 'Speed above 200 rpm is not realistic')),
    flatPassesPerMinute: keepOrReset(z.number({ error: 'Speed must be a number' }).positive('Speed must be above zero').max(200)),
    flatSystems: keepOrReset(z.number().int('Whole systems only').min(1, 'At least one system').max(8)),
    wasteAllowance: keepOrReset(z.number({ error: 'Waste must be a number' }).min(0, 'Waste is at least 0').max(1, 'Waste is at most 1 (100 %)')),
    makingUp: z.object(Object.fromEntries(makingUpKeys.map((k) => [k, keepOrReset(money('Cost'))])) as Record<(typeof makingUpKeys)[number], z.ZodOptional<z.ZodNullable<z.ZodNumber>>>).strict().optional(),
    trimUnitCost: z.object(Object.fromEntries(trimCostKinds.map((k) => [k, keepOrReset(money('Cost'))])) as Record<(typeof trimCostKinds)[number], z.ZodOptional<z.ZodNullable<z.ZodNumber>>>).strict().optional(),
  })
  .strict();
export type CostRatesInput = z.infer<typeof costRatesSchema>;

export const costRatesPutSchema = z
  .object({
    /** Absent: every rate keeps its stored value. */
    rates: costRatesSchema.default({}),
    /** Machine-minute rates of the studio's mills, by mill organisation id; null clears a mill's rate. Absent mills keep theirs. */
    mills: z.record(z.uuid({ error: 'A mill id' }), money('Machine-minute rate').nullable()).default({}),
  })
  .strict();

/** What the designer enters for one style's quote; null takes the studio rate. */
export const quoteInputsSchema = z
  .object({
    speedPerMinute: maybe(z.number({ error: 'Speed must be a number' }).positive('Speed must be above zero').max(200, 'Speed above 200 per minute is not realistic')),
    feedersPerCourse: z.number({ error: 'Feeders per course must be a number' }).int('Whole feeders only').min(1, 'At least one feeder per course').max(16).default(1),
    efficiency: maybe(z.number({ error: 'Efficiency must be a number' }).gt(0, 'Efficiency must be above 0').max(1, 'Efficiency is at most 1 (100 %)')),
    minuteRate: maybe(money('Machine-minute rate')),
    /** The mill (one of the studio's mill organisations) whose machine-minute rate is used when no rate is entered here. */
    millId: maybe(z.uuid({ error: 'A mill of the studio' })),
    makingUp: z.object(Object.fromEntries(makingUpKeys.map((k) => [k, maybe(money('Cost'))])) as Record<(typeof makingUpKeys)[number], z.ZodDefault<z.ZodNullable<z.ZodNumber>>>).strict().default({ cutting: null, linking: null, dyeing: null, heatSetting: null }),
    includeTrims: z.boolean().default(true),
  })
  .strict();
export type QuoteInputs = z.infer<typeof quoteInputsSchema>;

export const quoteSaveSchema = z
  .object({
    version: z.number({ error: 'The version you edited is required' }).int().min(0),
    inputs: quoteInputsSchema,
  })
  .strict();

export const quoteExportQuerySchema = z.object({ format: z.enum(['pdf', 'csv'], { error: 'format: pdf or csv' }) });
