// reduceLog: from a plan and a log stream to the result (DESIGN 3.2–3.3, 4.2). One pass over the
// rows keeps only running sums: per-hold block sums (holds.ts), regression sums per gauge grid for
// both branches, pressure-binned means, zero-pressure sums at the start and the end, smoothed
// extremes, and the bounded series. Everything else is computed from those at the end.
import { InputError } from './errors';
import type { Plan, PlanGauge } from './plan';
import type { FlagCode, GaugeResult, Hold, ReductionResult, RosetteResult, Series } from './types';
import { ENGINE_VERSION } from './version';
import { LogReader, type ChunkSource, type ReadSummary } from './reader';
import { HoldDetector, classifyHolds, type ClassifiedHold } from './holds';
import { SeriesBuilder } from './series';
import { fitFromSums, fitLine, interpolateSorted, SUMS_STRIDE, type LineFit } from './stats';
import { correctionMatrix, uniaxialTransverseFactor } from './corrections';
import { effectiveThickness, predictForPlan, shellInputFromPlan, strainAtAngle, type PlannedGrid } from './shell';
import { planChannels } from './text';
import { planPressureUnit, planLengthUnit } from './units';
import { planeStress, principalDelta, principalRectangular, vonMisesPlane, wrapAxisAngle } from './rosette';

export interface ReduceOptions {
  onProgress?: (bytesRead: number) => void;
  /** buckets of the stored time history (default 5000) */
  seriesBuckets?: number;
}

interface Slot {
  grid: PlannedGrid;
  gauge: PlanGauge;
  /** channel indices (into the plan's channel list) and coefficients: value = Σ coef × raw */
  terms: { ch: number; coef: number }[];
  notes: string[];
}

const N_BINS = 28; // pressure bins of 5 % of test pressure over [−10 %, 130 %]
const BLOCK_ROWS = 64; // rows per block mean for the smoothed extremes

const fmt = (x: number, digits = 3) => (Number.isFinite(x) ? Number(x.toPrecision(digits)).toString() : String(x));

/** Build the per-grid slots: corrected strain = linear combination of raw channels. */
function buildSlots(plan: Plan, grids: PlannedGrid[], warnings: string[]): Slot[] {
  const slots: Slot[] = [];
  let offset = 0;
  let gi = 0;
  const uniaxialKt: string[] = [];
  for (const g of plan.gauges) {
    const n = g.channels.length;
    const myGrids = grids.slice(gi, gi + n);
    gi += n;
    let ratio = 0;
    if (g.kind === 'uniaxial' && g.transverseSensitivity !== 0) {
      const m = predictForPlan(plan).predicted[plan.model];
      const along = strainAtAngle(m.axialStrainPerPressure, m.hoopStrainPerPressure, g.angleDeg);
      const across = strainAtAngle(m.axialStrainPerPressure, m.hoopStrainPerPressure, g.angleDeg + 90);
      ratio = along !== 0 ? across / along : 0;
      uniaxialKt.push(g.id);
    }
    const M = correctionMatrix(g.kind, g.gaugeFactor, g.instrumentGaugeFactor, g.transverseSensitivity, ratio);
    for (const [k, grid] of myGrids.entries()) {
      // one row per grid: both come from the gauge's kind, which the plan checked against its channels
      const row = M[k];
      if (!row) throw new Error(`gauge ${g.id}: no correction row for grid ${k + 1} of ${myGrids.length}`);
      const notes: string[] = [];
      if (g.gaugeFactor !== g.instrumentGaugeFactor)
        notes.push(
          `gauge factor ${g.gaugeFactor} against instrument setting ${g.instrumentGaugeFactor}: readings scaled by ${fmt(g.instrumentGaugeFactor / g.gaugeFactor, 4)}`,
        );
      if (g.transverseSensitivity !== 0) {
        if (g.kind === 'uniaxial')
          notes.push(
            `transverse sensitivity Kt ${fmt(g.transverseSensitivity * 100)} % corrected with the ${plan.model} model's predicted transverse/along strain ratio ${fmt(ratio, 4)} (factor ${fmt(uniaxialTransverseFactor(g.transverseSensitivity, ratio), 5)})`,
          );
        else
          notes.push(
            `transverse sensitivity Kt ${fmt(g.transverseSensitivity * 100)} % corrected from the three grids (TN-509, ${g.kind === 'rosette-delta' ? 'delta' : 'rectangular'} rosette)`,
          );
      }
      const terms = row.map((coef, j) => ({ ch: offset + j, coef })).filter((x) => x.coef !== 0);
      slots.push({ grid, gauge: g, terms, notes });
    }
    offset += n;
  }
  if (uniaxialKt.length)
    warnings.push(
      `uniaxial gauge${uniaxialKt.length > 1 ? 's' : ''} ${uniaxialKt.join(', ')}: transverse sensitivity corrected with the ${plan.model} model's predicted transverse strain, not a measured one`,
    );
  return slots;
}

function toSegments(sources: ChunkSource[] | ChunkSource): ChunkSource[] {
  if (Array.isArray(sources)) return sources;
  return [sources];
}

/** Count pressure levels that are more than `band` apart. */
function distinctLevels(pressures: number[], band: number): number {
  const s = [...pressures].sort((a, b) => a - b);
  let n = 0;
  let last = -Infinity;
  for (const p of s) {
    if (p - last > band) {
      n++;
      last = p;
    }
  }
  return n;
}

interface Pt {
  p: number;
  e: number;
}

/** Largest gap between the branches at the same pressure (interpolated), inside (2 %, 98 %) of the peak pressure. */
function hysteresisGap(loading: Pt[], unloading: Pt[], peakPressure: number): number | null {
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
 * pressure rises by at least a quarter of the peak. Returns the pressure where it starts, or null.
 */
function saturationPressure(loading: Pt[], predictedSlope: number): number | null {
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

/** Mean of a running sum over its count; null when nothing was counted. */
function meanOf(sum: number | undefined, count: number | undefined): number | null {
  return sum !== undefined && count !== undefined && count > 0 ? sum / count : null;
}

/** Reduce a log (one or several consecutive segments) against a plan. */
export async function reduceLog(
  plan: Plan,
  sources: ChunkSource[] | ChunkSource,
  options: ReduceOptions = {},
): Promise<{ result: ReductionResult; series: Series }> {
  const warnings: string[] = [];
  const { predicted, gauges: grids } = predictForPlan(plan);
  const shell = shellInputFromPlan(plan);
  const slots = buildSlots(plan, grids, warnings);
  const channelNames = planChannels(plan);
  const nS = slots.length;
  const nCh = channelNames.length;
  const tp = plan.testPressure;
  const hs = plan.holdDetection;
  const bandAbs = hs.band * tp;
  const zeroBand = 2 * bandAbs;
  const binWidth = 0.05 * tp;

  // running state; every typed array below has a fixed length, and the row loops stay inside it
  const slotVals = new Float64Array(nS + nCh); // grid slots, then raw channels (for the series' zero)
  const timeIsIndex = !plan.columns.time;
  const detector = new HoldDetector(nS + nCh, {
    bandAbs,
    minDuration: timeIsIndex ? Math.max(hs.minSamples, hs.minDurationSeconds) : hs.minDurationSeconds,
    minSamples: hs.minSamples,
    settleFraction: hs.settleFraction,
  });
  const loadSums = new Float64Array(nS * SUMS_STRIDE);
  const postSums = new Float64Array(nS * SUMS_STRIDE);
  let postDirty = false;
  const origin = new Float64Array(nS).fill(NaN);
  const binStride = N_BINS * 3;
  const loadBins = new Float64Array(nS * binStride);
  const postBins = new Float64Array(nS * binStride);
  const touched = new Uint8Array(N_BINS);
  let maxP = -Infinity;
  const nZ = nS + nCh;
  const initZero = new Float64Array(nZ * 2);
  let initOpen = true;
  const tailZero = new Float64Array(nZ * 2);
  let tailN = 0;
  let tailStart = NaN;
  const blockSum = new Float64Array(nS + 1);
  const blockCnt = new Float64Array(nS + 1);
  const bmMin = new Float64Array(nS + 1).fill(Infinity);
  const bmMax = new Float64Array(nS + 1).fill(-Infinity);
  let blockRows = 0;
  const levels = new Set<number>();
  const seriesVals = new Float64Array(1 + nCh);
  const series = new SeriesBuilder(['pressure', ...channelNames], options.seriesBuckets ?? 5000, timeIsIndex);
  let lastT = NaN;
  let usedRows = 0;

  /** Fold the block means of the current BLOCK_ROWS rows into the smoothed extremes and start a new block. */
  const foldBlock = () => {
    for (let s = 0; s <= nS; s++) {
      const n = blockCnt[s]!;
      if (n > 0) {
        const m = blockSum[s]! / n;
        if (m < bmMin[s]!) bmMin[s] = m;
        if (m > bmMax[s]!) bmMax[s] = m;
      }
      blockSum[s] = 0;
      blockCnt[s] = 0;
    }
    blockRows = 0;
  };

  const reader = new LogReader(plan, (t, p, ch) => {
    usedRows++;
    lastT = t;
    // corrected grid strains, then the raw channels; ch holds the nCh channels that the slots' terms index.
    // Indexed loops: for…of over slots and terms is measurably slower per row here.
    for (let s = 0; s < nS; s++) {
      const terms = slots[s]!.terms;
      let v = 0;
      for (let j = 0; j < terms.length; j++) {
        const term = terms[j]!;
        v += term.coef * ch[term.ch]!;
      }
      slotVals[s] = v;
    }
    slotVals.set(ch, nS);
    detector.push(t, p, slotVals);

    // branch split: everything after the running maximum is provisional unloading
    if (p > maxP) {
      maxP = p;
      if (postDirty) {
        for (let i = 0; i < loadSums.length; i++) loadSums[i]! += postSums[i]!;
        postSums.fill(0);
        for (let b = 0; b < N_BINS; b++) {
          if (!touched[b]) continue;
          touched[b] = 0;
          for (let s = 0; s < nS; s++) {
            const o = s * binStride + b * 3;
            loadBins[o]! += postBins[o]!;
            loadBins[o + 1]! += postBins[o + 1]!;
            loadBins[o + 2]! += postBins[o + 2]!;
            postBins[o] = postBins[o + 1] = postBins[o + 2] = 0;
          }
        }
        postDirty = false;
      }
    } else postDirty = true;
    const sums = postDirty ? postSums : loadSums;
    const bins = postDirty ? postBins : loadBins;
    let bin = Math.floor((p + 0.1 * tp) / binWidth);
    if (bin < 0) bin = 0;
    else if (bin >= N_BINS) bin = N_BINS - 1;
    if (postDirty) touched[bin] = 1;
    for (let s = 0; s < nS; s++) {
      const raw = slotVals[s]!;
      if (raw !== raw) continue;
      let y0 = origin[s]!;
      if (y0 !== y0) origin[s] = y0 = raw;
      const y = raw - y0;
      const o = s * SUMS_STRIDE;
      sums[o]!++;
      sums[o + 1]! += p;
      sums[o + 2]! += y;
      sums[o + 3]! += p * p;
      sums[o + 4]! += p * y;
      sums[o + 5]! += y * y;
      const ob = s * binStride + bin * 3;
      bins[ob]! += p;
      bins[ob + 1]! += raw;
      bins[ob + 2]!++;
    }

    // zero-pressure samples at the start (until pressure first leaves zero) and at the end
    const atZero = Math.abs(p) <= zeroBand;
    if (atZero) {
      if (initOpen)
        for (let k = 0; k < nZ; k++) {
          const v = slotVals[k]!;
          if (v === v) {
            initZero[2 * k]! += v;
            initZero[2 * k + 1]!++;
          }
        }
      if (tailN === 0) tailStart = t;
      tailN++;
      for (let k = 0; k < nZ; k++) {
        const v = slotVals[k]!;
        if (v === v) {
          tailZero[2 * k]! += v;
          tailZero[2 * k + 1]!++;
        }
      }
    } else {
      initOpen = false;
      if (tailN > 0) {
        tailZero.fill(0);
        tailN = 0;
      }
    }

    // smoothed extremes (block means of BLOCK_ROWS rows): peak strain and peak pressure without noise spikes
    for (let s = 0; s < nS; s++) {
      const v = slotVals[s]!;
      if (v === v) {
        blockSum[s]! += v;
        blockCnt[s]!++;
      }
    }
    blockSum[nS]! += p;
    blockCnt[nS]!++;
    if (++blockRows === BLOCK_ROWS) foldBlock();
    if (levels.size < 64) levels.add(Math.round(p / bandAbs));

    seriesVals[0] = p;
    seriesVals.set(ch, 1);
    series.add(t, seriesVals);
  });
  reader.onProgress = options.onProgress;

  const segs = toSegments(sources);
  if (segs.length === 0) throw new InputError('no-data', 'no log given');
  for (const [i, seg] of segs.entries()) await reader.readSource(seg, i);
  if (blockRows > 0) foldBlock(); // the last, partial block

  const read = reader.summary();
  warnings.push(...read.warnings);
  // readSource throws unless it finds a header, so every segment read has one
  const [firstSeg] = read.segments;
  if (!firstSeg) throw new Error('the reader finished without a header line');
  if (read.rows === 0 || usedRows === 0)
    throw new InputError(
      'no-data',
      `the log has a header (line ${firstSeg.headerLine}) but no data rows with a pressure value`,
      { line: firstSeg.headerLine, column: plan.columns.pressure },
    );
  for (const [name, count] of read.validCounts)
    if (count === 0)
      throw new InputError(
        'empty-column',
        `line ${firstSeg.headerLine}, column '${name}': the column has no numeric value`,
        { line: firstSeg.headerLine, column: name },
      );
  if (read.missingSamples > 0 && read.firstMissing) {
    const fm = read.firstMissing;
    warnings.push(
      `${read.missingSamples} missing sample${read.missingSamples > 1 ? 's' : ''} (empty or non-numeric cells), the first at ${read.segments.length > 1 ? `log ${fm.source + 1}, ` : ''}line ${fm.line}, column '${fm.column}'`,
    );
  }
  if (read.timeMode === 'index')
    warnings.push(
      `no time column: time is the sample index and a hold must last ${Math.max(hs.minSamples, hs.minDurationSeconds)} samples`,
    );

  // holds and branches
  const { holds: cHolds, peakIndex } = classifyHolds(detector.finish(), bandAbs, zeroBand);
  const peakHold = cHolds[peakIndex]; // undefined when there is no hold (peakIndex −1)
  const loadingHolds = cHolds.filter((h) => h.index <= peakIndex);
  const holdLevels = distinctLevels(
    loadingHolds.map((h) => h.pressure),
    bandAbs,
  );
  const usedHolds = holdLevels >= 3 && peakHold !== undefined; // three levels imply a highest hold
  if (!usedHolds) {
    const sampleLevels = levels.size;
    if (sampleLevels < 3)
      throw new InputError(
        'too-few-levels',
        `column '${plan.columns.pressure}': the loading branch has ${sampleLevels} distinct pressure level${sampleLevels === 1 ? '' : 's'}; at least 3 are needed to fit a slope`,
        { column: plan.columns.pressure },
      );
    warnings.push(
      cHolds.length === 0
        ? 'no pressure holds found (a steady ramp?): slopes fitted to all samples'
        : `only ${holdLevels} hold level${holdLevels === 1 ? '' : 's'} on the loading branch: slopes fitted to all samples`,
    );
  }

  const peakBlockPressure = bmMax[nS] ?? -Infinity; // −Infinity: no block mean yet
  const peakPressure =
    peakBlockPressure > -Infinity ? Math.max(peakBlockPressure, usedHolds ? peakHold.pressure : -Infinity) : maxP;
  const lastHold = cHolds[cHolds.length - 1];
  const returnHold = usedHolds && lastHold?.branch === 'return' ? lastHold : null;
  const tailOk = tailN >= hs.minSamples && maxP > zeroBand && peakPressure > zeroBand;
  const returned = !!returnHold || tailOk;
  const reached = peakPressure >= 0.95 * tp;
  if (peakPressure > 1.05 * tp)
    warnings.push(
      `peak pressure ${fmt(peakPressure, 4)} ${planPressureUnit(plan.units)} exceeds the test pressure by ${fmt((peakPressure / tp - 1) * 100, 2)} %`,
    );
  const incomplete = !reached || !returned;
  if (!reached)
    warnings.push(
      `incomplete: the log has reached ${fmt(peakPressure, 4)} of ${tp} ${planPressureUnit(plan.units)} test pressure so far`,
    );
  else if (!returned) warnings.push('incomplete: the log has not come back to zero pressure yet');

  // zero reading per slot (grids and raw channels)
  const zeroHold = usedHolds ? cHolds.find((h) => h.branch === 'zero' && h.index < peakIndex) : undefined;
  const zero = new Float64Array(nZ); // stays 0 (not zeroed) where zeroKnown is 0
  const zeroKnown = new Uint8Array(nZ);
  let zeroFromSamples = 0;
  for (let k = 0; k < nZ; k++) {
    const fromHold = zeroHold ? meanOf(zeroHold.slotSum[k], zeroHold.slotCount[k]) : null;
    const fromSamples = meanOf(initZero[2 * k], initZero[2 * k + 1]);
    if (fromHold !== null) {
      zero[k] = fromHold;
      zeroKnown[k] = 1;
    } else if (fromSamples !== null) {
      zero[k] = fromSamples;
      zeroKnown[k] = 1;
      if (k < nS) zeroFromSamples++;
    }
  }
  /** zero reading of slot k; 0 (not zeroed) when the log gave none */
  const zeroOf = (k: number) => zero[k] ?? 0;
  if (usedHolds && !zeroHold)
    warnings.push(
      zeroFromSamples
        ? 'no zero-pressure hold before loading: zeroed on the first samples at zero pressure'
        : 'no zero-pressure reading before loading: strains are not zeroed',
    );
  if (!usedHolds && !zeroFromSamples) warnings.push('the log does not start at zero pressure: strains are not zeroed');
  if (!returnHold && tailOk && usedHolds)
    warnings.push(`return to zero read from the last ${tailN} samples at zero pressure (no final hold)`);

  const holdsOut: Hold[] = cHolds.map((h) => ({
    index: h.index,
    pressure: h.pressure,
    start: h.start,
    end: h.end,
    branch: h.branch,
    samples: h.samples,
  }));
  const holdMean = (h: ClassifiedHold, s: number) => {
    const m = meanOf(h.slotSum[s], h.slotCount[s]);
    return m === null ? null : m - zeroOf(s);
  };
  const tol = plan.tolerances;

  // per grid: fits, derived values
  interface Interim {
    slot: Slot;
    load: LineFit | null;
    unload: LineFit | null;
    intercept: number | null;
    peak: number;
    zeroShift: number | null;
    hysteresis: number | null;
    points: GaugeResult['points'];
    holdStrains: (number | null)[];
    saturatedAt: number | null;
  }
  // peak pressure for the hysteresis window: the highest hold, or the peak of the samples
  const branchPeak = usedHolds ? peakHold.pressure : peakPressure;
  const interim: Interim[] = slots.map((slot, s) => {
    const z = zeroOf(s);
    const holdStrains = cHolds.map((h) => holdMean(h, s));
    let load: LineFit | null, unload: LineFit | null, intercept: number | null;
    let peak = 0;
    let loadingPts: Pt[], unloadingPts: Pt[];
    let zeroShift: number | null = null;
    if (usedHolds) {
      loadingPts = [];
      unloadingPts = [];
      cHolds.forEach((h, i) => {
        const e = holdStrains[i];
        if (e === null || e === undefined) return;
        if (i <= peakIndex) loadingPts.push({ p: h.pressure, e });
        if (i >= peakIndex) unloadingPts.push({ p: h.pressure, e });
        if (Math.abs(e) > Math.abs(peak)) peak = e;
      });
      load = fitLine(
        loadingPts.map((x) => x.p),
        loadingPts.map((x) => x.e),
      );
      unload =
        unloadingPts.length >= 2
          ? fitLine(
              unloadingPts.map((x) => x.p),
              unloadingPts.map((x) => x.e),
            )
          : null;
      intercept = load ? load.intercept : null;
      if (returnHold) zeroShift = holdStrains[returnHold.index] ?? null;
    } else {
      const o = s * SUMS_STRIDE;
      load = fitFromSums(loadSums, o);
      const post = fitFromSums(postSums, o);
      unload = post && post.n >= 3 ? post : null;
      const y0 = origin[s] ?? NaN; // NaN: the slot never had a reading
      const shift = (y0 === y0 ? y0 : 0) - z;
      intercept = load ? load.intercept + shift : null;
      if (unload) unload = { ...unload, intercept: unload.intercept + shift };
      const binPts = (bins: Float64Array): Pt[] => {
        const pts: Pt[] = [];
        for (let b = 0; b < N_BINS; b++) {
          const ob = s * binStride + b * 3;
          const p = meanOf(bins[ob], bins[ob + 2]),
            e = meanOf(bins[ob + 1], bins[ob + 2]);
          if (p !== null && e !== null) pts.push({ p, e: e - z });
        }
        return pts;
      };
      loadingPts = binPts(loadBins);
      unloadingPts = binPts(postBins);
      // ±Infinity, the starting values: no block mean (and no peak) for this slot
      const hi = (bmMax[s] ?? -Infinity) - z,
        lo = (bmMin[s] ?? Infinity) - z;
      if (Number.isFinite(hi) && Number.isFinite(lo)) peak = Math.abs(hi) >= Math.abs(lo) ? hi : lo;
    }
    if (zeroShift === null && tailOk && zeroKnown[s]) {
      const tail = meanOf(tailZero[2 * s], tailZero[2 * s + 1]);
      if (tail !== null) zeroShift = tail - z;
    }
    const hGap = hysteresisGap(loadingPts, unloadingPts, branchPeak);
    const hysteresis = hGap !== null && peak !== 0 ? hGap / Math.abs(peak) : null;
    const points: GaugeResult['points'] = [
      ...loadingPts.map((x) => ({ pressure: x.p, strain: x.e, branch: 'loading' as const })),
      ...unloadingPts.map((x) => ({ pressure: x.p, strain: x.e, branch: 'unloading' as const })),
    ];
    return {
      slot,
      load,
      unload,
      intercept,
      peak,
      zeroShift,
      hysteresis,
      points,
      holdStrains,
      saturatedAt: saturationPressure(loadingPts, slot.grid.predictedSlope),
    };
  });

  // rosettes (from the corrected grid slopes)
  const E = plan.material.elasticModulus,
    nu = plan.material.poissonRatio,
    Sy = plan.material.yieldStrength;
  const m = predicted[plan.model];
  const rosettes: RosetteResult[] = [];
  const rosetteYield = new Map<string, number>();
  plan.gauges.forEach((g) => {
    if (g.kind === 'uniaxial') return;
    const [a, b, c] = interim.filter((x) => x.slot.gauge === g).map((x) => x.load?.slope ?? null);
    if (a == null || b == null || c == null) {
      warnings.push(`rosette ${g.id}: a grid has no slope, no principal strains`);
      return;
    }
    const pr = g.kind === 'rosette-rectangular' ? principalRectangular(a, b, c) : principalDelta(a, b, c);
    const [s1, s2] = planeStress(pr.e1 * 1e-6 * tp, pr.e2 * 1e-6 * tp, E, nu);
    const vm = vonMisesPlane(s1, s2);
    rosetteYield.set(g.id, vm / Sy);
    const ph = m.hoopStrainPerPressure,
      pa = m.axialStrainPerPressure;
    rosettes.push({
      id: g.id,
      kind: g.kind,
      angleDeg: g.angleDeg,
      principalStrains: [pr.e1, pr.e2],
      principalAngleDeg: wrapAxisAngle(g.angleDeg + pr.angleDeg),
      principalStresses: [s1, s2],
      vonMises: vm,
      yieldFraction: vm / Sy,
      predictedPrincipalStrains: [Math.max(ph, pa), Math.min(ph, pa)],
      flags: [],
    });
  });

  // flags and outcomes
  const lengthUnit = planLengthUnit(plan.units);
  const pUnit = planPressureUnit(plan.units);
  const gaugesOut: GaugeResult[] = interim.map((it, s) => {
    const { slot, load } = it;
    const grid = slot.grid;
    const g = slot.gauge;
    const flags: FlagCode[] = [];
    const notes = [...slot.notes];
    const measured = load ? load.slope : null;
    const predictedSlope = grid.predictedSlope;
    const ratio = measured !== null && predictedSlope !== 0 ? measured / predictedSlope : null;
    const dead = Math.abs(it.peak) < tol.noResponseMicrostrain || measured === null;
    // edgeZone implies a known distance (predictForPlan); the test spells that out for the type
    if (grid.edgeZone && grid.distanceToDiscontinuity !== null) {
      flags.push('edge-zone');
      notes.push(
        `${fmt(grid.distanceToDiscontinuity, 4)} ${lengthUnit} from the nearest discontinuity (${grid.distanceTo}), inside the edge zone 2.5·√(r t) = ${fmt(predicted.edgeZoneDistance, 4)} ${lengthUnit}: membrane prediction not valid; reported, not compared`,
      );
    } else if (grid.distanceToDiscontinuity === null && g.axialPosition === undefined)
      notes.push('distance to the nearest discontinuity not given: assumed outside the edge zone');
    if (dead) {
      flags.push('no-response');
      notes.push(
        measured === null
          ? 'no slope could be fitted (too few readings)'
          : `peak strain ${fmt(it.peak)} µε is below the ${tol.noResponseMicrostrain} µε floor: dead, disconnected or unbonded channel?`,
      );
    } else {
      if (it.saturatedAt !== null) {
        flags.push('no-response');
        notes.push(
          `strain stops changing above ${fmt(it.saturatedAt, 4)} ${pUnit}: saturated amplifier or debonded gauge?`,
        );
      }
      if (!grid.edgeZone && measured !== null && predictedSlope !== 0) {
        if (Math.sign(measured) !== Math.sign(predictedSlope)) {
          flags.push('reversed-sign');
          notes.push('slope has the opposite sign of the prediction: reversed wiring, wrong channel or wrong angle?');
        }
        if (ratio !== null && Math.abs(ratio - 1) > tol.slopeBand) flags.push('outside-band');
      }
      if (load?.rSquared !== null && load?.rSquared !== undefined && load.rSquared < tol.minRSquared)
        flags.push('nonlinear');
      if (it.hysteresis !== null && it.hysteresis > tol.hysteresis) flags.push('hysteresis');
      if (
        it.zeroShift !== null &&
        Math.abs(it.zeroShift) > Math.max(tol.zeroShiftMicrostrain, tol.zeroShiftFraction * Math.abs(it.peak))
      )
        flags.push('zero-shift');
    }
    const yieldShare = g.kind === 'uniaxial' ? predicted.membrane.yieldFraction : rosetteYield.get(g.id);
    if (yieldShare !== undefined && yieldShare > tol.yieldFraction) {
      flags.push('near-yield');
      notes.push(
        g.kind === 'uniaxial'
          ? `predicted membrane stress at test pressure is ${fmt(yieldShare * 100)} % of yield`
          : `von Mises stress from the rosette at test pressure is ${fmt(yieldShare * 100)} % of yield`,
      );
    }
    if (usedHolds && zeroHold === undefined && !zeroKnown[s])
      notes.push('not zeroed: no zero-pressure reading before loading');
    const outcome = grid.edgeZone ? 'not-compared' : flags.length ? 'flagged' : 'in-band';
    const effT = measured !== null && !dead ? effectiveThickness(shell, plan.model, grid.angleDeg, measured) : null;
    return {
      id: grid.id,
      channel: grid.channel,
      angleDeg: grid.angleDeg,
      measuredSlope: measured,
      predictedSlope,
      ratio,
      deviation: ratio === null ? null : ratio - 1,
      slopeCI95: load?.slopeCI95 ?? null,
      rSquared: load?.rSquared ?? null,
      residualSD: load?.residualSD ?? null,
      intercept: it.intercept,
      unloadingSlope: it.unload?.slope ?? null,
      hysteresis: it.hysteresis,
      zeroShift: it.zeroShift,
      peakStrain: it.peak,
      effectiveThickness: effT,
      distanceToDiscontinuity: grid.distanceToDiscontinuity,
      flags: [...new Set(flags)],
      outcome,
      holdStrains: it.holdStrains,
      points: it.points,
      notes,
    };
  });
  for (const r of rosettes) {
    const f = new Set<FlagCode>();
    gaugesOut.filter((x) => x.id.startsWith(`${r.id}/`)).forEach((x) => x.flags.forEach((c) => f.add(c)));
    if (r.yieldFraction > tol.yieldFraction) f.add('near-yield');
    r.flags = [...f];
  }
  if (predicted.membrane.yieldFraction > tol.yieldFraction)
    warnings.push(
      `predicted membrane stress at test pressure is ${fmt(predicted.membrane.yieldFraction * 100)} % of yield (limit ${fmt(tol.yieldFraction * 100)} %)`,
    );

  const verdict = incomplete ? 'incomplete' : gaugesOut.some((x) => x.outcome === 'flagged') ? 'flagged' : 'conforms';

  // series: zeroed, gauge-factor corrected strains (no transverse correction) and pressure
  // one transform per raw channel, in plan order (the order of channelNames); zeroOf is 0 where unknown
  const channelTransforms = plan.gauges
    .flatMap((g) => g.channels.map(() => g.instrumentGaugeFactor / g.gaugeFactor))
    .map((scale, c) => ({ offset: zeroOf(nS + c), scale }));
  const seriesOut = series.build([{ offset: 0, scale: 1 }, ...channelTransforms]);

  const result: ReductionResult = {
    engineVersion: ENGINE_VERSION,
    model: plan.model,
    units: plan.units,
    pressureUnit: pUnit,
    testPressure: tp,
    predicted,
    holds: holdsOut,
    gauges: gaugesOut,
    rosettes,
    verdict,
    warnings,
    log: {
      rows: read.rows,
      missingSamples: read.missingSamples,
      timeSpan: read.timeSpan,
      peakPressure,
      pressureUnitInLog: firstSeg.pressureUnit,
      usedHolds,
      ...(read.startTime ? { startTime: read.startTime } : {}),
    },
  };
  void lastT;
  void tailStart;
  return { result, series: seriesOut };
}

export type { ReadSummary };
