// The plan as the editor holds it: the plan JSON of DESIGN 4.1, edited in place so that fields the
// editor does not know (an imported file's extras) survive the round trip. A number the user is
// still typing that does not parse stays a string, so the plan schema names it ("must be a number").
// Pure; browser-safe (only the engine's browser entry).
import { inToMm, mmToIn, mpaToPsi, psiToMPa, type PlanUnits } from '../../lib/reduction/browser';

export type PlanPath = (string | number)[];
/** A plan JSON object as typed so far; validated with listPlanIssues, never trusted. */
export type PlanDraft = Record<string, unknown>;
/** What a number input holds: a number, the raw text when it does not parse, or nothing. */
export type NumberValue = number | string | undefined;

/** Tolerance defaults of DESIGN 3.3 (the plan schema applies the same ones when a field is absent). */
export const TOLERANCE_DEFAULTS = {
  slopeBand: 0.1,
  minRSquared: 0.995,
  hysteresis: 0.05,
  zeroShiftMicrostrain: 20,
  zeroShiftFraction: 0.02,
  noResponseMicrostrain: 10,
  yieldFraction: 0.9,
  holdCreepMicrostrain: 10,
  holdCreepFraction: 0.01,
  principalDirectionDeg: 10,
} as const;

/**
 * A new plan: generic carbon steel (REFERENCES, a default the engineer confirms), default
 * tolerances, one hoop and one axial gauge. The vessel's diameter, wall, length and the test
 * pressure are left empty on purpose: they must come from the vessel's documents, not from us.
 */
export function createBlankPlan(): PlanDraft {
  return {
    units: 'SI',
    vessel: { shape: 'cylinder', ends: 'closed', features: [] },
    material: { name: 'Carbon steel, generic', elasticModulus: 200000, poissonRatio: 0.3, yieldStrength: 260 },
    model: 'lame',
    columns: { time: 'time_s', pressure: 'P [MPa]' },
    tolerances: { ...TOLERANCE_DEFAULTS },
    gauges: [
      { id: 'H1', kind: 'uniaxial', channels: ['CH01'], angleDeg: 90, gaugeFactor: 2, transverseSensitivity: 0 },
      { id: 'A1', kind: 'uniaxial', channels: ['CH02'], angleDeg: 0, gaugeFactor: 2, transverseSensitivity: 0 },
    ],
  };
}

/** The value at a path, or undefined when any step is missing. */
export function getIn(obj: unknown, path: PlanPath): unknown {
  let cur: unknown = obj;
  for (const key of path) {
    if (cur === null || typeof cur !== 'object') return undefined;
    cur = (cur as Record<string | number, unknown>)[key];
  }
  return cur;
}

/** A copy with the value at `path` replaced; `undefined` removes an object key. Missing steps are created. */
export function setIn<T>(obj: T, path: PlanPath, value: unknown): T {
  if (path.length === 0) return value as T;
  const [key, ...rest] = path;
  const src = obj !== null && typeof obj === 'object' ? obj : typeof key === 'number' ? [] : {};
  const copy: Record<string | number, unknown> = Array.isArray(src)
    ? ([...src] as unknown as Record<number, unknown>)
    : { ...src };
  const next = setIn((src as Record<string | number, unknown>)[key!], rest, value);
  if (next === undefined && !Array.isArray(copy)) delete copy[key!];
  else copy[key!] = next;
  return copy as T;
}

/**
 * Drop float noise from a conversion: 3000.0000000000005 → 3000. A value is snapped to 15
 * significant digits only when that leaves a short number (12 digits or fewer); any other value
 * keeps every bit, so converting there and back returns what was typed.
 */
export function cleanFloat(x: number): number {
  if (x === 0 || !Number.isFinite(x)) return x;
  const snapped = Number(x.toPrecision(15));
  const digits = snapped
    .toPrecision(15)
    .replace(/e.*$/, '')
    .replace(/[-.]/g, '')
    .replace(/^0+/, '')
    .replace(/0+$/, '').length;
  return digits <= 12 ? snapped : x;
}

/**
 * What the user typed as a number: '' → undefined; '1.5', '1,5', '2e5' → number; anything else
 * stays the text, for the schema to report.
 */
export function parseNumberText(text: string): NumberValue {
  const t = text.trim();
  if (t === '') return undefined;
  const s = !t.includes('.') && /^[+-]?\d+,\d+$/.test(t) ? t.replace(',', '.') : t;
  if (!/^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i.test(s)) return text;
  const n = Number(s);
  return Number.isFinite(n) ? n : text;
}

/** A number as an input shows it: six significant digits, no exponent, trailing zeros trimmed. */
export function formatNumberForInput(v: unknown): string {
  if (typeof v === 'string') return v;
  if (typeof v !== 'number' || !Number.isFinite(v)) return '';
  if (v === 0) return '0';
  const magnitude = Math.floor(Math.log10(Math.abs(v)));
  const digits = Math.min(12, Math.max(0, 5 - magnitude));
  const s = v.toFixed(digits);
  return s.includes('.') ? s.replace(/\.?0+$/, '') : s;
}

type Convert = (x: number) => number;
const celsiusToFahrenheit: Convert = (c) => (c * 9) / 5 + 32;
const fahrenheitToCelsius: Convert = (f) => ((f - 32) * 5) / 9;
const conversions = (to: PlanUnits) => ({
  length: to === 'US' ? mmToIn : inToMm,
  pressure: to === 'US' ? mpaToPsi : psiToMPa,
});

/** Convert a number in place (strings and absent values are left as they are). */
function convertAt(plan: PlanDraft, path: PlanPath, f: Convert): PlanDraft {
  const v = getIn(plan, path);
  return typeof v === 'number' ? setIn(plan, path, cleanFloat(f(v))) : plan;
}

/**
 * The same plan in the other unit system: lengths mm ↔ in, test pressure and stresses MPa ↔ psi,
 * with the exact factors of units.ts, and the test temperature °C ↔ °F. Fractions, angles, microstrain and
 * gauge factors do not change.
 */
export function convertPlanUnits(plan: PlanDraft, to: PlanUnits): PlanDraft {
  if ((plan.units ?? 'SI') === to) return plan;
  const { length, pressure } = conversions(to);
  let out: PlanDraft = { ...plan, units: to };
  for (const p of [
    ['vessel', 'insideDiameter'],
    ['vessel', 'wallThickness'],
    ['vessel', 'length'],
  ])
    out = convertAt(out, p, length);
  const features = getIn(out, ['vessel', 'features']);
  if (Array.isArray(features))
    features.forEach((_, i) => {
      out = convertAt(out, ['vessel', 'features', i, 'axialPosition'], length);
      out = convertAt(out, ['vessel', 'features', i, 'size'], length);
    });
  const gauges = out.gauges;
  if (Array.isArray(gauges))
    gauges.forEach((_, i) => {
      out = convertAt(out, ['gauges', i, 'distanceToDiscontinuity'], length);
      out = convertAt(out, ['gauges', i, 'axialPosition'], length);
    });
  out = convertAt(out, ['testPressure'], pressure);
  out = convertAt(out, ['procedure', 'testTemperature'], to === 'US' ? celsiusToFahrenheit : fahrenheitToCelsius);
  out = convertAt(out, ['material', 'elasticModulus'], pressure);
  out = convertAt(out, ['material', 'yieldStrength'], pressure);
  return out;
}

/** The next free gauge id with a prefix: H1, H2 … */
export function nextGaugeId(plan: PlanDraft, prefix = 'G'): string {
  const used = new Set(
    (Array.isArray(plan.gauges) ? plan.gauges : []).map((g) => String((g as { id?: unknown }).id ?? '')),
  );
  let n = 1;
  while (used.has(`${prefix}${n}`)) n += 1;
  return `${prefix}${n}`;
}

/** A gauge row with its channel list resized for its kind (1 for uniaxial, 3 for a rosette). */
export function withGaugeKind(gauge: Record<string, unknown>, kind: string): Record<string, unknown> {
  const channels = Array.isArray(gauge.channels) ? (gauge.channels as unknown[]) : [];
  const want = kind === 'uniaxial' ? 1 : 3;
  const resized = Array.from({ length: want }, (_, k) => (typeof channels[k] === 'string' ? channels[k] : ''));
  return { ...gauge, kind, channels: resized };
}
