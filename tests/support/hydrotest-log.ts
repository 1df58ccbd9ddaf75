// A small, independent generator of stepped hydrotest logs with known truth for the
// integration tests: outer-surface Lamé strains of a closed cylinder (Timoshenko, Strength of
// Materials Part II [memory]), holds at fractions of test pressure, deterministic noise.

export interface SyntheticChannel {
  name: string;
  angleDeg: number;
  scale?: number;
  spikeAtSecond?: number;
}

export interface SyntheticLogOptions {
  insideDiameter: number;
  wallThickness: number;
  E: number;
  nu: number;
  testPressure: number;
  channels: SyntheticChannel[];
  rateHz?: number;
  holdSeconds?: number;
  rampSeconds?: number;
  levels?: number[]; // fractions of test pressure, loading then unloading, 0 first and last
}

/** µε per MPa at the outer surface of a closed cylinder, hoop and axial. */
export function lameOuterStrainPerMPa(o: { insideDiameter: number; wallThickness: number; E: number; nu: number }) {
  const a = o.insideDiameter / 2;
  const b = a + o.wallThickness;
  const A = (a * a) / (b * b - a * a); // per MPa
  return { hoop: ((A * (2 - o.nu)) / o.E) * 1e6, axial: ((A * (1 - 2 * o.nu)) / o.E) * 1e6 };
}

function* pressureProfile(
  o: Required<Pick<SyntheticLogOptions, 'rateHz' | 'holdSeconds' | 'rampSeconds' | 'levels' | 'testPressure'>>,
) {
  const dt = 1 / o.rateHz;
  let t = 0;
  for (let i = 0; i < o.levels.length; i++) {
    const p = o.levels[i]! * o.testPressure;
    for (let k = 0; k < o.holdSeconds * o.rateHz; k++, t += dt) yield [t, p] as const;
    const next = o.levels[i + 1];
    if (next === undefined) break;
    const n = o.rampSeconds * o.rateHz;
    for (let k = 0; k < n; k++, t += dt) yield [t, p + ((next * o.testPressure - p) * k) / n] as const;
  }
}

/** CSV text (comma, header `time_s,P [MPa],…`) or, with `onLine`, streamed line by line. */
export function makeHydrotestCsv(opts: SyntheticLogOptions): string {
  const lines: string[] = [];
  writeHydrotestCsv(opts, (l) => lines.push(l));
  return lines.join('\n') + '\n';
}

export function writeHydrotestCsv(opts: SyntheticLogOptions, onLine: (line: string) => void): number {
  const o = { rateHz: 2, holdSeconds: 30, rampSeconds: 10, levels: [0, 0.25, 0.5, 0.75, 1, 0.5, 0], ...opts };
  const per = lameOuterStrainPerMPa(o);
  let seed = 12345;
  const noise = () => {
    seed = (seed * 1103515245 + 12345) & 0x7fffffff;
    return (seed / 0x7fffffff - 0.5) * 1.0;
  };
  onLine(['time_s', 'P [MPa]', ...o.channels.map((c) => c.name)].join(','));
  let n = 0;
  for (const [t, p] of pressureProfile(o)) {
    const cells = o.channels.map((c) => {
      const th = (c.angleDeg * Math.PI) / 180;
      const perMPa = per.axial * Math.cos(th) ** 2 + per.hoop * Math.sin(th) ** 2;
      let e = perMPa * p * (c.scale ?? 1) + noise();
      if (c.spikeAtSecond !== undefined && Math.abs(t - c.spikeAtSecond) < 0.5 / o.rateHz) e += 5000;
      return e.toFixed(2);
    });
    onLine([t.toFixed(3), p.toFixed(4), ...cells].join(','));
    n++;
  }
  return n;
}
