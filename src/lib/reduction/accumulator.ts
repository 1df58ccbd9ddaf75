// The row accumulator: everything reduceLog keeps while the rows stream past, as running sums of
// fixed size (memory flat with the log's length). Per row: each grid's corrected strain (a linear
// combination of raw channels), the hold detector, regression sums of all samples for the
// no-hold fallback (loading up to the running pressure maximum, the rest provisional unloading),
// zero-pressure sums at the start and at the end, the bounded time history. Per block of
// BLOCK_ROWS rows: block means for the smoothed extremes, the fallback's pressure bins and the
// block-level regression whose residual autocorrelation gives the fallback's effective sample count.
import { HoldDetector, type HoldSettings } from './holds';
import { SeriesBuilder } from './series';

export const N_BINS = 28; // pressure bins of 5 % of test pressure over [−10 %, 130 %]
export const BLOCK_ROWS = 64;
/** block-level regression sums per slot: n, Σx, Σy, Σx², Σxy, Σy², then lag pairs: m, Σyy', Σ(xy' + x'y), Σxx', Σ(y + y'), Σ(x + x') */
export const BLOCK_STRIDE = 12;
const BIN_STRIDE = N_BINS * 3;

export interface AccumulatorSettings {
  testPressure: number;
  /** ± half-width of the hold band, plan pressure unit */
  bandAbs: number;
  /** "at zero" within this, plan pressure unit */
  zeroBand: number;
  hold: Omit<HoldSettings, 'bandAbs'>;
  seriesBuckets: number;
  timeIsIndex: boolean;
  seriesChannels: string[];
}

/** One grid's corrected strain: Σ coef × raw channel. */
export interface SlotTerms {
  terms: readonly { ch: number; coef: number }[];
}

export class RowAccumulator {
  readonly nS: number;
  readonly detector: HoldDetector;
  readonly series: SeriesBuilder;
  private readonly termStart: Int32Array;
  private readonly termCh: Int32Array;
  private readonly termCoef: Float64Array;
  /** [pressure, slot values…]: the slot values are a view into it, so the series takes it as is */
  private readonly seriesVals: Float64Array;
  private readonly slotVals: Float64Array;
  private readonly tp: number;
  private readonly binWidth: number;
  private readonly zeroBand: number;

  // fallback regression over all samples, per branch: n, Σp, Σp² common to every slot, per slot
  // Σy, Σpy, Σy², and per slot the n, Σp, Σp² of the rows it lacks (so a missing value costs, not a present one)
  private readonly loadCommon = new Float64Array(3);
  private readonly postCommon = new Float64Array(3);
  private readonly loadSlot: Float64Array;
  private readonly postSlot: Float64Array;
  private readonly loadMiss: Float64Array;
  private readonly postMiss: Float64Array;
  private postDirty = false;
  /** per slot the first reading (the sums' origin), NaN until then */
  readonly origin: Float64Array;
  maxP = -Infinity;
  rows = 0;

  // zero-pressure sums: [sum, count] per slot
  readonly initZero: Float64Array;
  private initOpen = true;
  readonly tailZero: Float64Array;
  tailN = 0;

  // blocks: per slot the sum (and the pressure's at index nS), rows in the block, per slot the rows without a value
  private readonly blockSum: Float64Array;
  private blockCount = 0;
  private readonly blockMiss: Float64Array;
  private blockRows = 0;
  private blockNewMax = false;
  readonly bmMin: Float64Array;
  readonly bmMax: Float64Array;
  readonly loadBins: Float64Array;
  readonly postBins: Float64Array;
  readonly loadBlocks: Float64Array;
  readonly postBlocks: Float64Array;
  private postBlocksDirty = false;
  /** per slot the previous block mean (x, y) and which sums it went to (0 none, 1 load, 2 post) */
  private readonly prevBlock: Float64Array;
  private readonly prevBranch: Uint8Array;

  // distinct pressure levels (band-quantised), counted up to 3
  private level1 = NaN;
  private level2 = NaN;
  levels = 0;

  constructor(slots: readonly SlotTerms[], s: AccumulatorSettings) {
    const nS = slots.length;
    this.nS = nS;
    this.tp = s.testPressure;
    this.binWidth = 0.05 * s.testPressure;
    this.zeroBand = s.zeroBand;
    this.bandAbs = s.bandAbs;
    this.termStart = new Int32Array(nS + 1);
    const flat = slots.flatMap((x) => x.terms);
    this.termCh = Int32Array.from(flat.map((x) => x.ch));
    this.termCoef = Float64Array.from(flat.map((x) => x.coef));
    let k = 0;
    slots.forEach((x, i) => {
      this.termStart[i] = k;
      k += x.terms.length;
    });
    this.termStart[nS] = k;
    this.seriesVals = new Float64Array(1 + nS);
    this.slotVals = this.seriesVals.subarray(1);
    this.detector = new HoldDetector(nS, { bandAbs: s.bandAbs, ...s.hold });
    this.series = new SeriesBuilder(s.seriesChannels, s.seriesBuckets, s.timeIsIndex);
    this.loadSlot = new Float64Array(nS * 3);
    this.postSlot = new Float64Array(nS * 3);
    this.loadMiss = new Float64Array(nS * 3);
    this.postMiss = new Float64Array(nS * 3);
    this.origin = new Float64Array(nS).fill(NaN);
    this.initZero = new Float64Array(nS * 2);
    this.tailZero = new Float64Array(nS * 2);
    this.blockSum = new Float64Array(nS + 1);
    this.blockMiss = new Float64Array(nS);
    this.bmMin = new Float64Array(nS + 1).fill(Infinity);
    this.bmMax = new Float64Array(nS + 1).fill(-Infinity);
    this.loadBins = new Float64Array(nS * BIN_STRIDE);
    this.postBins = new Float64Array(nS * BIN_STRIDE);
    this.loadBlocks = new Float64Array(nS * BLOCK_STRIDE);
    this.postBlocks = new Float64Array(nS * BLOCK_STRIDE);
    this.prevBlock = new Float64Array(nS * 2);
    this.prevBranch = new Uint8Array(nS);
  }

  private readonly bandAbs: number;

  /** One row: time, gauge pressure (plan unit), raw channel values (NaN = missing). */
  push(t: number, p: number, ch: Float64Array): void {
    const nS = this.nS;
    const sv = this.slotVals;
    const ts = this.termStart,
      tc = this.termCh,
      tk = this.termCoef;
    // hot: every index below stays inside arrays sized in the constructor
    for (let s = 0; s < nS; s++) {
      let v = 0;
      for (let j = ts[s]!, end = ts[s + 1]!; j < end; j++) v += tk[j]! * ch[tc[j]!]!;
      sv[s] = v;
    }
    this.rows++;
    this.detector.push(t, p, sv);

    // branch split: everything after the running maximum is provisional unloading
    if (p > this.maxP) {
      this.maxP = p;
      this.blockNewMax = true;
      if (this.postDirty) this.mergePost();
    } else this.postDirty = true;
    const post = this.postDirty;
    const common = post ? this.postCommon : this.loadCommon;
    const sums = post ? this.postSlot : this.loadSlot;
    const miss = post ? this.postMiss : this.loadMiss;
    const pp = p * p;
    common[0]!++;
    common[1]! += p;
    common[2]! += pp;
    const origin = this.origin;
    const bs = this.blockSum,
      bm = this.blockMiss;
    for (let s = 0; s < nS; s++) {
      const raw = sv[s]!;
      const o = 3 * s;
      if (raw !== raw) {
        miss[o]!++;
        miss[o + 1]! += p;
        miss[o + 2]! += pp;
        bm[s]!++;
        continue;
      }
      let y0 = origin[s]!;
      if (y0 !== y0) origin[s] = y0 = raw;
      const y = raw - y0;
      sums[o]! += y;
      sums[o + 1]! += p * y;
      sums[o + 2]! += y * y;
      bs[s]! += raw;
    }
    bs[nS]! += p;
    this.blockCount++;

    // zero-pressure samples at the start (until pressure first leaves zero) and at the end
    if (p <= this.zeroBand && p >= -this.zeroBand) {
      if (this.initOpen) accumulatePairs(this.initZero, sv, nS);
      this.tailN++;
      accumulatePairs(this.tailZero, sv, nS);
    } else {
      this.initOpen = false;
      if (this.tailN > 0) {
        this.tailZero.fill(0);
        this.tailN = 0;
      }
    }

    if (this.levels < 3) this.countLevel(Math.round(p / this.bandAbs));
    if (++this.blockRows === BLOCK_ROWS) this.foldBlock();
    this.seriesVals[0] = p;
    this.series.add(t, this.seriesVals);
  }

  /** The pressure of the last row (plan unit), null before the first. */
  get lastPressure(): number | null {
    return this.rows > 0 ? this.seriesVals[0]! : null;
  }

  /** The end of the rows: fold the last, partial block. */
  finish(): void {
    if (this.blockRows > 0) this.foldBlock();
  }

  /** Provisional unloading rows turn out to be loading: a new pressure maximum came after them. */
  private mergePost() {
    addInto(this.loadCommon, this.postCommon);
    addInto(this.loadSlot, this.postSlot);
    addInto(this.loadMiss, this.postMiss);
    this.postCommon.fill(0);
    this.postSlot.fill(0);
    this.postMiss.fill(0);
    this.postDirty = false;
  }

  /**
   * Slot s's regression sums of all samples on a branch in the layout of stats.fitFromSums
   * (n, Σx, Σy, Σx², Σxy, Σy², y relative to `origin[s]`).
   */
  slotSums(branch: 'loading' | 'unloading', s: number): Float64Array {
    const c = branch === 'loading' ? this.loadCommon : this.postCommon;
    const y = branch === 'loading' ? this.loadSlot : this.postSlot;
    const m = branch === 'loading' ? this.loadMiss : this.postMiss;
    const o = 3 * s;
    return Float64Array.of(c[0]! - m[o]!, c[1]! - m[o + 1]!, y[o]!, c[2]! - m[o + 2]!, y[o + 1]!, y[o + 2]!);
  }

  private countLevel(q: number) {
    if (this.levels === 0) {
      this.level1 = q;
      this.levels = 1;
    } else if (this.levels === 1) {
      if (q !== this.level1) {
        this.level2 = q;
        this.levels = 2;
      }
    } else if (q !== this.level1 && q !== this.level2) this.levels = 3;
  }

  /** Block means into the smoothed extremes, the fallback's bins and block-level regression sums. */
  private foldBlock() {
    const nS = this.nS;
    const bs = this.blockSum;
    const pn = this.blockCount;
    const pMean = pn > 0 ? bs[nS]! / pn : NaN;
    if (pn > 0) {
      if (pMean < this.bmMin[nS]!) this.bmMin[nS] = pMean;
      if (pMean > this.bmMax[nS]!) this.bmMax[nS] = pMean;
    }
    // a block that set a new pressure maximum is loading, and so is every provisional block before it
    if (this.blockNewMax && this.postBlocksDirty) {
      addInto(this.loadBlocks, this.postBlocks);
      addInto(this.loadBins, this.postBins);
      this.postBlocks.fill(0);
      this.postBins.fill(0);
      this.postBlocksDirty = false;
      for (let s = 0; s < nS; s++) if (this.prevBranch[s] === 2) this.prevBranch[s] = 1;
    }
    const branch = this.blockNewMax ? 1 : 2;
    if (branch === 2) this.postBlocksDirty = true;
    const blocks = branch === 1 ? this.loadBlocks : this.postBlocks;
    const bins = branch === 1 ? this.loadBins : this.postBins;
    let bin = Math.floor((pMean + 0.1 * this.tp) / this.binWidth);
    if (!(bin >= 0)) bin = 0;
    else if (bin >= N_BINS) bin = N_BINS - 1;
    for (let s = 0; s < nS; s++) {
      const n = pn - this.blockMiss[s]!;
      if (n > 0) {
        const m = bs[s]! / n;
        if (m < this.bmMin[s]!) this.bmMin[s] = m;
        if (m > this.bmMax[s]!) this.bmMax[s] = m;
        const ob = s * BIN_STRIDE + bin * 3;
        bins[ob]! += pMean * n;
        bins[ob + 1]! += bs[s]!;
        bins[ob + 2]! += n;
        const x = pMean;
        const y = m - (this.origin[s]! || 0);
        const o = s * BLOCK_STRIDE;
        blocks[o]!++;
        blocks[o + 1]! += x;
        blocks[o + 2]! += y;
        blocks[o + 3]! += x * x;
        blocks[o + 4]! += x * y;
        blocks[o + 5]! += y * y;
        if (this.prevBranch[s] === branch) {
          const px = this.prevBlock[2 * s]!,
            py = this.prevBlock[2 * s + 1]!;
          blocks[o + 6]!++;
          blocks[o + 7]! += y * py;
          blocks[o + 8]! += x * py + px * y;
          blocks[o + 9]! += x * px;
          blocks[o + 10]! += y + py;
          blocks[o + 11]! += x + px;
        }
        this.prevBlock[2 * s] = x;
        this.prevBlock[2 * s + 1] = y;
        this.prevBranch[s] = branch;
      } else this.prevBranch[s] = 0;
      bs[s] = 0;
      this.blockMiss[s] = 0;
    }
    bs[nS] = 0;
    this.blockCount = 0;
    this.blockRows = 0;
    this.blockNewMax = false;
  }
}

/** sums[2k] += v[k], sums[2k+1]++ for every present (non-NaN) v[k], k < n. */
function accumulatePairs(sums: Float64Array, v: Float64Array, n: number) {
  for (let k = 0; k < n; k++) {
    const x = v[k]!;
    if (x === x) {
      sums[2 * k]! += x;
      sums[2 * k + 1]!++;
    }
  }
}

/** dst[k] += src[k] (same length). */
function addInto(dst: Float64Array, src: Float64Array) {
  for (let k = 0; k < dst.length; k++) dst[k]! += src[k]!;
}
