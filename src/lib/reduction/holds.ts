// Streaming hold detection. A hold is a run of samples whose pressure stays within ±band of the
// run's mean for at least the minimum duration and does not drift by more than the band over its
// settled part (which tells a hold from a slow ramp). Memory per run is bounded: the run's sums are
// kept in at most MAX_BLOCKS blocks whose size doubles as the run grows, so the settled part (the
// run without its first settleFraction) is known at the end to within 1/32 of the run.
import type { HoldBranch } from './types';
import { splitCycles, type CycleSpan } from './cycles';

export interface HoldSettings {
  /** half-width of the band, plan pressure unit */
  bandAbs: number;
  /** seconds (or samples when time is the sample index) */
  minDuration: number;
  minSamples: number;
  settleFraction: number;
  /** an excursion out of the band shorter than this many samples and gapSeconds does not end a hold */
  maxGapSamples?: number;
  gapSeconds?: number;
}

/** Sums over the first or the last third of a hold's settled part: per slot, and pressure. */
export interface HoldWindow {
  slotSum: Float64Array;
  slotCount: Float64Array;
  /** mean pressure and mean time over the window */
  pressure: number;
  time: number;
  samples: number;
}

/** A detected hold with the sums of every slot over its settled part. */
export interface RawHold {
  start: number;
  end: number;
  settledStart: number;
  pressure: number;
  /** samples in the settled part */
  samples: number;
  slotSum: Float64Array;
  slotCount: Float64Array;
  /** the first and last third of the settled part (null when it has fewer than two blocks): creep */
  early: HoldWindow | null;
  late: HoldWindow | null;
}

const MAX_BLOCKS = 64;

interface Block {
  n: number;
  startIndex: number;
  t0: number;
  t1: number;
  sumT: number;
  sumP: number;
  sumTT: number;
  sumTP: number;
  slotSum: Float64Array;
  /** per slot the samples of this block without a value (count = n − miss) */
  slotMiss: Float64Array;
}

export class HoldDetector {
  private readonly s: Required<HoldSettings>;
  private readonly nSlots: number;
  /** MAX_BLOCKS blocks from the constructor on, each with nSlots slot sums; the first nb are in use. */
  private readonly blocks: Block[] = [];
  private nb = 0;
  private blockSize = 1;
  private runN = 0;
  private runMean = 0;
  private runT0 = 0;
  private lastInT = 0;
  private pending = 0;
  private readonly out: RawHold[] = [];

  constructor(nSlots: number, settings: HoldSettings) {
    this.nSlots = nSlots;
    this.s = { maxGapSamples: 3, gapSeconds: 0.5, ...settings };
    for (let i = 0; i < MAX_BLOCKS; i++)
      this.blocks.push({
        n: 0,
        startIndex: 0,
        t0: 0,
        t1: 0,
        sumT: 0,
        sumP: 0,
        sumTT: 0,
        sumTP: 0,
        slotSum: new Float64Array(nSlots),
        slotMiss: new Float64Array(nSlots),
      });
  }

  /** One sample: time, pressure (finite) and the slot values (NaN = missing). */
  push(t: number, p: number, slots: Float64Array): void {
    if (this.runN === 0) return this.startRun(t, p, slots);
    if (Math.abs(p - this.runMean) <= this.s.bandAbs) {
      this.pending = 0;
      this.add(t, p, slots);
    } else {
      this.pending++;
      if (this.pending > this.s.maxGapSamples && t - this.lastInT > this.s.gapSeconds) {
        this.closeRun();
        this.startRun(t, p, slots);
      }
    }
  }

  /** The run in progress (not yet a hold): its mean pressure, samples and duration; null before the first sample. */
  get current(): { pressure: number; samples: number; duration: number } | null {
    return this.runN > 0 ? { pressure: this.runMean, samples: this.runN, duration: this.lastInT - this.runT0 } : null;
  }

  /** The holds completed so far, in time order (the run in progress is not among them). */
  get completed(): readonly RawHold[] {
    return this.out;
  }

  /** Close the last run and return every hold found, in time order. */
  finish(): RawHold[] {
    if (this.runN > 0) this.closeRun(true);
    this.runN = 0;
    return this.out;
  }

  private startRun(t: number, p: number, slots: Float64Array) {
    this.runN = 0;
    this.runMean = p;
    this.runT0 = t;
    this.pending = 0;
    this.nb = 0;
    this.blockSize = 1;
    this.add(t, p, slots);
  }

  private resetBlock(b: Block, startIndex: number, t: number) {
    b.n = 0;
    b.startIndex = startIndex;
    b.t0 = t;
    b.t1 = t;
    b.sumT = b.sumP = b.sumTT = b.sumTP = 0;
    b.slotSum.fill(0);
    b.slotMiss.fill(0);
  }

  private add(t: number, p: number, slots: Float64Array) {
    let b = this.nb > 0 ? this.blocks[this.nb - 1] : undefined;
    if (!b || b.n >= this.blockSize) {
      if (this.nb === MAX_BLOCKS) this.compact();
      // nb < MAX_BLOCKS here, and every block exists from the constructor on
      b = this.blocks[this.nb++]!;
      this.resetBlock(b, this.runN, t);
    }
    this.runN++;
    this.runMean += (p - this.runMean) / this.runN;
    this.lastInT = t;
    const tr = t - this.runT0;
    b.n++;
    b.t1 = t;
    b.sumT += tr;
    b.sumP += p;
    b.sumTT += tr * tr;
    b.sumTP += tr * p;
    // hot: k < nSlots, the length of both sums and (by contract) of the caller's slot values
    const ss = b.slotSum,
      sm = b.slotMiss;
    for (let k = 0; k < this.nSlots; k++) {
      const v = slots[k]!;
      if (v === v) ss[k]! += v;
      else sm[k]!++;
    }
  }

  /** Merge blocks pairwise (64 → 32) and double the block size. */
  private compact() {
    const bl = this.blocks;
    for (let i = 0; i < MAX_BLOCKS / 2; i++) {
      // all MAX_BLOCKS blocks are in use when compact runs
      const a = bl[2 * i]!,
        c = bl[2 * i + 1]!,
        dst = bl[i]!;
      if (dst !== a) {
        dst.n = a.n;
        dst.startIndex = a.startIndex;
        dst.t0 = a.t0;
        dst.t1 = a.t1;
        dst.sumT = a.sumT;
        dst.sumP = a.sumP;
        dst.sumTT = a.sumTT;
        dst.sumTP = a.sumTP;
        dst.slotSum.set(a.slotSum);
        dst.slotMiss.set(a.slotMiss);
      }
      dst.n += c.n;
      dst.t1 = c.t1;
      dst.sumT += c.sumT;
      dst.sumP += c.sumP;
      dst.sumTT += c.sumTT;
      dst.sumTP += c.sumTP;
      addInto(dst.slotSum, c.slotSum);
      addInto(dst.slotMiss, c.slotMiss);
    }
    this.nb = MAX_BLOCKS / 2;
    this.blockSize *= 2;
  }

  /** atEnd: the run was cut by the end of the log, so a ramp may look short: a stricter drift limit. */
  private closeRun(atEnd = false) {
    const { runN } = this;
    const duration = this.lastInT - this.runT0;
    if (runN < this.s.minSamples || duration < this.s.minDuration || this.nb === 0) return;
    const settleIndex = Math.ceil(this.s.settleFraction * runN);
    // the settled part: from the first block that starts at or after settleIndex (at least the last block)
    const used = this.blocks.slice(0, this.nb);
    const firstSettled = used.findIndex((b) => b.startIndex >= settleIndex);
    const settled = used.slice(firstSettled < 0 ? used.length - 1 : firstSettled);
    const [firstBlock] = settled;
    if (!firstBlock) return;
    let n = 0,
      sumT = 0,
      sumP = 0,
      sumTT = 0,
      sumTP = 0;
    const slotSum = new Float64Array(this.nSlots);
    const slotCount = new Float64Array(this.nSlots);
    for (const b of settled) {
      n += b.n;
      sumT += b.sumT;
      sumP += b.sumP;
      sumTT += b.sumTT;
      sumTP += b.sumTP;
      addInto(slotSum, b.slotSum);
      addCounts(slotCount, b);
    }
    if (n < 2) return;
    const settledStart = firstBlock.t0;
    const denom = n * sumTT - sumT * sumT;
    const slope = denom > 0 ? (n * sumTP - sumT * sumP) / denom : 0;
    const drift = Math.abs(slope) * (this.lastInT - settledStart);
    if (drift > (atEnd ? 0.25 : 1) * this.s.bandAbs) return; // a ramp, not a hold
    this.out.push({
      start: this.runT0,
      end: this.lastInT,
      settledStart,
      pressure: sumP / n,
      samples: n,
      slotSum,
      slotCount,
      early: settled.length >= 2 ? this.window(settled, n, false) : null,
      late: settled.length >= 2 ? this.window(settled, n, true) : null,
    });
  }

  /** Sums of the blocks that make up the first (or last) third of n samples; at least one block. */
  private window(blocks: readonly Block[], n: number, fromEnd: boolean): HoldWindow {
    const slotSum = new Float64Array(this.nSlots);
    const slotCount = new Float64Array(this.nSlots);
    let m = 0,
      sumP = 0,
      sumT = 0;
    const order = fromEnd ? [...blocks].reverse() : blocks;
    // stop before the middle block so the two windows never share one
    const limit = Math.max(1, Math.floor(blocks.length / 2));
    for (const [k, b] of order.entries()) {
      if (k >= limit || (m > 0 && m >= n / 3)) break;
      m += b.n;
      sumP += b.sumP;
      sumT += b.sumT;
      addInto(slotSum, b.slotSum);
      addCounts(slotCount, b);
    }
    return { slotSum, slotCount, pressure: sumP / m, time: this.runT0 + sumT / m, samples: m };
  }
}

export interface ClassifiedHold extends RawHold {
  index: number;
  branch: HoldBranch;
  /** the cycle the hold belongs to (cycles.ts) */
  cycle: number;
}

/** Merge neighbouring holds at the same level (a short excursion split them): sums add, windows keep the ends. */
export function mergeHolds(raw: readonly RawHold[], bandAbs: number): RawHold[] {
  const merged: RawHold[] = [];
  for (const h of raw) {
    const prev = merged[merged.length - 1];
    if (prev && Math.abs(prev.pressure - h.pressure) <= bandAbs) {
      const n = prev.samples + h.samples;
      const slotSum = prev.slotSum.slice();
      const slotCount = prev.slotCount.slice();
      addInto(slotSum, h.slotSum);
      addInto(slotCount, h.slotCount);
      merged[merged.length - 1] = {
        start: prev.start,
        end: h.end,
        settledStart: prev.settledStart,
        pressure: (prev.pressure * prev.samples + h.pressure * h.samples) / n,
        samples: n,
        slotSum,
        slotCount,
        early: prev.early ?? h.early,
        late: h.late ?? prev.late,
      };
    } else merged.push(h);
  }
  return merged;
}

/**
 * Merge neighbouring holds at the same level, split them into pressure cycles and name the
 * branches (cycles.ts): per cycle, the zero hold it starts from, loading up to its highest hold,
 * unloading after it, and `return` for a zero hold that ends a cycle and starts no other.
 */
export function classifyHolds(
  raw: readonly RawHold[],
  bandAbs: number,
  zeroBand: number,
): { holds: ClassifiedHold[]; cycles: CycleSpan[] } {
  const merged = mergeHolds(raw, bandAbs);
  const { cycles, branch, cycleOf } = splitCycles(merged, zeroBand);
  const holds = merged.map((h, i): ClassifiedHold => ({ ...h, index: i, branch: branch[i]!, cycle: cycleOf[i]! }));
  return { holds, cycles };
}

/** Detect and classify holds in arrays of time and pressure (for tests and small logs). */
export function detectHolds(
  t: readonly number[],
  p: readonly number[],
  settings: HoldSettings,
  zeroBand = 2 * settings.bandAbs,
): ClassifiedHold[] {
  const det = new HoldDetector(0, settings);
  const none = new Float64Array(0);
  const n = Math.min(t.length, p.length);
  for (let i = 0; i < n; i++) {
    const ti = t[i],
      pi = p[i];
    if (ti !== undefined && pi !== undefined && Number.isFinite(pi)) det.push(ti, pi, none);
  }
  return classifyHolds(det.finish(), settings.bandAbs, zeroBand).holds;
}

/** counts[k] += the block's samples with a value in slot k. */
function addCounts(counts: Float64Array, b: Block): void {
  for (let k = 0; k < counts.length; k++) counts[k]! += b.n - b.slotMiss[k]!;
}

/** dst[k] += src[k] for every k of the shorter array (the slot sums of one detector share one length). */
function addInto(dst: Float64Array, src: Float64Array): void {
  const n = Math.min(dst.length, src.length);
  for (let k = 0; k < n; k++) dst[k]! += src[k]!;
}
