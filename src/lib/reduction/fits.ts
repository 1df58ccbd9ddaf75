// Per-grid fits from what the row accumulator kept: zero readings, the loading and unloading
// fits of the compared cycle (from hold means) or of all samples (the no-hold fallback, with an
// interval that allows for serial correlation), peak strain, zero shift, hysteresis, a saturated
// tail, creep during the hold at test pressure, and every cycle's own slopes and zero shift.
import type { RowAccumulator } from './accumulator';
import { BLOCK_STRIDE, N_BINS } from './accumulator';
import type { CycleSpan } from './cycles';
import type { ClassifiedHold, RawHold } from './holds';
import { fitFromSums, fitLine, interpolateSorted, serialCorrelationFromBlockSums, type LineFit } from './stats';
import type { CycleResult, GaugeResult } from './types';

export interface Pt {
  p: number;
  e: number;
}

export interface GridFit {
  load: LineFit | null;
  unload: LineFit | null;
  intercept: number | null;
  peak: number;
  zeroShift: number | null;
  hysteresis: number | null;
  points: GaugeResult['points'];
  holdStrains: (number | null)[];
  saturatedAt: number | null;
  holdCreep: number | null;
  effectiveSamples: number | null;
  notes: string[];
}

/** Mean of a running sum over its count; null when nothing was counted. */
export function meanOf(sum: number | undefined, count: number | undefined): number | null {
  return sum !== undefined && count !== undefined && count > 0 ? sum / count : null;
}

/** What the grids are zeroed on. */
export interface Zeroing {
  zero: Float64Array;
  known: Uint8Array;
  /** the zero hold used (the compared cycle's start), if any */
  hold: ClassifiedHold | undefined;
  /** slots zeroed on the first samples at zero pressure instead */
  fromSamples: number;
}

/**
 * The zero of each slot: the compared cycle's starting zero hold; for the first cycle without one
 * (or in the fallback), the first samples at zero pressure; else not zeroed (0).
 */
export function zeroReadings(
  acc: RowAccumulator,
  holds: readonly ClassifiedHold[],
  compared: CycleSpan | null,
  usedHolds: boolean,
): Zeroing {
  const nS = acc.nS;
  const hold = usedHolds && compared?.start != null ? holds[compared.start] : undefined;
  const samplesAllowed = !usedHolds || (compared !== null && compared.index === 0);
  const zero = new Float64Array(nS);
  const known = new Uint8Array(nS);
  let fromSamples = 0;
  for (let k = 0; k < nS; k++) {
    const fromHold = hold ? meanOf(hold.slotSum[k], hold.slotCount[k]) : null;
    const fromInit = samplesAllowed ? meanOf(acc.initZero[2 * k], acc.initZero[2 * k + 1]) : null;
    if (fromHold !== null) {
      zero[k] = fromHold;
      known[k] = 1;
    } else if (fromInit !== null) {
      zero[k] = fromInit;
      known[k] = 1;
      fromSamples++;
    }
  }
  return { zero, known, hold, fromSamples };
}

/** Mean strain of slot s over a hold, zeroed; null when the slot had no reading there. */
export function holdStrain(h: RawHold | undefined, s: number, zero: number): number | null {
  if (!h) return null;
  const m = meanOf(h.slotSum[s], h.slotCount[s]);
  return m === null ? null : m - zero;
}

/** Largest gap between the branches at the same pressure (interpolated), inside (2 %, 98 %) of the peak pressure. */
export function hysteresisGap(loading: readonly Pt[], unloading: readonly Pt[], peakPressure: number): number | null {
  if (loading.length < 2 || unloading.length < 2) return null;
  const L = [...loading].sort((a, b) => a.p - b.p);
  const U = [...unloading].sort((a, b) => a.p - b.p);
  const lx = L.map((x) => x.p),
    ly = L.map((x) => x.e);
  const ux = U.map((x) => x.p),
    uy = U.map((x) => x.e);
  let gap: number | null = null;
  const lo = 0.02 * peakPressure,
    hi = 0.98 * peakPressure;
  const probe = (pts: Pt[], xs: number[], ys: number[]) => {
    for (const q of pts) {
      if (q.p <= lo || q.p >= hi) continue;
      const other = interpolateSorted(xs, ys, q.p);
      if (other === null) continue;
      const g = Math.abs(q.e - other);
      if (gap === null || g > gap) gap = g;
    }
  };
  probe(U, lx, ly);
  probe(L, ux, uy);
  return gap;
}

/**
 * Strain stops responding: from some loading point on, the strain stays within a small band while
 * pressure rises by at least a fifth of the peak. Returns the pressure where it starts, or null.
 */
export function saturationPressure(loading: readonly Pt[], predictedSlope: number): number | null {
  // highest pressure first (the reverse of a stable ascending sort, so ties keep their order)
  const [last, ...below] = [...loading].sort((a, b) => a.p - b.p).reverse();
  if (!last || below.length < 2) return null;
  let tailStart = last;
  let flat = 0;
  for (const q of below) {
    const tol = Math.max(2, 0.05 * Math.abs(predictedSlope) * (last.p - q.p));
    if (Math.abs(q.e - last.e) > tol) break;
    tailStart = q;
    flat++;
  }
  if (flat === 0 || flat === below.length) return null; // no flat tail, or flat all the way (a dead channel)
  return last.p - tailStart.p >= 0.2 * last.p ? tailStart.p : null;
}

const fitPoints = (pts: readonly Pt[]) =>
  fitLine(
    pts.map((x) => x.p),
    pts.map((x) => x.e),
  );

/** Loading and unloading points of one cycle from its hold means: start zero hold to peak, peak to end. */
function cyclePoints(
  holds: readonly ClassifiedHold[],
  c: CycleSpan,
  s: number,
  zero: number,
  head: number,
): { loading: Pt[]; unloading: Pt[] } {
  const loading: Pt[] = [];
  const unloading: Pt[] = [];
  const add = (list: Pt[], i: number | null) => {
    const e = i === null ? null : holdStrain(holds[i], s, zero);
    if (i !== null && e !== null) list.push({ p: holds[i]!.pressure + head, e });
  };
  add(loading, c.start);
  for (const i of c.members) if (i <= c.peak) add(loading, i);
  for (const i of c.members) if (i >= c.peak) add(unloading, i);
  add(unloading, c.end);
  return { loading, unloading };
}

export interface FitContext {
  acc: RowAccumulator;
  holds: readonly ClassifiedHold[];
  compared: CycleSpan | null;
  usedHolds: boolean;
  zeroing: Zeroing;
  testPressure: number;
  /** trailing samples at zero pressure stand in for a return hold */
  tailOk: boolean;
  /** the compared cycle is the last one (so the trailing samples belong to it) */
  comparedIsLast: boolean;
  /** highest pressure of the compared branch (hysteresis window) */
  branchPeak: number;
}

/** Creep during the hold at test pressure: late − early strain, minus the slope × their pressure difference. */
export function creepDuring(h: RawHold | undefined, s: number, slope: number | null): number | null {
  if (!h?.early || !h.late) return null;
  const a = meanOf(h.early.slotSum[s], h.early.slotCount[s]);
  const b = meanOf(h.late.slotSum[s], h.late.slotCount[s]);
  if (a === null || b === null) return null;
  return b - a - (slope ?? 0) * (h.late.pressure - h.early.pressure);
}

/** Fits and derived values of slot s (a grid) of the compared cycle, or of all samples in the fallback. */
export function fitGrid(ctx: FitContext, s: number, predictedSlope: number, head: number): GridFit {
  const { acc, holds, compared, zeroing } = ctx;
  const z = zeroing.zero[s] ?? 0;
  const holdStrains = holds.map((h) => holdStrain(h, s, z));
  const notes: string[] = [];
  let load: LineFit | null, unload: LineFit | null, intercept: number | null;
  let peak = 0;
  let loadingPts: Pt[], unloadingPts: Pt[];
  let zeroShift: number | null = null;
  let holdCreep: number | null = null;
  let effectiveSamples: number | null = null;
  if (ctx.usedHolds && compared) {
    ({ loading: loadingPts, unloading: unloadingPts } = cyclePoints(holds, compared, s, z, head));
    for (const q of [...loadingPts, ...unloadingPts]) if (Math.abs(q.e) > Math.abs(peak)) peak = q.e;
    load = fitPoints(loadingPts);
    unload = unloadingPts.length >= 2 ? fitPoints(unloadingPts) : null;
    intercept = load ? load.intercept : null;
    if (compared.end !== null) zeroShift = holdStrains[compared.end] ?? null;
    const top = holds[compared.peak];
    if (top && top.pressure >= 0.95 * ctx.testPressure) holdCreep = creepDuring(top, s, load?.slope ?? predictedSlope);
  } else {
    load = fitFromSums(acc.slotSums('loading', s), 0);
    const post = fitFromSums(acc.slotSums('unloading', s), 0);
    unload = post && post.n >= 3 ? post : null;
    const y0 = acc.origin[s] ?? NaN; // NaN: the slot never had a reading
    const shift = (y0 === y0 ? y0 : 0) - z;
    // the intercept at the gauge's own pressure (tap pressure plus head)
    intercept = load ? load.intercept + shift - load.slope * head : null;
    if (unload) unload = { ...unload, intercept: unload.intercept + shift - unload.slope * head };
    if (load && load.n > 2) {
      const sc = serialCorrelationFromBlockSums(acc.loadBlocks, s * BLOCK_STRIDE);
      if (sc && load.slopeSE !== null && sc.slopeSE > 0) {
        // the sample count that would give this standard error if the samples were independent
        effectiveSamples = Math.min(load.n, load.n * (load.slopeSE / sc.slopeSE) ** 2);
        load = { ...load, slopeSE: sc.slopeSE, slopeCI95: [load.slope - sc.halfWidth95, load.slope + sc.halfWidth95] };
        notes.push(
          `fitted to ${load.n} samples without holds: the interval allows for serial correlation (lag-1 autocorrelation ${sc.rho.toFixed(2)} of ${sc.blocks} block means, effective sample count ${Number(effectiveSamples.toPrecision(3))})`,
        );
      } else {
        load = { ...load, slopeCI95: null, slopeSE: null };
        notes.push(
          `fitted to ${load.n} samples without holds: too few for an interval that allows for serial correlation, so none is given`,
        );
      }
    }
    const binPts = (bins: Float64Array): Pt[] => {
      const pts: Pt[] = [];
      for (let b = 0; b < N_BINS; b++) {
        const ob = s * N_BINS * 3 + b * 3;
        const p = meanOf(bins[ob], bins[ob + 2]),
          e = meanOf(bins[ob + 1], bins[ob + 2]);
        if (p !== null && e !== null) pts.push({ p: p + head, e: e - z });
      }
      return pts;
    };
    loadingPts = binPts(acc.loadBins);
    unloadingPts = binPts(acc.postBins);
    // ±Infinity, the starting values: no block mean (and no peak) for this slot
    const hi = (acc.bmMax[s] ?? -Infinity) - z,
      lo = (acc.bmMin[s] ?? Infinity) - z;
    if (Number.isFinite(hi) && Number.isFinite(lo)) peak = Math.abs(hi) >= Math.abs(lo) ? hi : lo;
  }
  if (zeroShift === null && ctx.tailOk && ctx.comparedIsLast && zeroing.known[s]) {
    const tail = meanOf(acc.tailZero[2 * s], acc.tailZero[2 * s + 1]);
    if (tail !== null) zeroShift = tail - z;
  }
  const hGap = hysteresisGap(loadingPts, unloadingPts, ctx.branchPeak + head);
  const hysteresis = hGap !== null && peak !== 0 ? hGap / Math.abs(peak) : null;
  const points: GaugeResult['points'] = [
    ...loadingPts.map((x) => ({ pressure: x.p, strain: x.e, branch: 'loading' as const })),
    ...unloadingPts.map((x) => ({ pressure: x.p, strain: x.e, branch: 'unloading' as const })),
  ];
  return {
    load,
    unload,
    intercept,
    peak,
    zeroShift,
    hysteresis,
    points,
    holdStrains,
    saturatedAt: saturationPressure(loadingPts, predictedSlope),
    holdCreep,
    effectiveSamples,
    notes,
  };
}

/**
 * Every cycle with its peak, and per grid its loading and unloading slopes and the strain left at
 * its end, each zeroed at the cycle's own start (the first cycle without a zero hold: on the first
 * samples at zero pressure, when there are some).
 */
export function cycleResults(
  acc: RowAccumulator,
  holds: readonly ClassifiedHold[],
  cycles: readonly CycleSpan[],
  compared: CycleSpan | null,
  gridIds: readonly string[],
  testPressure: number,
): CycleResult[] {
  return cycles.map((c) => {
    const gauges = gridIds.map((id, s) => {
      const start = c.start !== null ? holds[c.start] : undefined;
      const z =
        (start ? meanOf(start.slotSum[s], start.slotCount[s]) : null) ??
        (c.index === 0 ? meanOf(acc.initZero[2 * s], acc.initZero[2 * s + 1]) : null);
      if (z === null) return { id, loadingSlope: null, unloadingSlope: null, zeroShift: null };
      const { loading, unloading } = cyclePoints(holds, c, s, z, 0);
      const end = c.end !== null ? holdStrain(holds[c.end], s, z) : null;
      return {
        id,
        loadingSlope: fitPoints(loading)?.slope ?? null,
        unloadingSlope: unloading.length >= 2 ? (fitPoints(unloading)?.slope ?? null) : null,
        zeroShift: end,
      };
    });
    return {
      index: c.index,
      startHold: c.start,
      peakHold: c.peak,
      endHold: c.end,
      peakPressure: c.peakPressure,
      reachesTestPressure: c.peakPressure >= 0.95 * testPressure,
      compared: c === compared,
      gauges,
    };
  });
}
