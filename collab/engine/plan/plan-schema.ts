/**
 * Zod schema of a whole Rampart plan (schemaVersion 1): nets, parts, signals, requirements,
 * scenarios and settings. Everything is keyed by id so a live document can address it.
 */
import { z } from 'zod';
import { netRef, partSchema } from './plan-schema-parts';
import { PLAN_SCHEMA_VERSION } from './plan-limits';

const finite = (what: string) =>
  z.number({ error: `${what} must be a number` }).refine(Number.isFinite, `${what} must be finite`);
const positive = (what: string) => finite(what).refine((v) => v > 0, `${what} must be > 0`);
const nonNegative = (what: string) => finite(what).refine((v) => v >= 0, `${what} must be ≥ 0`);
const fraction = (what: string) =>
  finite(what).refine((v) => v >= 0 && v < 10, `${what} must be in [0, 10)`);

export const signalKindSchema = z.enum([
  'rail',
  'enable',
  'power-good',
  'reset',
  'reference',
  'other',
]);

export const signalSchema = z.strictObject({
  id: z.string().min(1, 'signal id must not be empty'),
  label: z.string().optional(),
  kind: signalKindSchema,
  net: netRef,
  /** Nominal settled level, volts. */
  nominal: finite('signal nominal'),
  /** Named levels in volts, e.g. `{ "in-regulation": 3.135 }`. */
  thresholds: z.record(z.string(), finite('signal threshold')).optional(),
});

/** A threshold crossing of a signal: a named threshold or a level in volts. */
export const crossingRefSchema = z.strictObject({
  signal: z.string().min(1),
  level: z.union([z.string().min(1), finite('crossing level')]),
  edge: z.enum(['rise', 'fall']).optional(),
});

export const scenarioKindSchema = z.enum([
  'power-up',
  'power-down',
  'brown-out',
  'slow-ramp',
  'fast-ramp',
]);

const requirementCommon = {
  id: z.string().min(1, 'requirement id must not be empty'),
  label: z.string().optional(),
  /** Target relative margin, e.g. 0.3 for 30 %; default from the plan settings. */
  targetMargin: nonNegative('targetMargin').optional(),
  /** Scenario kinds where the requirement applies; each kind has a sensible default. */
  during: z.array(scenarioKindSchema).min(1).optional(),
};

export const requirementSchema = z.discriminatedUnion('kind', [
  /** `a` crosses its level before `b` starts rising, by at least `minGap` seconds. */
  z.strictObject({
    ...requirementCommon,
    kind: z.literal('order'),
    a: crossingRefSchema,
    b: crossingRefSchema,
    minGap: nonNegative('minGap').optional(),
  }),
  /** Time from one crossing to another within [min, max] seconds. */
  z.strictObject({
    ...requirementCommon,
    kind: z.literal('delay'),
    from: crossingRefSchema,
    to: crossingRefSchema,
    min: nonNegative('delay min').optional(),
    max: positive('delay max').optional(),
  }),
  /** Signal `a` stays above (below) `b` (or 0 V) by at least `by` volts over a window. */
  z.strictObject({
    ...requirementCommon,
    kind: z.literal('separation'),
    a: z.string().min(1),
    b: z.string().min(1).optional(),
    relation: z.enum(['above', 'below']),
    by: nonNegative('separation by'),
    from: crossingRefSchema.optional(),
    to: crossingRefSchema.optional(),
  }),
  /** `pin` never exceeds `supply` by more than `drop` volts (default plan `backDriveDrop`). */
  z.strictObject({
    ...requirementCommon,
    kind: z.literal('back-drive'),
    pin: z.string().min(1),
    supply: z.string().min(1),
    drop: positive('back-drive drop').optional(),
  }),
  /** The signal never falls back by more than `allowedDip` volts while rising from→to. */
  z.strictObject({
    ...requirementCommon,
    kind: z.literal('monotonic'),
    signal: z.string().min(1),
    from: z.union([z.string().min(1), finite('monotonic from')]).optional(),
    to: z.union([z.string().min(1), finite('monotonic to')]).optional(),
    allowedDip: positive('allowedDip').optional(),
  }),
  /** Rise slew between two levels (default 10–90 % of nominal) within [min, max] V/s. */
  z.strictObject({
    ...requirementCommon,
    kind: z.literal('slew'),
    signal: z.string().min(1),
    from: z.union([z.string().min(1), finite('slew from')]).optional(),
    to: z.union([z.string().min(1), finite('slew to')]).optional(),
    min: positive('slew min').optional(),
    max: positive('slew max').optional(),
  }),
  /** The signal is inside target ± band for good by `by` seconds after the scenario start. */
  z.strictObject({
    ...requirementCommon,
    kind: z.literal('settle'),
    signal: z.string().min(1),
    target: finite('settle target').optional(),
    band: positive('settle band'),
    by: positive('settle by'),
  }),
  /** Reset stays low until every rail has been past its level for `hold` seconds. */
  z.strictObject({
    ...requirementCommon,
    kind: z.literal('reset-hold'),
    reset: z.string().min(1),
    release: z.union([z.string().min(1), finite('reset release level')]).optional(),
    rails: z.array(crossingRefSchema).min(1, 'reset-hold needs at least one rail'),
    hold: nonNegative('reset-hold hold'),
  }),
]);

export const scenarioSchema = z.strictObject({
  id: z.string().min(1, 'scenario id must not be empty'),
  kind: scenarioKindSchema,
  /** Junction temperatures, °C; default: 25 °C and the parts' temperature extremes. */
  temperatures: z.array(finite('scenario temperature')).min(1).optional(),
  /** Input rise time, s (default: settings.inputRise; slow/fast ramps scale it). */
  rise: positive('scenario rise').optional(),
  fall: positive('scenario fall').optional(),
  /** Brown-out: dip depth as a fraction of the input level, and its width in seconds. */
  dipLevel: fraction('scenario dipLevel').optional(),
  dipWidth: positive('scenario dipWidth').optional(),
  /** Observation time after the input starts moving, s (default: settings.duration). */
  duration: positive('scenario duration').optional(),
});

export const settingsSchema = z.strictObject({
  /** Default target relative margin (0.3 = 30 %). */
  targetMargin: nonNegative('settings targetMargin').optional(),
  inputRise: positive('settings inputRise').optional(),
  inputFall: positive('settings inputFall').optional(),
  /** Observation time of one scenario phase, s. */
  duration: positive('settings duration').optional(),
  outputPoints: positive('settings outputPoints').optional(),
  /** Tolerance = k·σ for normal distributions. */
  normalK: positive('settings normalK').optional(),
  backDriveDrop: positive('settings backDriveDrop').optional(),
  /** Default allowed dip for monotonic checks as a fraction of the signal's nominal. */
  monotonicDip: positive('settings monotonicDip').optional(),
  /** Temperatures of the default scenario set when the parts state no range. */
  temperatures: z.array(finite('settings temperature')).min(1).optional(),
});

export const planSchema = z.strictObject({
  schemaVersion: z.literal(PLAN_SCHEMA_VERSION, {
    error: `schemaVersion must be ${PLAN_SCHEMA_VERSION}`,
  }),
  name: z.string().min(1, 'plan name must not be empty'),
  description: z.string().optional(),
  nets: z.array(z.strictObject({ id: netRef, label: z.string().optional() })),
  parts: z.array(partSchema),
  signals: z.array(signalSchema),
  requirements: z.array(requirementSchema),
  scenarios: z.array(scenarioSchema).optional(),
  settings: settingsSchema.optional(),
});

export type Plan = z.infer<typeof planSchema>;
export type SignalSpec = z.infer<typeof signalSchema>;
export type CrossingRef = z.infer<typeof crossingRefSchema>;
export type RequirementSpec = z.infer<typeof requirementSchema>;
export type ScenarioSpec = z.infer<typeof scenarioSchema>;
export type ScenarioKind = z.infer<typeof scenarioKindSchema>;
export type PlanSettings = z.infer<typeof settingsSchema>;
