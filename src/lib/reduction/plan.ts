// The test plan (DESIGN 4.1) as a zod schema: the plan editor validates with it in the browser,
// the API and the CLI parse plan files with parsePlan. Only zod may be imported here.
import { countWord, describePlanIssue } from './plan-words';
import { z } from 'zod';
import { InputError, type InputIssue } from './errors';

type IssueLike = { input?: unknown };
/** Error function: a missing field says "is required", a wrong type says what it must be. */
const expect = (what: string) => ({
  error: (iss: IssueLike) => (iss.input === undefined ? 'is required' : `must be ${what}`),
});
const quote = (v: unknown) => (typeof v === 'string' ? `'${v}'` : JSON.stringify(v));
const oneOf = (values: readonly string[]) => ({
  error: (iss: IssueLike) =>
    iss.input === undefined ? 'is required' : `must be one of ${values.join(', ')} (got ${quote(iss.input)})`,
});

const num = () => z.number(expect('a number'));
const positive = () => num().gt(0, 'must be greater than 0');
const nonNegative = () => num().gte(0, 'must not be negative');
const fraction = (max = 1) => num().gte(0, 'must not be negative').lte(max, `must be at most ${max}`);
const text = () => z.string(expect('a text')).trim().min(1, 'must not be empty');

export const SHAPES = ['cylinder', 'sphere'] as const;
export const ENDS = ['closed', 'open'] as const;
export const GAUGE_KINDS = ['uniaxial', 'rosette-rectangular', 'rosette-delta'] as const;
export const FEATURE_KINDS = ['head', 'nozzle', 'support', 'thickness-change'] as const;
export const MODELS = ['lame', 'membrane'] as const;
export const BAND_MODES = ['fixed', 'uncertainty'] as const;
export const LEAD_WIRINGS = ['two-wire', 'three-wire'] as const;
/** The time history keys the pressure trace `pressure`: no strain channel may take that name. */
export const RESERVED_CHANNEL_NAMES = ['pressure'] as const;

export const featureSchema = z.object({
  id: z.string().optional(),
  name: z.string().optional(),
  kind: z.enum(FEATURE_KINDS, oneOf(FEATURE_KINDS)),
  /** from the reference end, plan length unit */
  axialPosition: num(),
  /** 0–360 around the circumference; absent = the feature runs all the way round */
  clockDeg: num().gte(0, 'must be between 0 and 360').lte(360, 'must be between 0 and 360').optional(),
  /** nozzle bore or pad diameter, plan length unit */
  size: nonNegative().optional(),
});

export const vesselSchema = z.object({
  name: z.string().optional(),
  shape: z.enum(SHAPES, oneOf(SHAPES)),
  ends: z.enum(ENDS, oneOf(ENDS)).default('closed'),
  insideDiameter: positive(),
  wallThickness: positive(),
  /** seam to seam, plan length unit; a cylinder needs it, a sphere does not (0 or absent) */
  length: nonNegative().optional(),
  features: z.array(featureSchema, expect('a list')).default([]),
});

export const materialSchema = z.object({
  name: z.string().optional(),
  elasticModulus: positive(),
  poissonRatio: num()
    .gte(0, "must be between 0 and 0.5 (Poisson's ratio)")
    .lte(0.5, "must be between 0 and 0.5 (Poisson's ratio)"),
  yieldStrength: positive(),
});

/** Acceptance thresholds (DESIGN 3.3); every one has the default stated there. */
export const tolerancesSchema = z.object({
  slopeBand: num()
    .gt(0, 'must be greater than 0')
    .lte(1, 'must be at most 1 (a fraction: 0.10 for ±10 %)')
    .default(0.1),
  minRSquared: fraction().default(0.995),
  hysteresis: fraction().default(0.05),
  zeroShiftMicrostrain: nonNegative().default(20),
  zeroShiftFraction: fraction().default(0.02),
  noResponseMicrostrain: nonNegative().default(10),
  yieldFraction: num().gt(0, 'must be greater than 0').lte(2, 'must be at most 2').default(0.9),
  /** hold-creep: strain change during the hold at test pressure, the larger of µε and a share of peak */
  holdCreepMicrostrain: nonNegative().default(10),
  holdCreepFraction: fraction().default(0.01),
  /** principal-direction: a rosette's ε1 this many degrees away from the predicted direction */
  principalDirectionDeg: num().gte(0, 'must not be negative').lte(90, 'must be at most 90').default(10),
  /** `fixed`: ±slopeBand; `uncertainty`: |measured − predicted| against √(U_pred² + U_fit²) (DESIGN 3.4) */
  bandMode: z.enum(BAND_MODES, oneOf(BAND_MODES)).default('fixed'),
});

/**
 * Standard uncertainties (k = 1) of the prediction's inputs (DESIGN 3.4). Every field is optional;
 * an absent one takes the default of `uncertainty.ts`, marked as an assumption in the result.
 */
export const uncertaintySchema = z.object({
  /** plan length unit */
  wallThickness: nonNegative().optional(),
  /** plan length unit */
  insideDiameter: nonNegative().optional(),
  /** relative (0.03 for 3 %) */
  elasticModulus: fraction().optional(),
  /** absolute */
  poissonRatio: fraction(0.5).optional(),
  /** relative */
  gaugeFactor: fraction().optional(),
  /** absolute (a fraction like Kt itself) */
  transverseSensitivity: fraction(0.1).optional(),
  /** degrees */
  misalignmentDeg: num().gte(0, 'must not be negative').lte(45, 'must be at most 45').optional(),
});

/**
 * Hold detection. Defaults fit logs from 1 Hz to 1 kHz: a hold is a span where pressure stays
 * within ±band·testPressure of its running mean for at least minDurationSeconds (and minSamples),
 * without drifting more than the band; its first settleFraction is dropped before averaging.
 */
export const holdDetectionSchema = z.object({
  band: num()
    .gt(0, 'must be greater than 0')
    .lte(0.25, 'must be at most 0.25 (a fraction of test pressure)')
    .default(0.02),
  minDurationSeconds: nonNegative().default(10),
  minSamples: z.number(expect('a whole number')).int('must be a whole number').gte(2, 'must be at least 2').default(5),
  settleFraction: num().gte(0, 'must not be negative').lte(0.9, 'must be at most 0.9').default(0.3),
});

/** Free text of a plan's record fields: trimmed, empty means absent. */
const recordText = () =>
  z
    .string(expect('a text'))
    .trim()
    .max(200, 'must be at most 200 characters')
    .optional()
    .transform((v) => (v === '' ? undefined : v));

/**
 * How the test is conducted, as the record states it: not an input of the reduction, printed on
 * the report and in the signed statements (README, "Test conduct"). Every field is optional.
 */
export const procedureSchema = z.object({
  /** the written test procedure the test follows, with its revision */
  reference: recordText(),
  /** the governing code and its edition */
  codeEdition: recordText(),
  /** water, or another liquid */
  testMedium: recordText(),
  /** metal temperature during the test: °C for SI plans, °F for US plans */
  testTemperature: num().optional(),
  /** the authorised inspector or other witness, by name and organisation */
  witness: recordText(),
});

export const gaugeSchema = z.object({
  id: text(),
  label: z.string().optional(),
  notes: z.string().optional(),
  kind: z.enum(GAUGE_KINDS, oneOf(GAUGE_KINDS)),
  /** column names in the log header: one for a uniaxial gauge, A, B, C for a rosette */
  channels: z.array(text(), expect('a list of column names')).min(1, 'must name at least one column'),
  /** from the vessel axis: 0 axial, 90 hoop; for a rosette, grid A's direction */
  angleDeg: num().gte(-360, 'must be between −360 and 360').lte(360, 'must be between −360 and 360'),
  gaugeFactor: positive().default(2.0),
  /** gauge factor set on the instrument; defaults to the gauge's own */
  instrumentGaugeFactor: positive().optional(),
  /** Kt as a fraction (0.02 for 2 %) */
  transverseSensitivity: num()
    .gte(-0.1, 'must be between −0.1 and 0.1 (a fraction: 0.02 for 2 %)')
    .lte(0.1, 'must be between −0.1 and 0.1 (a fraction: 0.02 for 2 %)')
    .default(0),
  distanceToDiscontinuity: nonNegative().optional(),
  axialPosition: num().optional(),
  /** 0–360 from top dead centre, clockwise looking from the reference end (where axialPosition is 0) */
  clockDeg: num().gte(0, 'must be between 0 and 360').lte(360, 'must be between 0 and 360').optional(),
  /** a perpendicular uniaxial gauge at the same place, by id: its measured strain corrects Kt */
  pairWith: text().optional(),
  /** height of the gauge, plan length unit, on the same datum as pressureTapElevation (water head) */
  elevation: num().optional(),
  /** resistance of one lead wire in ohm: quarter-bridge lead-wire desensitisation is corrected */
  leadResistance: nonNegative().optional(),
  /** nominal gauge resistance in ohm (with leadResistance; 120 when absent) */
  gaugeResistance: positive().optional(),
  /** quarter-bridge wiring (with leadResistance): two-wire puts both leads in the gauge's arm, three-wire one */
  leadWiring: z.enum(LEAD_WIRINGS, oneOf(LEAD_WIRINGS)).optional(),
});

const CHANNELS_BY_KIND: Record<(typeof GAUGE_KINDS)[number], number> = {
  uniaxial: 1,
  'rosette-rectangular': 3,
  'rosette-delta': 3,
};

export const planSchema = z
  .object({
    name: z.string().optional(),
    notes: z.string().optional(),
    units: z.enum(['SI', 'US'], oneOf(['SI', 'US'])),
    vessel: vesselSchema,
    material: materialSchema,
    model: z.enum(MODELS, oneOf(MODELS)).default('lame'),
    /** plan pressure unit: MPa (SI) or psi (US) */
    testPressure: positive(),
    columns: z.object({
      pressure: text(),
      time: text().optional(),
      /** barometric pressure for an absolute pressure column, plan pressure unit (default 101.325 kPa) */
      atmosphericPressure: positive().optional(),
    }),
    tolerances: tolerancesSchema.prefault({}),
    holdDetection: holdDetectionSchema.prefault({}),
    uncertainty: uncertaintySchema.optional(),
    /** density of the test fluid, kg/m³ in both unit systems (water head, with elevations) */
    testFluidDensity: positive().default(1000),
    /** height of the pressure tap, plan length unit, same datum as the gauges' elevation */
    pressureTapElevation: num().optional(),
    /** how the test is conducted (procedure, code, medium, temperature, witness) */
    procedure: procedureSchema.optional(),
    gauges: z.array(gaugeSchema, expect('a list of gauges')).min(1, 'must list at least one gauge'),
  })
  .superRefine((plan, ctx) => {
    const issue = (path: (string | number)[], message: string) => ctx.addIssue({ code: 'custom', path, message });
    const { vessel, material } = plan;
    // Plausibility of E catches GPa (or Msi) typed where MPa (psi) is expected.
    if (plan.units === 'SI' && material.elasticModulus < 500)
      issue(
        ['material', 'elasticModulus'],
        `${material.elasticModulus} MPa is implausibly low: enter MPa (200 GPa = 200000)`,
      );
    if (plan.units === 'US' && material.elasticModulus < 70000)
      issue(
        ['material', 'elasticModulus'],
        `${material.elasticModulus} psi is implausibly low: enter psi (29.5 Msi = 29500000)`,
      );
    if (material.yieldStrength >= material.elasticModulus)
      issue(['material', 'yieldStrength'], 'must be smaller than the elastic modulus (same unit)');
    if (vessel.shape === 'cylinder' && vessel.length === undefined)
      issue(['vessel', 'length'], 'is required for a cylinder');
    else if (vessel.shape === 'cylinder' && vessel.length === 0)
      issue(['vessel', 'length'], 'must be greater than 0 for a cylinder');
    const ids = new Map<string, number>();
    const channels = new Map<string, string>();
    const reserved = new Set([plan.columns.pressure, plan.columns.time].filter(Boolean) as string[]);
    plan.gauges.forEach((g, i) => {
      if (ids.has(g.id))
        issue(
          ['gauges', i, 'id'],
          `Gauge id '${g.id}' is used twice: gauges ${ids.get(g.id)! + 1} and ${i + 1} in the list. Give each gauge its own id.`,
        );
      else ids.set(g.id, i);
      if (g.id.includes('/')) issue(['gauges', i, 'id'], "must not contain '/' (used for rosette grids, e.g. R1/A)");
      const want = CHANNELS_BY_KIND[g.kind];
      if (g.channels.length !== want)
        issue(
          ['gauges', i, 'channels'],
          want === 1
            ? `Gauge ${g.id} is uniaxial and needs one channel; it lists ${countWord(g.channels.length)}.`
            : `Gauge ${g.id} is a ${g.kind === 'rosette-delta' ? 'delta' : 'rectangular'} rosette and needs three channels (grids A, B, C); it lists ${countWord(g.channels.length)}.`,
        );
      g.channels.forEach((c, k) => {
        if (reserved.has(c)) issue(['gauges', i, 'channels', k], `'${c}' is the pressure or time column`);
        else if ((RESERVED_CHANNEL_NAMES as readonly string[]).includes(c))
          issue(
            ['gauges', i, 'channels', k],
            `'${c}' is reserved for the pressure trace of the time history: rename the strain column`,
          );
        else if (channels.has(c))
          issue(['gauges', i, 'channels', k], `channel '${c}' is already used by gauge ${channels.get(c)}`);
        else channels.set(c, g.id);
      });
      if (
        g.axialPosition !== undefined &&
        vessel.length !== undefined &&
        vessel.shape === 'cylinder' &&
        (g.axialPosition < 0 || g.axialPosition > vessel.length)
      )
        issue(['gauges', i, 'axialPosition'], `must be between 0 and the vessel length ${vessel.length}`);
      if (g.kind !== 'uniaxial' && g.pairWith !== undefined)
        issue(['gauges', i, 'pairWith'], 'only a uniaxial gauge pairs with a perpendicular gauge');
      if (g.leadResistance === undefined && (g.gaugeResistance !== undefined || g.leadWiring !== undefined))
        issue(['gauges', i, 'leadResistance'], 'is required with gaugeResistance or leadWiring');
    });
    const temperature = plan.procedure?.testTemperature;
    if (temperature !== undefined) {
      // −50 to 200 °C covers any liquid test; outside it the value is almost always a unit slip
      const [lo, hi] = plan.units === 'US' ? [-58, 392] : [-50, 200];
      if (temperature < lo || temperature > hi)
        issue(
          ['procedure', 'testTemperature'],
          `must be between ${lo} and ${hi} ${plan.units === 'US' ? '°F' : '°C'} (the metal temperature during the test)`,
        );
    }
    if (plan.pressureTapElevation === undefined && plan.gauges.some((g) => g.elevation !== undefined))
      issue(['pressureTapElevation'], 'is required when a gauge gives its elevation (water head)');
    checkPairs(plan.gauges, issue);
  })
  .transform((plan) => ({
    ...plan,
    // a sphere has no length: 0 and absent mean the same
    vessel:
      plan.vessel.shape === 'sphere' && plan.vessel.length === 0 ? { ...plan.vessel, length: undefined } : plan.vessel,
    gauges: plan.gauges.map((g) => ({ ...g, instrumentGaugeFactor: g.instrumentGaugeFactor ?? g.gaugeFactor })),
  }));

/** Two grids are perpendicular when their directions differ by 90° within this many degrees. */
export const PERPENDICULAR_TOLERANCE_DEG = 5;

/** Angle between two gauge directions as lines, 0–90°. */
export function lineAngleBetween(a: number, b: number): number {
  const d = (((a - b) % 180) + 180) % 180;
  return Math.min(d, 180 - d);
}

type PairGauge = Pick<z.infer<typeof gaugeSchema>, 'id' | 'kind' | 'angleDeg' | 'pairWith'>;

/** `pairWith` names another uniaxial gauge, perpendicular to this one, that names no third gauge. */
function checkPairs(gauges: readonly PairGauge[], issue: (path: (string | number)[], message: string) => void) {
  const byId = new Map(gauges.map((g) => [g.id, g]));
  const claimedBy = new Map<string, string>();
  gauges.forEach((g, i) => {
    if (g.pairWith === undefined) return;
    const other = byId.get(g.pairWith);
    const path = ['gauges', i, 'pairWith'];
    if (!other) issue(path, `names no gauge of this plan ('${g.pairWith}')`);
    else if (other.id === g.id) issue(path, 'must name another gauge');
    else if (other.kind !== 'uniaxial') issue(path, `'${other.id}' is not a uniaxial gauge`);
    else if (Math.abs(lineAngleBetween(g.angleDeg, other.angleDeg) - 90) > PERPENDICULAR_TOLERANCE_DEG)
      issue(path, `'${other.id}' is not perpendicular to this gauge (${other.angleDeg}° against ${g.angleDeg}°)`);
    else if (other.pairWith !== undefined && other.pairWith !== g.id)
      issue(path, `'${other.id}' is already paired with '${other.pairWith}'`);
    else if (claimedBy.has(other.id) && claimedBy.get(other.id) !== g.id)
      issue(path, `'${other.id}' is already paired with '${claimedBy.get(other.id)}'`);
    else claimedBy.set(other.id, g.id);
  });
}

export type Plan = z.infer<typeof planSchema>;
export type PlanInput = z.input<typeof planSchema>;
export type PlanGauge = Plan['gauges'][number];
export type PlanFeature = Plan['vessel']['features'][number];
export type PlanProcedure = NonNullable<Plan['procedure']>;

/** `['gauges', 1, 'channels']` → `gauges[1].channels` */
export function formatPath(path: readonly PropertyKey[]): string {
  let s = '';
  for (const p of path) {
    if (typeof p === 'number') s += `[${p}]`;
    else s += (s ? '.' : '') + String(p);
  }
  return s || 'plan';
}

/** Every problem of a plan as {path, message}; empty when the plan is valid. For the editor. */
export function listPlanIssues(input: unknown): InputIssue[] {
  const r = planSchema.safeParse(input);
  if (r.success) return [];
  return r.error.issues.map((i) => ({ path: formatPath(i.path), message: i.message }));
}

/**
 * Validate a plan (an object, or its JSON text) and fill in defaults. Throws InputError
 * `invalid-plan` whose message names the first field, e.g. "vessel.wallThickness: must be greater than 0".
 */
export function parsePlan(input: unknown): Plan {
  let value = input;
  if (typeof input === 'string') {
    try {
      value = JSON.parse(input);
    } catch (e) {
      throw new InputError('invalid-plan', `plan: not valid JSON (${(e as Error).message})`, {
        path: 'plan',
        issues: [{ path: 'plan', message: 'not valid JSON' }],
      });
    }
  }
  const r = planSchema.safeParse(value);
  if (r.success) return r.data;
  const issues = r.error.issues.map((i) => ({
    path: formatPath(i.path),
    message: i.path.length === 0 && i.code === 'invalid_type' ? 'must be a JSON object' : i.message,
  }));
  const [first] = issues;
  // a failed parse always reports an issue; without one there is still nothing better to say
  if (!first) throw new InputError('invalid-plan', 'the plan is not valid', { issues });
  const more = issues.length > 1 ? ` (and ${issues.length - 1} more problem${issues.length > 2 ? 's' : ''})` : '';
  const sentence = describePlanIssue(r.error.issues[0]!.path as (string | number)[], first.message, value);
  throw new InputError('invalid-plan', `${sentence}${more}`, { path: first.path, issues });
}
