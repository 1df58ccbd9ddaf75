// A synthetic hydrotest log from true strain slopes per channel, for the truth tests. The test
// computes each channel's slope from the reference formulas (a true field that may differ from
// the plan's prediction); this file only turns slopes into CSV text. Independent of the engine.

export interface RefChannel {
  name: string;
  /** µε the instrument shows per plan pressure unit at the gauge */
  slope: number;
  /** µε shown before any pressure */
  offset?: number;
  /** plan pressure units the gauge sees on top of the tap pressure (water head) */
  head?: number;
  /** µε that appear at the end of each cycle's top hold and stay (permanent set), per cycle */
  setPerCycle?: readonly number[];
  /** µε per second added during the last cycle's top hold, kept afterwards (creep) */
  creepPerSecond?: number;
  /** strain noise of this channel, µε SD */
  noise?: number;
  /** the amplifier clips the pressure-driven strain at ± this many µε */
  clipAt?: number;
}

export interface RefLogSpec {
  testPressure: number;
  /** levels as fractions of test pressure, one list per cycle; a cycle's last level is the next one's first */
  cycles?: readonly (readonly number[])[];
  /** a steady ramp 0 → test pressure → 0 over twice this many seconds, no holds */
  rampSeconds?: number;
  holdSeconds?: number;
  stepSeconds?: number;
  rateHz?: number;
  pressureHeader: string;
  /** null: no time column */
  timeHeader?: string | null;
  /** the log's pressure value = gauge pressure in plan units × scale + offset */
  pressureScale?: number;
  pressureOffset?: number;
  /** pressure noise, fraction of test pressure (SD) */
  pressureNoise?: number;
  /** strain noise, µε SD */
  strainNoise?: number;
  /** lag-1 autocorrelation of the strain noise (AR(1)); 0 for white noise */
  noiseRho?: number;
  seed?: number;
  channels: readonly RefChannel[];
  delimiter?: string;
  stopAfterSeconds?: number;
  /** key-value lines before the header */
  preamble?: readonly string[];
}

/** mulberry32 and Box–Muller: a seeded normal sequence. */
function gaussian(seed: number): () => number {
  let a = seed >>> 0;
  const u = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return () => {
    let x = 0;
    while (x === 0) x = u();
    return Math.sqrt(-2 * Math.log(x)) * Math.cos(2 * Math.PI * u());
  };
}

interface Step {
  start: number;
  level: number;
  next: number | null;
  cycle: number;
  /** this hold is its cycle's highest (the first of equal ones) */
  top: boolean;
}

/** The pressure programme: holds at each level joined by steady ramps. */
export function programme(spec: RefLogSpec): {
  at: (t: number) => number;
  duration: number;
  /** per cycle, [start, end] of its top hold */
  tops: [number, number][];
} {
  const tp = spec.testPressure;
  if (spec.rampSeconds !== undefined) {
    const h = spec.rampSeconds;
    return { at: (t) => tp * (t <= h ? t / h : Math.max(0, 2 - t / h)), duration: 2 * h, tops: [[h, h]] };
  }
  const hold = spec.holdSeconds ?? 60;
  const ramp = spec.stepSeconds ?? 30;
  const cycles = spec.cycles ?? [[0, 0.25, 0.5, 0.75, 1, 0.75, 0.5, 0.25, 0]];
  const levels: { level: number; cycle: number; top: boolean }[] = [];
  cycles.forEach((c, k) => {
    const peak = Math.max(...c);
    let topSeen = false;
    c.forEach((level, i) => {
      if (k > 0 && i === 0) return; // shared with the previous cycle's last level
      const top = !topSeen && level === peak;
      if (top) topSeen = true;
      levels.push({ level, cycle: k, top });
    });
  });
  const steps: Step[] = [];
  let t = 0;
  levels.forEach((l, i) => {
    const next = levels[i + 1]?.level ?? null;
    steps.push({ start: t, level: l.level, next, cycle: l.cycle, top: l.top });
    t += hold + (next !== null ? ramp : 0);
  });
  const tops = cycles.map((_, k) => {
    const s = steps.find((x) => x.cycle === k && x.top)!;
    return [s.start, s.start + hold] as [number, number];
  });
  const latestFirst = [...steps].reverse();
  return {
    duration: t,
    tops,
    at: (x) => {
      for (const s of latestFirst) {
        if (x < s.start) continue;
        const into = x - s.start;
        if (into <= hold || s.next === null) return tp * s.level;
        return tp * (s.level + ((s.next - s.level) * (into - hold)) / ramp);
      }
      return tp * (steps[0]?.level ?? 0);
    },
  };
}

/** The log as CSV text. */
export function writeLog(spec: RefLogSpec): string {
  const d = spec.delimiter ?? ',';
  const rate = spec.rateHz ?? 2;
  const prog = programme(spec);
  const duration = Math.min(prog.duration, spec.stopAfterSeconds ?? Infinity);
  const g = gaussian(spec.seed ?? 11);
  const pNoise = (spec.pressureNoise ?? 0.0005) * spec.testPressure;
  const rho = spec.noiseRho ?? 0;
  const innovation = Math.sqrt(1 - rho * rho);
  const noiseState = spec.channels.map(() => 0);
  const lastTop = prog.tops[prog.tops.length - 1]!;
  const timeHeader = spec.timeHeader === undefined ? 'time_s' : spec.timeHeader;
  const header = [...(timeHeader ? [timeHeader] : []), spec.pressureHeader, ...spec.channels.map((c) => c.name)];
  const lines: string[] = [...(spec.preamble ?? []), header.join(d)];
  const n = Math.floor(duration * rate) + 1;
  for (let i = 0; i < n; i++) {
    const t = i / rate;
    const p = prog.at(t);
    const cells: string[] = [];
    if (timeHeader) cells.push(t.toFixed(3));
    cells.push(((p + g() * pNoise) * (spec.pressureScale ?? 1) + (spec.pressureOffset ?? 0)).toFixed(7));
    spec.channels.forEach((c, k) => {
      let e = c.slope * (p + (c.head ?? 0));
      if (c.clipAt !== undefined) e = Math.max(-c.clipAt, Math.min(c.clipAt, e));
      e += c.offset ?? 0;
      c.setPerCycle?.forEach((set, cycle) => {
        const top = prog.tops[cycle];
        if (top && t > top[1]) e += set;
      });
      if (c.creepPerSecond) e += c.creepPerSecond * Math.min(Math.max(0, t - lastTop[0]), lastTop[1] - lastTop[0]);
      const sd = c.noise ?? spec.strainNoise ?? 0.5;
      noiseState[k] = rho * noiseState[k]! + innovation * g();
      e += sd * noiseState[k];
      cells.push(e.toFixed(3));
    });
    lines.push(cells.join(d));
  }
  return lines.join('\n') + '\n';
}
