// reduceLog: from a plan and a log to the result (DESIGN 3.2–3.4, 4.2). The Reducer takes the log
// as byte chunks, segment by segment (push-style: the reader splits lines across chunks), keeps
// only running sums in the row accumulator, and computes everything else in finish(): holds and
// cycles, zeroing, per-grid fits (fits.ts), the uncertainty budget, rosettes, flags (flags.ts).
// reduceLog is the Reducer fed whole sources.
import { RowAccumulator } from './accumulator';
import { comparedCycle, type CycleSpan } from './cycles';
import { InputError } from './errors';
import { cycleResults, fitGrid, zeroReadings, type GridFit } from './fits';
import { flagGauge } from './flags';
import { classifyHolds, type ClassifiedHold } from './holds';
import { planGridSetups, type GridSetup } from './installation';
import type { Plan } from './plan';
import { describeConversion, LogReader, type ChunkSource, type ReadSummary } from './reader';
import { evaluateRosette } from './rosette';
import { effectiveThickness, predictForPlan, shellInputFromPlan, yieldCheckAt } from './shell';
import type { GaugeResult, Hold, ReductionResult, RosetteResult, Series } from './types';
import { describeUncertainty, gridBudget, resolveUncertainty } from './uncertainty';
import { planLengthUnit, planPressureUnit, unitThatFits } from './units';
import { ENGINE_VERSION } from './version';
import { fmt } from './number-words';

export interface ReduceOptions {
  onProgress?: (bytesRead: number) => void;
  /** buckets of the stored time history (default 5000) */
  seriesBuckets?: number;
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

const YIELD_WHERE: Record<ReductionResult['yieldCheck']['surface'], string> = {
  inner: 'von Mises at the bore',
  outer: 'von Mises at the outer surface',
  'mid-wall': 'membrane von Mises',
};

/**
 * The reduction as a state fed chunk by chunk: `beginSegment()`, `push(chunk)` as often as the log
 * arrives (a chunk may end anywhere, even inside a line), `endSegment()`, and `finish()` once.
 */
export class Reducer {
  private readonly plan: Plan;
  private readonly predicted: ReturnType<typeof predictForPlan>;
  private readonly setups: GridSetup[];
  private readonly acc: RowAccumulator;
  private readonly reader: LogReader;
  private readonly bandAbs: number;
  private readonly zeroBand: number;
  private readonly warnings: string[] = [];
  private segmentsRead = 0;

  constructor(plan: Plan, options: ReduceOptions = {}) {
    this.plan = plan;
    this.predicted = predictForPlan(plan);
    this.setups = planGridSetups(plan, this.predicted.gauges, this.predicted.predicted[plan.model]);
    const tp = plan.testPressure;
    const hs = plan.holdDetection;
    this.bandAbs = hs.band * tp;
    this.zeroBand = 2 * this.bandAbs;
    const timeIsIndex = !plan.columns.time;
    this.acc = new RowAccumulator(this.setups, {
      testPressure: tp,
      bandAbs: this.bandAbs,
      zeroBand: this.zeroBand,
      hold: {
        minDuration: timeIsIndex ? Math.max(hs.minSamples, hs.minDurationSeconds) : hs.minDurationSeconds,
        minSamples: hs.minSamples,
        settleFraction: hs.settleFraction,
      },
      seriesBuckets: options.seriesBuckets ?? 5000,
      timeIsIndex,
      seriesChannels: ['pressure', ...this.setups.map((s) => s.grid.channel)],
    });
    const acc = this.acc;
    this.reader = new LogReader(plan, (t, p, ch) => acc.push(t, p, ch));
    this.reader.onProgress = options.onProgress;
    const model = plan.model;
    const uni = this.setups.filter((s) => s.transverseCorrection === 'model-ratio').map((s) => s.gauge.id);
    if (uni.length)
      this.warnings.push(
        `uniaxial gauge${uni.length > 1 ? 's' : ''} ${uni.join(', ')}: transverse sensitivity corrected with the ${model} model's predicted transverse strain, not a measured one`,
      );
  }

  /**
   * What the live reducer reads between chunks (live.ts): the accumulator and the plan's grids and
   * settings. Read only: the reduction itself never depends on who looked.
   */
  get liveView(): {
    acc: RowAccumulator;
    setups: readonly GridSetup[];
    predicted: ReturnType<typeof predictForPlan>;
    bandAbs: number;
    zeroBand: number;
  } {
    return {
      acc: this.acc,
      setups: this.setups,
      predicted: this.predicted,
      bandAbs: this.bandAbs,
      zeroBand: this.zeroBand,
    };
  }

  /** Start the next segment of the log (a file with its own preamble and header). */
  beginSegment(): void {
    this.reader.beginSegment();
    this.segmentsRead++;
  }

  /** The next bytes (or text) of the current segment. */
  push(chunk: Uint8Array | string): void {
    this.reader.push(chunk);
  }

  endSegment(): void {
    this.reader.endSegment();
  }

  /** Everything from the sums: the result and the time history. Call once, after the last endSegment. */
  finish(): { result: ReductionResult; series: Series } {
    const { plan, acc } = this;
    if (this.segmentsRead === 0) throw new InputError('no-data', 'no log given');
    acc.finish();
    const read = this.reader.summary();
    const warnings = [...this.warnings];
    this.checkRead(read, warnings);
    const tp = plan.testPressure;
    const pUnit = planPressureUnit(plan.units);
    const { predicted } = this.predicted;
    const model = predicted[plan.model];
    const shell = shellInputFromPlan(plan);

    // holds, cycles and the cycle compared
    const { holds, cycles } = classifyHolds(acc.detector.finish(), this.bandAbs, this.zeroBand);
    const compared = comparedCycle(cycles, tp);
    const loadingLevels = compared
      ? distinctLevels(
          [compared.start, ...compared.members.filter((i) => i <= compared.peak)]
            .filter((i): i is number => i !== null)
            .map((i) => holds[i]!.pressure),
          this.bandAbs,
        )
      : 0;
    const usedHolds = compared !== null && loadingLevels >= 3;
    if (!usedHolds) {
      if (acc.levels < 3)
        throw new InputError(
          'too-few-levels',
          `column '${plan.columns.pressure}': the loading branch has ${acc.levels} distinct pressure level${acc.levels === 1 ? '' : 's'}; at least 3 are needed to fit a slope`,
          { column: plan.columns.pressure },
        );
      warnings.push(
        holds.length === 0
          ? 'no pressure holds found (a steady ramp?): slopes fitted to all samples'
          : `only ${loadingLevels} hold level${loadingLevels === 1 ? '' : 's'} on the loading branch: slopes fitted to all samples`,
      );
      if (cycles.length > 1)
        warnings.push(`the log holds ${cycles.length} pressure cycles; the fit to all samples mixes them`);
    }
    const peakBlock = acc.bmMax[acc.nS] ?? -Infinity; // −Infinity: no block mean yet
    const comparedPeak = usedHolds ? compared.peakPressure : -Infinity;
    const peakPressure =
      peakBlock > -Infinity ? Math.max(usedHolds ? comparedPeak : peakBlock, comparedPeak) : acc.maxP;
    const logPeak = peakBlock > -Infinity ? Math.max(peakBlock, comparedPeak) : acc.maxP;
    const comparedIsLast = !usedHolds || compared === cycles[cycles.length - 1];
    const returnHold = usedHolds && compared.end !== null ? holds[compared.end] : undefined;
    const tailOk =
      acc.tailN >= plan.holdDetection.minSamples && acc.maxP > this.zeroBand && peakPressure > this.zeroBand;
    const returned = !!returnHold || (tailOk && comparedIsLast);
    const reached = peakPressure >= 0.95 * tp;
    if (logPeak > 1.05 * tp)
      warnings.push(
        `peak pressure ${fmt(logPeak, 4)} ${pUnit} exceeds the test pressure by ${fmt((logPeak / tp - 1) * 100, 2)} %`,
      );
    const incomplete = !reached || !returned;
    if (!reached)
      warnings.push(`incomplete: the log has reached ${fmt(peakPressure, 4)} of ${tp} ${pUnit} test pressure so far`);
    else if (!returned) warnings.push('incomplete: the log has not come back to zero pressure yet');

    // zero readings and cycles
    const zeroing = zeroReadings(acc, holds, usedHolds ? compared : null, usedHolds);
    if (usedHolds && !zeroing.hold)
      warnings.push(
        zeroing.fromSamples
          ? 'no zero-pressure hold before loading: zeroed on the first samples at zero pressure'
          : 'no zero-pressure reading before loading: strains are not zeroed',
      );
    if (!usedHolds && !zeroing.fromSamples)
      warnings.push('the log does not start at zero pressure: strains are not zeroed');
    if (!returnHold && tailOk && usedHolds && comparedIsLast)
      warnings.push(`return to zero read from the last ${acc.tailN} samples at zero pressure (no final hold)`);
    const cyclesOut = usedHolds
      ? cycleResults(
          acc,
          holds,
          cycles,
          compared,
          this.setups.map((s) => s.grid.id),
          tp,
        )
      : [];
    if (usedHolds && cycles.length > 1) this.cycleWarnings(cyclesOut, compared, warnings);

    // per grid: fits and the uncertainty budget
    const branchPeak = usedHolds ? compared.peakPressure : peakPressure;
    const fits: GridFit[] = this.setups.map((setup, s) =>
      fitGrid(
        {
          acc,
          holds,
          compared: usedHolds ? compared : null,
          usedHolds,
          zeroing,
          testPressure: tp,
          tailOk,
          comparedIsLast,
          branchPeak,
        },
        s,
        setup.grid.predictedSlope,
        setup.headPressure,
      ),
    );
    const inputs = resolveUncertainty(plan);
    const budgets = this.setups.map((setup) => gridBudget(plan, shell, setup, this.setups, model, inputs));

    // the yield check at test pressure plus the largest water head, then rosettes
    const maxHead = Math.max(0, ...this.setups.map((s) => s.headPressure));
    const yc = yieldCheckAt(shell, plan.model, tp + maxHead);
    const yieldCheck = {
      ...yc,
      model: plan.model,
      limit: plan.tolerances.yieldFraction,
      nearYield: yc.fraction >= plan.tolerances.yieldFraction,
    };
    if (yieldCheck.nearYield)
      warnings.push(
        `near yield: ${YIELD_WHERE[yc.surface]} (${plan.model === 'lame' ? 'Lamé' : 'membrane'}) at ${fmt(yc.pressure, 4)} ${pUnit} is ${fmt(yc.stress, 4)} ${pUnit}, ${fmt(yc.fraction * 100)} % of yield (limit ${fmt(plan.tolerances.yieldFraction * 100)} %)`,
      );
    const rosettes = this.rosettes(fits, warnings);

    // flags and outcomes
    const largestPrincipal = Math.max(Math.abs(model.hoopStrainPerPressure), Math.abs(model.axialStrainPerPressure));
    const lengthUnit = planLengthUnit(plan.units);
    const edgeUnchecked: string[] = [];
    const gauges: GaugeResult[] = this.setups.map((setup, s) => {
      const fit = fits[s]!;
      const { grid, gauge } = setup;
      const budget = budgets[s]!;
      const rosette = grid.grid !== null ? rosettes.find((r) => r.id === gauge.id) : undefined;
      const measured = fit.load ? fit.load.slope : null;
      const f = flagGauge({
        predictedSlope: grid.predictedSlope,
        measuredSlope: measured,
        slopeCI95: fit.load?.slopeCI95 ?? null,
        rSquared: fit.load?.rSquared ?? null,
        peakStrain: fit.peak,
        predictedPeak: grid.predictedSlope * tp,
        zeroShift: fit.zeroShift,
        hysteresis: fit.hysteresis,
        saturatedAt: fit.saturatedAt,
        holdCreep: fit.holdCreep,
        edgeZone: grid.edgeZone,
        largestPrincipal,
        predictedU95: budget.predictedU95,
        yieldFraction: yieldCheck.fraction,
        yieldWhere: `${YIELD_WHERE[yc.surface]}, ${plan.model === 'lame' ? 'Lamé' : 'membrane'}`,
        rosetteYieldFraction: rosette?.yieldFraction ?? null,
        rosetteFlags: rosette?.flags ?? [],
        tolerances: plan.tolerances,
        pressureUnit: pUnit,
      });
      const notes = [...setup.notes, ...fit.notes];
      if (grid.edgeZone && grid.distanceToDiscontinuity !== null)
        notes.push(
          `${fmt(grid.distanceToDiscontinuity, 4)} ${lengthUnit} from the nearest discontinuity (${grid.distanceTo}), inside the edge zone 2.5·√(r t) (r the mean radius) = ${fmt(predicted.edgeZoneDistance, 4)} ${lengthUnit}: membrane prediction not valid; reported, not compared`,
        );
      else if (grid.distanceToDiscontinuity === null && gauge.axialPosition === undefined) {
        notes.push(
          'not checked against the edge zone: the plan gives neither a distance to the nearest discontinuity nor a place on the shell',
        );
        if (!edgeUnchecked.includes(gauge.id)) edgeUnchecked.push(gauge.id);
      }
      notes.push(...f.notes);
      if (usedHolds && !zeroing.hold && !zeroing.known[s])
        notes.push('not zeroed: no zero-pressure reading before loading');
      const [dominant] = budget.budget;
      if (dominant && dominant.contribution > 0)
        notes.push(
          `prediction uncertainty U95 ±${fmt(budget.predictedU95)} µε/${pUnit}, mostly from ${describeUncertainty(dominant)} (${fmt(dominant.share * 100, 2)} % of the variance)`,
        );
      const dead = f.flags.includes('no-response') && fit.saturatedAt === null;
      const nearZero = f.bandBasis === 'near-zero';
      const ratio = measured !== null && grid.predictedSlope !== 0 ? measured / grid.predictedSlope : null;
      return {
        id: grid.id,
        channel: grid.channel,
        angleDeg: grid.angleDeg,
        measuredSlope: measured,
        predictedSlope: grid.predictedSlope,
        ratio,
        deviation: ratio === null ? null : ratio - 1,
        slopeCI95: fit.load?.slopeCI95 ?? null,
        rSquared: fit.load?.rSquared ?? null,
        residualSD: fit.load?.residualSD ?? null,
        intercept: fit.intercept,
        unloadingSlope: fit.unload?.slope ?? null,
        hysteresis: fit.hysteresis,
        zeroShift: fit.zeroShift,
        peakStrain: fit.peak,
        effectiveThickness:
          measured !== null && !dead && !nearZero
            ? effectiveThickness(shell, plan.model, grid.angleDeg, measured)
            : null,
        distanceToDiscontinuity: grid.distanceToDiscontinuity,
        flags: f.flags,
        outcome: f.outcome,
        predictedU95: budget.predictedU95,
        uncertaintyBudget: budget.budget,
        bandSlope: f.bandSlope,
        bandBasis: f.bandBasis,
        transverseCorrection: setup.transverseCorrection,
        pairedWith: setup.pairedWith,
        holdCreep: fit.holdCreep,
        headPressure: setup.headPressure,
        effectiveSamples: fit.effectiveSamples,
        holdStrains: fit.holdStrains,
        points: fit.points,
        notes,
      };
    });
    if (edgeUnchecked.length)
      warnings.push(
        `not checked against the edge zone (no distance to a discontinuity, no place on the shell): ${edgeUnchecked.join(', ')}; compared as if clear of every discontinuity`,
      );
    for (const r of rosettes) {
      const f = new Set(r.flags);
      gauges.filter((x) => x.id.startsWith(`${r.id}/`)).forEach((x) => x.flags.forEach((c) => f.add(c)));
      r.flags = [...f];
    }
    const verdict = incomplete ? 'incomplete' : gauges.some((x) => x.outcome === 'flagged') ? 'flagged' : 'conforms';

    // series: pressure and every grid's corrected strain, zeroed
    const series = acc.series.build([
      { offset: 0, scale: 1 },
      ...this.setups.map((_, s) => ({ offset: zeroing.zero[s] ?? 0, scale: 1 })),
    ]);

    const [firstSeg] = read.segments;
    const result: ReductionResult = {
      engineVersion: ENGINE_VERSION,
      model: plan.model,
      units: plan.units,
      pressureUnit: pUnit,
      testPressure: tp,
      predicted,
      holds: holds.map((h): Hold => ({
        index: h.index,
        cycle: h.cycle,
        pressure: h.pressure,
        start: h.start,
        end: h.end,
        branch: h.branch,
        samples: h.samples,
      })),
      gauges,
      rosettes,
      verdict,
      warnings,
      yieldCheck,
      bandMode: plan.tolerances.bandMode,
      cycles: cyclesOut,
      uncertaintyInputs: inputs.map((i) => ({
        input: i.input,
        standardUncertainty: i.standardUncertainty,
        unit: i.unit,
        assumed: i.assumed,
      })),
      log: {
        rows: read.rows,
        missingSamples: read.missingSamples,
        timeSpan: read.timeSpan,
        peakPressure,
        pressureUnitInLog: firstSeg?.pressureUnit ?? null,
        pressureConversion: firstSeg?.conversion ?? null,
        usedHolds,
        ...(read.startTime ? { startTime: read.startTime } : {}),
      },
    };
    return { result, series };
  }

  /** Refuse what cannot be reduced; add the reader's warnings. */
  private checkRead(read: ReadSummary, warnings: string[]) {
    const { plan } = this;
    const hs = plan.holdDetection;
    warnings.push(...read.warnings);
    // endSegment throws unless it finds a header, so every segment read has one
    const [firstSeg] = read.segments;
    if (!firstSeg) throw new Error('the reader finished without a header line');
    if (read.rows === 0 || this.acc.rows === 0)
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
    const up = read.unitlessPeak;
    const tp = plan.testPressure;
    const pUnit = planPressureUnit(plan.units);
    if (up && up.value > 2 * tp) {
      const fits = unitThatFits(up.value, tp, pUnit);
      const where = `${read.segments.length > 1 ? `log ${up.source + 1}, ` : ''}line ${up.line}, column '${up.column}'`;
      throw new InputError(
        'implausible-pressure',
        `${where}: the pressure column names no unit, so it is read in ${pUnit}, but it peaks at ${fmt(up.value, 4)}, ${fmt(up.value / tp, 3)} × the test pressure ${tp} ${pUnit}; ${fits ? `the values look like ${fits}: name the unit in the header, e.g. '${up.column} [${fits}]'` : `name its unit in the header, e.g. '${up.column} [kPa]'`}`,
        { line: up.line, column: up.column, source: up.source },
      );
    }
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
    for (const seg of read.segments.slice(1))
      if (
        firstSeg.conversion &&
        seg.conversion &&
        describeConversion(seg.conversion) !== describeConversion(firstSeg.conversion)
      )
        warnings.push(
          'the segments of the log give their pressure in different units (each converted as its header says)',
        );
  }

  /** Which cycle is compared, and the permanent set an earlier cycle left. */
  private cycleWarnings(cyclesOut: ReductionResult['cycles'], compared: CycleSpan, warnings: string[]) {
    const { plan } = this;
    const tol = plan.tolerances;
    const pUnit = planPressureUnit(plan.units);
    warnings.push(
      `the log holds ${cyclesOut.length} pressure cycles; cycle ${compared.index + 1} (peak ${fmt(compared.peakPressure, 4)} ${pUnit}) is compared, zeroed at its own start`,
    );
    for (const c of cyclesOut) {
      if (c.compared || c.index > compared.index) continue;
      const set = c.gauges.filter((g) => g.zeroShift !== null && Math.abs(g.zeroShift) > tol.zeroShiftMicrostrain);
      if (set.length)
        warnings.push(
          `cycle ${c.index + 1} (peak ${fmt(c.peakPressure, 4)} ${pUnit}) left a permanent set: ${set.map((g) => `${g.id} ${g.zeroShift! > 0 ? '+' : ''}${fmt(g.zeroShift!)} µε`).join(', ')}`,
        );
    }
  }

  /** Rosettes from the corrected grid slopes. */
  private rosettes(fits: readonly GridFit[], warnings: string[]): RosetteResult[] {
    const { plan } = this;
    const model = this.predicted.predicted[plan.model];
    const out: RosetteResult[] = [];
    for (const g of plan.gauges) {
      if (g.kind === 'uniaxial') continue;
      const idx = this.setups.map((s, i) => (s.gauge === g ? i : -1)).filter((i) => i >= 0);
      const [a, b, c] = idx.map((i) => fits[i]?.load?.slope ?? null);
      if (a == null || b == null || c == null) {
        warnings.push(`rosette ${g.id}: a grid has no slope, no principal strains`);
        continue;
      }
      const head = this.setups[idx[0]!]?.headPressure ?? 0;
      out.push(
        evaluateRosette({
          id: g.id,
          kind: g.kind,
          angleDeg: g.angleDeg,
          slopes: [a, b, c],
          elasticModulus: plan.material.elasticModulus,
          poissonRatio: plan.material.poissonRatio,
          yieldStrength: plan.material.yieldStrength,
          pressure: plan.testPressure + head,
          predictedHoop: model.hoopStrainPerPressure,
          predictedAxial: model.axialStrainPerPressure,
          shape: plan.vessel.shape,
          directionTolerance: plan.tolerances.principalDirectionDeg,
        }),
      );
    }
    return out;
  }
}

function toSegments(sources: ChunkSource[] | ChunkSource): ChunkSource[] {
  if (Array.isArray(sources)) return sources;
  return [sources];
}

/** Reduce a log (one or several consecutive segments) against a plan: the Reducer fed whole sources. */
export async function reduceLog(
  plan: Plan,
  sources: ChunkSource[] | ChunkSource,
  options: ReduceOptions = {},
): Promise<{ result: ReductionResult; series: Series }> {
  const segs = toSegments(sources);
  if (segs.length === 0) throw new InputError('no-data', 'no log given');
  const reducer = new Reducer(plan, options);
  for (const seg of segs) {
    reducer.beginSegment();
    for await (const chunk of seg) reducer.push(chunk);
    reducer.endSegment();
  }
  return reducer.finish();
}

export type { ReadSummary, ClassifiedHold };
