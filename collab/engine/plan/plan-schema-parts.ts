/**
 * Zod schema of the parts of a plan: tolerances, distributions, temperature models and the part
 * kinds. Plain JSON, keyed by part id, so a collaborative document can hold the same data.
 */
import { z } from 'zod';

const finite = (what: string) =>
  z.number({ error: `${what} must be a number` }).refine(Number.isFinite, `${what} must be finite`);
const positive = (what: string) => finite(what).refine((v) => v > 0, `${what} must be > 0`);
const nonNegative = (what: string) => finite(what).refine((v) => v >= 0, `${what} must be ≥ 0`);

/** A net name; `'0'` is ground. */
export const netRef = z.string().min(1, 'net name must not be empty');

/** How a Monte Carlo run draws a toleranced value. */
export const distributionSchema = z.discriminatedUnion('kind', [
  z.strictObject({ kind: z.literal('uniform') }),
  /** Normal with tolerance = k·σ (k defaults to the plan's `normalK`, itself 3 by default). */
  z.strictObject({ kind: z.literal('normal'), k: positive('distribution k').optional() }),
]);

/** ± percent around nominal, or explicit absolute min/max. */
export const toleranceSchema = z
  .strictObject({
    percent: nonNegative('tolerance percent')
      .refine((v) => v < 100, 'tolerance percent must be < 100')
      .optional(),
    min: finite('tolerance min').optional(),
    max: finite('tolerance max').optional(),
    distribution: distributionSchema.optional(),
  })
  .refine(
    (t) => (t.percent !== undefined) !== (t.min !== undefined || t.max !== undefined),
    'tolerance needs either percent or min and max, not both',
  )
  .refine(
    (t) => (t.min === undefined) === (t.max === undefined),
    'tolerance min and max must be given together',
  )
  .refine(
    (t) => t.min === undefined || t.max === undefined || t.min <= t.max,
    'tolerance min must be ≤ max',
  );

/** Temperature coefficient in ppm/°C: a ± band (default) or a fixed signed coefficient. */
const tempcoSchema = z.strictObject({
  kind: z.literal('tempco'),
  ppmPerC: finite('tempco ppmPerC'),
  band: z.boolean().optional(),
});

/** EIA-198 ceramic dielectric classes understood by the engine. */
export const dielectricClassSchema = z.enum(['C0G', 'NP0', 'X5R', 'X7R', 'X6S', 'Y5V']);

const dielectricSchema = z.strictObject({
  kind: z.literal('dielectric'),
  class: dielectricClassSchema,
});

/** Waveform of a fixed (non-input) source, scaled by the source's `value`. */
export const partWaveSchema = z.discriminatedUnion('kind', [
  z.strictObject({ kind: z.literal('dc') }),
  z.strictObject({ kind: z.literal('step'), t0: nonNegative('wave t0') }),
  z.strictObject({
    kind: z.literal('ramp'),
    t0: nonNegative('wave t0'),
    rise: positive('wave rise'),
  }),
  /** Points are [time s, fraction of value]. */
  z.strictObject({
    kind: z.literal('pwl'),
    points: z.array(z.tuple([nonNegative('pwl time'), finite('pwl fraction')])).min(1),
  }),
  z.strictObject({ kind: z.literal('exp'), t0: nonNegative('wave t0'), tau: positive('wave tau') }),
]);

export const powerOnSchema = z.discriminatedUnion('kind', [
  z.strictObject({ kind: z.literal('low') }),
  z.strictObject({ kind: z.literal('high') }),
  z.strictObject({ kind: z.literal('hiz') }),
  z.strictObject({
    kind: z.literal('pulse-low'),
    vstart: nonNegative('powerOn vstart'),
    width: positive('powerOn width'),
  }),
]);

const common = {
  id: z.string().min(1, 'part id must not be empty'),
  label: z.string().optional(),
  /** Tolerances of named numeric fields of behavioural blocks (e.g. `vout`, `enOn`). */
  tolerances: z.record(z.string(), toleranceSchema).optional(),
};

/** Parts whose main value is toleranced. */
const valued = {
  ...common,
  tolerance: toleranceSchema.optional(),
};

export const resistorSchema = z.strictObject({
  ...valued,
  kind: z.literal('resistor'),
  a: netRef,
  b: netRef,
  value: positive('resistor value (ohms)'),
  temperature: tempcoSchema.optional(),
});

export const capacitorSchema = z.strictObject({
  ...valued,
  kind: z.literal('capacitor'),
  a: netRef,
  b: netRef,
  value: positive('capacitor value (farads)'),
  v0: finite('capacitor v0').optional(),
  temperature: z.discriminatedUnion('kind', [tempcoSchema, dielectricSchema]).optional(),
});

export const inductorSchema = z.strictObject({
  ...valued,
  kind: z.literal('inductor'),
  a: netRef,
  b: netRef,
  value: positive('inductor value (henries)'),
  i0: finite('inductor i0').optional(),
});

export const vsourceSchema = z.strictObject({
  ...valued,
  kind: z.literal('vsource'),
  pos: netRef,
  neg: netRef,
  /** Level in volts (the final level of its waveform). */
  value: finite('source value (volts)'),
  /** `input` sources follow the scenario (power-up, power-down…); `fixed` ones follow `wave`. */
  role: z.enum(['input', 'fixed']).optional(),
  wave: partWaveSchema.optional(),
  rs: nonNegative('source rs').optional(),
});

export const isourceSchema = z.strictObject({
  ...valued,
  kind: z.literal('isource'),
  from: netRef,
  to: netRef,
  value: finite('current source value (amperes)'),
  wave: partWaveSchema.optional(),
});

export const diodeSchema = z.strictObject({
  ...common,
  kind: z.literal('diode'),
  anode: netRef,
  cathode: netRef,
  model: z.discriminatedUnion('kind', [
    z.strictObject({
      kind: z.literal('shockley'),
      is: positive('diode is'),
      n: positive('diode n'),
    }),
    z.strictObject({
      kind: z.literal('drop'),
      vf: nonNegative('diode vf'),
      ron: positive('diode ron'),
    }),
  ]),
});

export const comparatorSchema = z.strictObject({
  ...common,
  kind: z.literal('comparator'),
  inP: netRef,
  inN: netRef,
  supply: netRef,
  gnd: netRef,
  out: netRef,
  threshold: finite('comparator threshold'),
  hysteresis: nonNegative('comparator hysteresis'),
  delay: nonNegative('comparator delay'),
  output: z.enum(['push-pull', 'open-drain']),
  rout: positive('comparator rout'),
  vmin: nonNegative('comparator vmin'),
  powerOn: powerOnSchema,
});

export const regulatorSchema = z.strictObject({
  ...common,
  kind: z.literal('regulator'),
  input: netRef,
  en: netRef,
  out: netRef,
  gnd: netRef,
  pg: netRef.optional(),
  vout: positive('regulator vout'),
  enOn: finite('regulator enOn'),
  enOff: finite('regulator enOff'),
  uvlo: nonNegative('regulator uvlo'),
  softStart: nonNegative('regulator softStart'),
  slewRate: positive('regulator slewRate').optional(),
  dropout: nonNegative('regulator dropout'),
  rout: positive('regulator rout'),
  rdischarge: positive('regulator rdischarge').optional(),
  ilimit: positive('regulator ilimit').optional(),
  pgThreshold: positive('regulator pgThreshold').optional(),
  pgDelay: nonNegative('regulator pgDelay').optional(),
  pgRon: positive('regulator pgRon').optional(),
  vmin: nonNegative('regulator vmin').optional(),
  pgPowerOn: powerOnSchema.optional(),
});

export const supervisorSchema = z.strictObject({
  ...common,
  kind: z.literal('supervisor'),
  supply: netRef,
  gnd: netRef,
  out: netRef,
  monitors: z
    .array(
      z.strictObject({
        net: netRef,
        threshold: positive('monitor threshold'),
        hysteresis: nonNegative('monitor hysteresis'),
      }),
    )
    .min(1, 'supervisor needs at least one monitored net'),
  timeout: nonNegative('supervisor timeout'),
  delay: nonNegative('supervisor delay'),
  rout: positive('supervisor rout'),
  vmin: nonNegative('supervisor vmin'),
  powerOn: powerOnSchema,
});

export const partSchema = z.discriminatedUnion('kind', [
  resistorSchema,
  capacitorSchema,
  inductorSchema,
  vsourceSchema,
  isourceSchema,
  diodeSchema,
  comparatorSchema,
  regulatorSchema,
  supervisorSchema,
]);

export type PartSpec = z.infer<typeof partSchema>;
export type ToleranceSpec = z.infer<typeof toleranceSchema>;
export type DistributionSpec = z.infer<typeof distributionSchema>;
export type DielectricClass = z.infer<typeof dielectricClassSchema>;
export type PartWave = z.infer<typeof partWaveSchema>;
