// LiveReducer: the reduction fed one log (one segment) chunk by chunk during the test, reporting
// each completed hold and early warnings as events (DESIGN 8). It wraps the batch Reducer (one
// code path, one accumulator), so finish().result is the batch result of the same bytes, and it
// only reads the hold detector's completed holds, so its events are a pure function of the bytes.
// Rules and their reasons: README.md, "Live reducer".
import type { RowAccumulator } from './accumulator';
import { splitCycles, type CycleSpan } from './cycles';
import { creepDuring, holdStrain, meanOf } from './fits';
import { flagGauge, isNearZeroPrediction } from './flags';
import { mergeHolds, type RawHold } from './holds';
import type { GridSetup } from './installation';
import type { Plan } from './plan';
import { Reducer, type ReduceOptions } from './reduce';
import { shellInputFromPlan, yieldCheckAt } from './shell';
import { fitLine } from './stats';
import type { ReductionResult, Series, YieldCheck } from './types';
import { gridBudget, resolveUncertainty } from './uncertainty';
import { planPressureUnit } from './units';
import { fmt } from './number-words';

export type LiveWarningCode = 'trend-outside-band' | 'hold-creep' | 'zero-drift' | 'near-yield';

/**
 * A hold has completed. `gauges` has one entry per grid, keyed by the grid id of the result
 * (`A3` for a uniaxial gauge, `R1/A`, `R1/B`, `R1/C` for a rosette's grids), so the plot gets one
 * point per plotted grid. `strain` is the grid's corrected strain (µε), zeroed like the batch
 * path, averaged over the settled part of the hold.
 */
export interface LiveHoldEvent {
  index: number;
  pressure: number;
  branch: 'loading' | 'unloading';
  gauges: { id: string; strain: number; provisionalRatio: number | null }[];
}

export interface LiveWarningEvent {
  gaugeId: string;
  code: LiveWarningCode;
  message: string;
  /** the hold pressure at which the warning was raised (plan pressure unit) */
  pressure: number;
}

export interface LiveStatusEvent {
  rows: number;
  pressure: number | null;
  verdict: 'pending' | 'flagged';
}

export type LiveEvent =
  | { type: 'hold'; data: LiveHoldEvent }
  | { type: 'warning'; data: LiveWarningEvent }
  | { type: 'status'; data: LiveStatusEvent };

/** What the live reducer has seen so far (non-destructive). */
export interface LiveSnapshot {
  rows: number;
  /** the last pressure sample (plan unit), null before the first row */
  pressure: number | null;
  /** the hold the pressure is in now, if it has lasted long enough to count, else null */
  holdInProgress: { pressure: number; samples: number } | null;
  holds: LiveHoldEvent[];
  warnings: LiveWarningEvent[];
  verdict: 'pending' | 'flagged';
}

const ORDINALS = ['first', 'second', 'third', 'fourth', 'fifth', 'sixth', 'seventh', 'eighth', 'ninth', 'tenth'];
const ordinal = (n: number) => ORDINALS[n - 1] ?? `${n}th`;

/** Per grid, what the live rules remember between holds. */
interface GridState {
  /** largest |zeroed hold strain| so far (the creep limit's "peak") */
  peak: number;
  /** the zero-drift reference: the first zero hold's early mean (raw, not zeroed) */
  zeroRef: number | null;
  raised: Set<LiveWarningCode>;
}

/**
 * The live reduction of one log (one segment, one file). `push` feeds the next bytes and returns
 * the events they caused; `finish` ends the log and gives the batch result of the same bytes.
 *
 * Events: `hold` when the hold detector completes a hold (the pressure left its band after the
 * minimum duration and samples; a hold that merely continues the previous one at the same level,
 * split by a short excursion, gives no second event), each followed by the warnings it raised;
 * `status` at most once per push, last. The hold and warning events are a pure function of the
 * bytes: the same bytes cut anywhere give the same list in the same order. Status events depend
 * on where the chunks end (rows so far): a replay repeats them only when it feeds the chunks as
 * they arrived, so numbering hold and warning events alone is safe under any re-chunking.
 *
 * `provisionalRatio` is the measured/predicted slope of the least-squares line through the current
 * cycle's starting zero hold (when it has one) and its loading holds so far, zeroed on that zero
 * hold (else on the first samples at zero pressure); null until the cycle has two loading holds
 * at pressure (above the zero band, 2 × the hold band). Provisional: the batch result compares
 * the last cycle that reaches the test pressure with its whole loading branch.
 */
export class LiveReducer {
  private readonly reducer: Reducer;
  private readonly plan: Plan;
  private readonly acc: RowAccumulator;
  private readonly setups: readonly GridSetup[];
  private readonly bandAbs: number;
  private readonly zeroBand: number;
  private readonly largestPrincipal: number;
  private readonly predictedU95: number[];
  private readonly yieldCheck: YieldCheck;
  private readonly pUnit: string;
  private readonly grids: GridState[];
  /** the hold and warning events so far (the numbered stream) */
  private readonly stream: LiveEvent[] = [];
  private readonly holdEvents: LiveHoldEvent[] = [];
  private readonly warningEvents: LiveWarningEvent[] = [];
  /** raw holds of the detector already looked at, and those merged as mergeHolds does (a left fold) */
  private rawSeen = 0;
  private readonly merged: RawHold[] = [];
  private lastStatusRows = -1;
  private finished = false;

  constructor(plan: Plan, options: ReduceOptions = {}) {
    this.plan = plan;
    this.reducer = new Reducer(plan, options);
    this.reducer.beginSegment();
    const view = this.reducer.liveView;
    this.acc = view.acc;
    this.setups = view.setups;
    this.bandAbs = view.bandAbs;
    this.zeroBand = view.zeroBand;
    const model = view.predicted.predicted[plan.model];
    this.largestPrincipal = Math.max(Math.abs(model.hoopStrainPerPressure), Math.abs(model.axialStrainPerPressure));
    const shell = shellInputFromPlan(plan);
    const inputs = resolveUncertainty(plan);
    this.predictedU95 = this.setups.map((s) => gridBudget(plan, shell, s, this.setups, model, inputs).predictedU95);
    // the batch path's yield check: test pressure plus the largest water head
    const maxHead = Math.max(0, ...this.setups.map((s) => s.headPressure));
    this.yieldCheck = yieldCheckAt(shell, plan.model, plan.testPressure + maxHead);
    this.pUnit = planPressureUnit(plan.units);
    this.grids = this.setups.map(() => ({ peak: 0, zeroRef: null, raised: new Set<LiveWarningCode>() }));
  }

  /** The next bytes of the log; returns the events they caused, in order (a status event last). */
  push(chunk: Uint8Array | string): LiveEvent[] {
    if (this.finished) throw new Error('LiveReducer: push after finish');
    const before = this.stream.length;
    this.reducer.push(chunk);
    this.collect();
    return this.withStatus(this.stream.slice(before));
  }

  /** Where the log stands now; changes nothing. */
  snapshot(): LiveSnapshot {
    const run = this.acc.detector.current;
    const hs = this.plan.holdDetection;
    const minDuration = this.plan.columns.time ? hs.minDurationSeconds : Math.max(hs.minSamples, hs.minDurationSeconds);
    const counts = !!run && run.samples >= hs.minSamples && run.duration >= minDuration;
    return {
      rows: this.acc.rows,
      pressure: this.acc.lastPressure,
      holdInProgress: counts && run ? { pressure: run.pressure, samples: run.samples } : null,
      holds: this.holdEvents.map((h) => ({ ...h, gauges: h.gauges.map((g) => ({ ...g })) })),
      warnings: this.warningEvents.map((w) => ({ ...w })),
      verdict: this.verdict(),
    };
  }

  /**
   * End of the log: the batch result of the same bytes (deep-equal to reduceLog's), its time
   * history, and every hold and warning event of the session in order, including those the end of
   * the log caused (the last hold completes when the log ends); `caused` holds only the latter,
   * with a final status event.
   */
  finish(): { result: ReductionResult; series: Series; events: LiveEvent[]; caused: LiveEvent[] } {
    if (this.finished) throw new Error('LiveReducer: finish called twice');
    this.finished = true;
    const before = this.stream.length;
    this.reducer.endSegment();
    this.collect();
    const { result, series } = this.reducer.finish(); // closes the run in progress
    this.collect();
    this.lastStatusRows = -1;
    const caused = this.withStatus(this.stream.slice(before));
    return { result, series, events: [...this.stream], caused };
  }

  private verdict(): 'pending' | 'flagged' {
    return this.warningEvents.length > 0 ? 'flagged' : 'pending';
  }

  private withStatus(events: LiveEvent[]): LiveEvent[] {
    const rows = this.acc.rows;
    if (events.length === 0 && rows === this.lastStatusRows) return events;
    this.lastStatusRows = rows;
    events.push({ type: 'status', data: { rows, pressure: this.acc.lastPressure, verdict: this.verdict() } });
    return events;
  }

  /** Every raw hold the detector completed since the last look, one at a time, in order. */
  private collect() {
    const raw = this.acc.detector.completed;
    while (this.rawSeen < raw.length) this.onRawHold(raw[this.rawSeen++]!);
  }

  /**
   * One more completed hold, judged on the holds up to it alone (so the outcome does not depend on
   * how many more holds the same chunk completed): merged and split into cycles as the batch path's
   * classifyHolds does.
   */
  private onRawHold(raw: RawHold) {
    const holds = this.merged;
    const prev = holds[holds.length - 1];
    if (prev) {
      const m = mergeHolds([prev, raw], this.bandAbs);
      if (m.length === 1) {
        holds[holds.length - 1] = m[0]!; // continues the previous hold: no new event
        return;
      }
    }
    holds.push(raw);
    const { cycles, branch: branches } = splitCycles(holds, this.zeroBand);
    const i = holds.length - 1;
    const h = holds[i]!;
    const atZero = Math.abs(h.pressure) <= this.zeroBand;
    const endsCycle = cycles.find((c) => c.end === i);
    const cycle = atZero ? (endsCycle ?? null) : (cycles.find((c) => c.members.includes(i)) ?? null);
    const branch: LiveHoldEvent['branch'] = atZero
      ? endsCycle
        ? 'unloading'
        : 'loading'
      : branches[i] === 'unloading'
        ? 'unloading'
        : 'loading';
    const beforePressure = atZero && !endsCycle && cycles.length === 0;
    const loadingAtPressure = cycle ? cycle.members.filter((m) => m <= cycle.peak).length : 0;

    const warnings: LiveWarningEvent[] = [];
    const gauges: LiveHoldEvent['gauges'] = this.setups.map((setup, s) => {
      const state = this.grids[s]!;
      const zero = cycle ? this.zeroOf(holds, cycle, s) : this.leadingZero(holds, s);
      const strain = holdStrain(h, s, zero);
      if (strain !== null && Math.abs(strain) > state.peak) state.peak = Math.abs(strain);
      const fit = cycle && loadingAtPressure >= 2 ? this.loadingFit(holds, cycle, s, zero) : null;
      const pred = setup.grid.predictedSlope;
      const ratio = fit && pred !== 0 ? fit.slope / pred : null;
      const raise = (code: LiveWarningCode, message: string) => {
        if (state.raised.has(code)) return;
        state.raised.add(code);
        warnings.push({ gaugeId: setup.grid.id, code, message, pressure: h.pressure });
      };
      if (beforePressure) this.checkZeroDrift(h, s, raise);
      if (!atZero) this.checkCreep(h, s, fit?.slope ?? pred, raise);
      if (fit && branch === 'loading' && !atZero) {
        this.checkTrend(s, fit, loadingAtPressure, raise);
        if (ratio !== null) this.checkYield(s, ratio, loadingAtPressure, raise);
      }
      // NaN (null in JSON): the grid had no reading during the hold
      return { id: setup.grid.id, strain: strain ?? NaN, provisionalRatio: ratio };
    });
    const hold: LiveHoldEvent = { index: i, pressure: h.pressure, branch, gauges };
    this.holdEvents.push(hold);
    this.stream.push({ type: 'hold', data: hold });
    for (const w of warnings) {
      this.warningEvents.push(w);
      this.stream.push({ type: 'warning', data: w });
    }
  }

  /** The zero of slot s for a cycle: its starting zero hold, else (first cycle) the first samples at zero pressure, else 0. */
  private zeroOf(holds: readonly RawHold[], c: CycleSpan, s: number): number {
    const start = c.start !== null ? holds[c.start] : undefined;
    const fromHold = start ? meanOf(start.slotSum[s], start.slotCount[s]) : null;
    if (fromHold !== null) return fromHold;
    // the first samples at zero pressure are final once the pressure has left zero, which it has
    // when a cycle has a hold at pressure
    const fromInit = c.index === 0 ? meanOf(this.acc.initZero[2 * s], this.acc.initZero[2 * s + 1]) : null;
    return fromInit ?? 0;
  }

  /** Before any hold at pressure: zero holds are zeroed on the first one. */
  private leadingZero(holds: readonly RawHold[], s: number): number {
    const first = holds[0];
    return (first && meanOf(first.slotSum[s], first.slotCount[s])) ?? 0;
  }

  /** The loading line of the current cycle so far: its zero hold and loading holds (as the batch path's points). */
  private loadingFit(holds: readonly RawHold[], c: CycleSpan, s: number, zero: number) {
    const head = this.setups[s]!.headPressure;
    const ps: number[] = [];
    const es: number[] = [];
    for (const k of [c.start, ...c.members.filter((m) => m <= c.peak)]) {
      if (k === null) continue;
      const e = holdStrain(holds[k], s, zero);
      if (e === null) continue;
      ps.push(holds[k]!.pressure + head);
      es.push(e);
    }
    return fitLine(ps, es);
  }

  /** zero-drift: before any pressure, a channel moved from its first zero reading by more than the zero-shift limit. */
  private checkZeroDrift(h: RawHold, s: number, raise: (c: LiveWarningCode, m: string) => void) {
    const state = this.grids[s]!;
    const early = h.early ? meanOf(h.early.slotSum[s], h.early.slotCount[s]) : null;
    const late = h.late ? meanOf(h.late.slotSum[s], h.late.slotCount[s]) : null;
    const mean = meanOf(h.slotSum[s], h.slotCount[s]);
    if (state.zeroRef === null) state.zeroRef = early ?? mean;
    const now = late ?? mean;
    if (state.zeroRef === null || now === null) return;
    const moved = now - state.zeroRef;
    const tol = this.plan.tolerances;
    const predictedPeak = this.setups[s]!.grid.predictedSlope * this.plan.testPressure;
    const limit = Math.max(tol.zeroShiftMicrostrain, tol.zeroShiftFraction * Math.abs(predictedPeak));
    if (Math.abs(moved) > limit)
      raise(
        'zero-drift',
        `${this.name(s)} moved ${moved > 0 ? '+' : ''}${fmt(moved)} µε at zero pressure, before any pressure was applied (limit ${fmt(limit)} µε); check the bridge completion, the lead wire connections and the gauge's temperature before pressurising, and re-zero once it is steady.`,
      );
  }

  /** hold-creep: the batch rule (late − early third, less slope × pressure change) at every hold at pressure. */
  private checkCreep(h: RawHold, s: number, slope: number, raise: (c: LiveWarningCode, m: string) => void) {
    const creep = creepDuring(h, s, slope);
    if (creep === null) return;
    const tol = this.plan.tolerances;
    const limit = Math.max(tol.holdCreepMicrostrain, tol.holdCreepFraction * this.grids[s]!.peak);
    if (Math.abs(creep) > limit)
      raise(
        'hold-creep',
        `${this.name(s)} moved ${creep > 0 ? '+' : ''}${fmt(creep)} µε during the hold at ${fmt(h.pressure, 4)} ${this.pUnit} while the pressure stayed steady (limit ${fmt(limit)} µε); look for a leak, yielding near the gauge or a gauge coming loose, and keep clear of the vessel until the cause is known.`,
      );
  }

  /** trend-outside-band: the loading line so far against the plan's band (flags.ts's rule). */
  private checkTrend(
    s: number,
    fit: NonNullable<ReturnType<typeof fitLine>>,
    loadingHolds: number,
    raise: (c: LiveWarningCode, m: string) => void,
  ) {
    const { grid } = this.setups[s]!;
    if (grid.edgeZone) return; // reported, not compared (as in the batch path)
    const pred = grid.predictedSlope;
    const predictedPeak = pred * this.plan.testPressure;
    const f = flagGauge({
      predictedSlope: pred,
      measuredSlope: fit.slope,
      slopeCI95: fit.slopeCI95,
      rSquared: null,
      peakStrain: predictedPeak, // judged on the slope alone: a dead channel shows as a slope far outside the band
      predictedPeak,
      zeroShift: null,
      hysteresis: null,
      saturatedAt: null,
      holdCreep: null,
      edgeZone: false,
      largestPrincipal: this.largestPrincipal,
      predictedU95: this.predictedU95[s] ?? null,
      yieldFraction: 0,
      yieldWhere: '',
      rosetteYieldFraction: null,
      rosetteFlags: [],
      tolerances: this.plan.tolerances,
      pressureUnit: this.pUnit,
    });
    if (!f.flags.includes('outside-band')) return;
    const after = `after the ${ordinal(loadingHolds)} loading hold`;
    const trend = this.trendName(grid.angleDeg);
    const unit = `µε/${this.pUnit}`;
    let said: string;
    if (f.bandBasis === 'near-zero')
      said = `${this.name(s)} reads ${fmt(fit.slope)} ${unit} ${after} where its predicted ${trend} is only ${fmt(pred)} ${unit}, further off than the band allows`;
    else if (Math.sign(fit.slope) !== Math.sign(pred))
      said = `${this.name(s)} reads against its predicted ${trend} ${after} (${fmt(fit.slope)} ${unit}, predicted ${fmt(pred)}); check the wiring polarity and the channel mapping`;
    else {
      const dev = (fit.slope / pred - 1) * 100;
      said = `${this.name(s)} reads ${fmt(Math.abs(dev), 2)} % ${dev < 0 ? 'below' : 'above'} its predicted ${trend} ${after}`;
    }
    raise(
      'trend-outside-band',
      `${said}; check the gauge factor, the lead wires and the bonding before raising the pressure further.`,
    );
  }

  /** near-yield: the yield check's stress scaled by the grid's measured/predicted ratio reaches the limit. */
  private checkYield(s: number, ratio: number, loadingHolds: number, raise: (c: LiveWarningCode, m: string) => void) {
    const { grid } = this.setups[s]!;
    if (grid.edgeZone || isNearZeroPrediction(grid.predictedSlope, this.largestPrincipal)) return;
    const limit = this.plan.tolerances.yieldFraction;
    const projected = this.yieldCheck.fraction * Math.abs(ratio);
    if (projected < limit) return;
    raise(
      'near-yield',
      `${this.name(s)} reads ${fmt(Math.abs(ratio))} × its prediction after the ${ordinal(loadingHolds)} loading hold: at the test pressure of ${fmt(this.plan.testPressure, 4)} ${this.pUnit} that puts the largest stress in the wall at about ${fmt(projected * 100)} % of yield (limit ${fmt(limit * 100)} %); hold the pressure where it is, keep everyone clear, and have the responsible engineer check the wall thickness, the material and the test pressure against the governing code before going on.`,
    );
  }

  private name(s: number): string {
    const { grid } = this.setups[s]!;
    return grid.grid ? `Grid ${grid.grid} of rosette ${grid.gaugeId}` : `Gauge ${grid.id}`;
  }

  private trendName(angleDeg: number): string {
    const a = ((angleDeg % 180) + 180) % 180;
    if (Math.abs(a - 90) < 1e-9) return 'hoop trend';
    if (a < 1e-9) return 'axial trend';
    return `trend at ${fmt(angleDeg)}° to the axis`;
  }
}
