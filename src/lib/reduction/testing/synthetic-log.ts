// Synthetic hydrotest logs with known truth, for tests, the benchmark and the demo seed.
// Given a plan and per-gauge behaviour, produces the CSV text of a stepped test with holds
// (or a steady ramp), Gaussian noise from a fixed seed, in any of the supported formats.
import type { Plan } from '../plan';
import { predictForPlan } from '../shell';
import { strainAtAngle, gridAngles, GRID_NAMES } from '../shell';
import { indicatedStrain } from '../corrections';
import { pressureFactor, planPressureUnit } from '../units';
import { splitUnit } from '../text';

export interface GaugeBehaviour {
  /** reading = true strain × scale (0.85: reads 15 % low) */
  scale?: number;
  /** µε read before pressure is applied (the zero offset) */
  offset?: number;
  /** µε of permanent strain that appears at the peak and stays */
  permanentSet?: number;
  /** the channel reads noise only */
  dead?: boolean;
  /** the sign is flipped (reversed wiring) */
  reversed?: boolean;
  /** the reading clips at this magnitude (µε) */
  saturateAt?: number;
  /** strain noise for this gauge, µε standard deviation */
  noise?: number;
  /** the strain grows at this rate (µε/s) during the first hold at `level` (fraction of test pressure) and keeps what it gained */
  creep?: { level: number; microstrainPerSecond: number };
  /** the reading drifts at this rate (µε/s) during the first hold, before any pressure, and keeps what it gained */
  zeroDrift?: number;
  /** µε gained steadily through the hold at test pressure (and kept afterwards): creep */
  creepMicrostrain?: number;
  /** this channel's zero drift, µε per hour (temperature of the bridge and the shell) */
  driftPerHour?: number;
  /**
   * µε the gauge lags on the way up, most at half test pressure and none at zero or at the peak
   * (the shell seating on its saddles, air working out): a first loading that is not quite linear
   */
  seatingMicrostrain?: number;
}

export interface SyntheticFormat {
  delimiter?: ',' | ';' | '\t';
  decimalComma?: boolean;
  bom?: boolean;
  crlf?: boolean;
  /** key-value lines written before the header */
  preamble?: readonly string[];
  /** write the pressure in this unit with it in brackets after the column name */
  pressureUnit?: 'MPa' | 'kPa' | 'bar' | 'psi';
  time?: 'seconds' | 'iso' | 'none';
  /** ISO start time when time is 'iso' */
  startIso?: string;
  /** digits after the decimal point for strains (pressure gets 2 more) */
  digits?: number;
}

export interface SyntheticOptions {
  /** levels as fractions of test pressure (default a nine-hold test 0 25 50 75 100 75 50 25 0 %) */
  levels?: number[];
  holdSeconds?: number;
  rampSeconds?: number;
  rateHz?: number;
  seed?: number;
  /** pressure noise, fraction of test pressure (standard deviation) */
  pressureNoise?: number;
  /** strain noise, µε standard deviation */
  strainNoise?: number;
  /** 'steps' (holds) or 'ramp' (0 → test pressure → 0 at a steady rate, no holds) */
  profile?: 'steps' | 'ramp';
  /** stop the log after this many seconds (a live upload mid-test) */
  stopAfterSeconds?: number;
  /** strains per unit pressure of the true field (default: the plan's model prediction) */
  truth?: { axial: number; hoop: number };
  gauges?: Record<string, GaugeBehaviour>;
  format?: SyntheticFormat;
  /** rows per yielded chunk */
  chunkRows?: number;
  /**
   * time constant, s, by which strain follows pressure (the shell, the water and the adhesive
   * settling after each ramp); 0 or absent: strain follows pressure at once
   */
  settleSeconds?: number;
}

/** mulberry32: a small seeded PRNG */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export function seededGaussian(seed: number): () => number {
  const u = seededRandom(seed);
  let spare: number | null = null;
  return () => {
    if (spare !== null) {
      const s = spare;
      spare = null;
      return s;
    }
    let a = 0,
      b = 0;
    while (a === 0) a = u();
    b = u();
    const r = Math.sqrt(-2 * Math.log(a));
    spare = r * Math.sin(2 * Math.PI * b);
    return r * Math.cos(2 * Math.PI * b);
  };
}

/** The pressure profile as a function of time (fraction of test pressure), its duration, and when the peak ends. */
export function pressureProfile(opts: SyntheticOptions): {
  at: (t: number) => number;
  duration: number;
  peakEnd: number;
  /** the holds of a stepped profile, in time order (none for a ramp) */
  holds: { start: number; end: number; level: number }[];
} {
  const hold = opts.holdSeconds ?? 60;
  const ramp = opts.rampSeconds ?? 30;
  if (opts.profile === 'ramp') {
    const half = opts.rampSeconds ?? 300;
    return {
      at: (t) => (t <= half ? t / half : Math.max(0, 2 - t / half)),
      duration: 2 * half,
      peakEnd: half,
      holds: [],
    };
  }
  const levels = opts.levels ?? [0, 0.25, 0.5, 0.75, 1, 0.75, 0.5, 0.25, 0];
  const [firstLevel] = levels;
  if (firstLevel === undefined) throw new RangeError('pressureProfile: levels must name at least one level');
  // each level: a hold from `start`, then a ramp to `next` (none after the last level)
  const steps: { start: number; level: number; next: number | null }[] = [];
  let t = 0;
  let peakEnd = 0;
  let peakLevel = -Infinity;
  levels.forEach((level, i) => {
    const next = levels[i + 1] ?? null;
    steps.push({ start: t, level, next });
    if (level > peakLevel) {
      peakLevel = level; // the first of equal highest levels
      peakEnd = t + hold;
    }
    t += hold + (next !== null ? ramp : 0);
  });
  const latestFirst = [...steps].reverse();
  return {
    duration: t,
    peakEnd,
    holds: steps.map((x) => ({ start: x.start, end: x.start + hold, level: x.level })),
    at: (x) => {
      for (const { start, level, next } of latestFirst) {
        if (!(x >= start)) continue;
        const into = x - start;
        if (into <= hold || next === null) return level;
        return level + ((next - level) * (into - hold)) / ramp;
      }
      return firstLevel; // before the first hold
    },
  };
}

/** True slopes (µε per plan pressure unit) per grid id that a perfect reduction should find. */
export function syntheticTruth(plan: Plan, opts: SyntheticOptions = {}): Record<string, number> {
  const { predicted } = predictForPlan(plan);
  const m = predicted[plan.model];
  const field = opts.truth ?? { axial: m.axialStrainPerPressure, hoop: m.hoopStrainPerPressure };
  const out: Record<string, number> = {};
  for (const g of plan.gauges) {
    const b = opts.gauges?.[g.id] ?? {};
    gridAngles(g).forEach((a, k) => {
      const id = g.kind === 'uniaxial' ? g.id : `${g.id}/${GRID_NAMES[k]}`;
      out[id] = b.dead ? 0 : strainAtAngle(field.axial, field.hoop, a) * (b.scale ?? 1) * (b.reversed ? -1 : 1);
    });
  }
  return out;
}

/** The log as chunks of CSV text (memory stays small for big logs). */
export function* syntheticLogChunks(plan: Plan, opts: SyntheticOptions = {}): Generator<string> {
  const f = opts.format ?? {};
  const d = f.delimiter ?? ',';
  const eol = f.crlf ? '\r\n' : '\n';
  const digits = f.digits ?? 2;
  const rate = opts.rateHz ?? 2;
  const timeFmt = f.time ?? (plan.columns.time ? 'seconds' : 'none');
  const tp = plan.testPressure;
  const planUnit = planPressureUnit(plan.units);
  const logFactor = f.pressureUnit ? pressureFactor(planUnit, f.pressureUnit) : 1;
  const pName = f.pressureUnit ? `${splitUnit(plan.columns.pressure).base} [${f.pressureUnit}]` : plan.columns.pressure;
  const tName = plan.columns.time ?? 'time_s';
  const { predicted } = predictForPlan(plan);
  const m = predicted[plan.model];
  const field = opts.truth ?? { axial: m.axialStrainPerPressure, hoop: m.hoopStrainPerPressure };
  const profile = pressureProfile(opts);
  const duration = Math.min(profile.duration, opts.stopAfterSeconds ?? Infinity);
  const gauss = seededGaussian(opts.seed ?? 1);
  const pNoise = (opts.pressureNoise ?? 0.001) * tp;
  const sNoise = opts.strainNoise ?? 1;
  const startMs = Date.parse(f.startIso ?? '2025-03-14T09:00:00Z');
  const num = (x: number, dg: number) => {
    const s = x.toFixed(dg);
    return f.decimalComma ? s.replace('.', ',') : s;
  };

  interface Chan {
    along: number;
    across: number;
    kt: number;
    gf: number;
    b: GaugeBehaviour;
  }
  const chans: Chan[] = [];
  const names: string[] = [];
  for (const g of plan.gauges) {
    const b = opts.gauges?.[g.id] ?? {};
    const angles = gridAngles(g);
    // one channel per grid angle (the plan checks the count against the kind)
    g.channels.forEach((name, k) => {
      const a = angles[k];
      if (a === undefined) throw new RangeError(`gauge ${g.id}: channel ${name} has no grid`);
      names.push(name);
      chans.push({
        along: strainAtAngle(field.axial, field.hoop, a),
        across: strainAtAngle(field.axial, field.hoop, a + 90),
        kt: g.transverseSensitivity,
        gf: g.gaugeFactor / g.instrumentGaugeFactor,
        b,
      });
    });
  }

  let head = f.bom ? '\uFEFF' : '';
  for (const line of f.preamble ?? []) head += line + eol;
  const cols = [...(timeFmt !== 'none' ? [tName] : []), pName, ...names];
  head += cols.join(d) + eol;
  yield head;

  const n = Math.floor(duration * rate) + 1;
  const chunkRows = opts.chunkRows ?? 2000;
  let buf: string[] = [];
  const settle = opts.settleSeconds ?? 0;
  const lagKeep = settle > 0 ? Math.exp(-1 / (rate * settle)) : 0;
  let pFelt = profile.at(0) * tp;
  const peakStart = peakHoldStart(opts, profile.peakEnd);
  for (let i = 0; i < n; i++) {
    const t = i / rate;
    const pTrue = profile.at(t) * tp;
    // first-order lag: the strain sees a pressure that settles towards the gauge pressure
    pFelt = settle > 0 ? lagKeep * pFelt + (1 - lagKeep) * pTrue : pTrue;
    const p = pTrue + gauss() * pNoise;
    const cells: string[] = [];
    if (timeFmt === 'seconds') cells.push(num(t, 4));
    else if (timeFmt === 'iso') cells.push(new Date(startMs + t * 1000).toISOString());
    cells.push(num(p * logFactor, digits + 2));
    for (const c of chans) {
      const b = c.b;
      let e: number;
      if (b.dead) e = 0;
      else {
        const along = c.along * pFelt * (b.scale ?? 1);
        const across = c.across * pFelt * (b.scale ?? 1);
        e = c.kt !== 0 ? indicatedStrain(along, across, c.kt) : along;
        if (b.permanentSet && t > profile.peakEnd) e += b.permanentSet;
        if (b.creep) {
          const level = b.creep.level;
          const h = profile.holds.find((x) => Math.abs(x.level - level) < 1e-9);
          if (h) e += b.creep.microstrainPerSecond * Math.max(0, Math.min(t, h.end) - h.start);
        }
        if (b.creepMicrostrain && t > peakStart)
          e += b.creepMicrostrain * Math.min(1, (t - peakStart) / Math.max(1e-9, profile.peakEnd - peakStart));
        if (b.driftPerHour) e += (b.driftPerHour * t) / 3600;
        if (b.seatingMicrostrain && t < peakStart)
          e -= b.seatingMicrostrain * Math.sin(Math.PI * Math.min(1, Math.max(0, pFelt / tp)));
        if (b.reversed) e = -e;
        e *= c.gf; // the instrument's gauge factor setting
        if (b.saturateAt !== undefined) e = Math.max(-b.saturateAt, Math.min(b.saturateAt, e));
      }
      const first = profile.holds[0];
      if (b.zeroDrift && first) e += b.zeroDrift * Math.max(0, Math.min(t, first.end) - first.start);
      e += (b.offset ?? 0) + gauss() * (b.noise ?? sNoise);
      cells.push(num(e, digits));
    }
    buf.push(cells.join(d));
    if (buf.length >= chunkRows) {
      yield buf.join(eol) + eol;
      buf = [];
    }
  }
  if (buf.length) yield buf.join(eol) + eol;
}

/** When the hold at the highest level starts (the peak hold ends at `peakEnd`). */
function peakHoldStart(opts: SyntheticOptions, peakEnd: number): number {
  if (opts.profile === 'ramp') return peakEnd;
  return peakEnd - (opts.holdSeconds ?? 60);
}

/** The whole log as one string. */
export function syntheticLog(plan: Plan, opts: SyntheticOptions = {}): string {
  let s = '';
  for (const c of syntheticLogChunks(plan, opts)) s += c;
  return s;
}

/** A string as an async iterable of chunks (as a stream would deliver it), optionally as bytes. */
export async function* chunked(text: string, size = 65536, asBytes = true): AsyncGenerator<Uint8Array | string> {
  const enc = new TextEncoder();
  if (asBytes) {
    const bytes = enc.encode(text);
    for (let i = 0; i < bytes.length; i += size) yield bytes.subarray(i, i + size);
  } else for (let i = 0; i < text.length; i += size) yield text.slice(i, i + size);
}
