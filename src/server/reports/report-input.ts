// What the export renderers (CSV summary, PDF report) need about one test: plain data that the
// caller assembles from the database. The renderers are pure: same input, same bytes (apart from
// generatedAt, which the caller sets). Vessel and material values are in the plan's own units.
import type { Plan } from '../../lib/reduction/plan';
import type { ProcedureFacts } from '../../lib/signing';
import { normalizeResult, type StoredResult } from '../../lib/reduction/compat';
import type { GaugeOutcome, ReductionResult, ShellModel, TestVerdict } from '../../lib/reduction/types';

export type UnitSystem = 'SI' | 'US';
export type Tolerances = Plan['tolerances'];
export type DispositionOutcome = 'accepted' | 'excluded' | 'retest';
export type SignatureKind = 'review' | 'release';

export interface ReportDisposition {
  outcome: DispositionOutcome;
  reason: string;
  /** display name of the engineer who disposed the gauge */
  by: string;
  at: Date;
}

export interface ReportSignature {
  kind: SignatureKind;
  name: string;
  email: string;
  at: Date;
  /** the reduction the signer saw; a signature on another reduction is shown as such */
  reductionId: number;
  /** the words signed, as stored with the signature */
  statement: string;
}

export interface ReportLog {
  filename: string;
  sha256: string;
  rows: number | null;
}

export interface ReportInput {
  generatedAt: Date;
  /** true unless the test is released: every page and the CSV say DRAFT */
  draft: boolean;
  test: { id: number; name: string; status: string };
  vessel: {
    tag: string;
    name: string;
    shape: 'cylinder' | 'sphere';
    ends: 'closed' | 'open';
    /** plan length unit (mm or in) */
    insideDiameter: number;
    wallThickness: number;
    length?: number;
  };
  /** elastic modulus and yield strength in the plan stress unit (MPa or psi) */
  material: { name: string; elasticModulus: number; poissonRatio: number; yieldStrength: number };
  units: UnitSystem;
  model: ShellModel;
  /** plan pressure unit (MPa or psi) */
  testPressure: number;
  /** how the test was conducted, from the plan (each absent when the plan does not say) */
  procedure: ProcedureFacts;
  tolerances: Tolerances;
  reductionId: number;
  engineVersion: string;
  logs: ReportLog[];
  /** the stored result, of any engine version (the renderers read it through toReportRecord) */
  result: StoredResult;
  /** keyed by gauge id as in result.gauges (rosette grids as `R1/A`) */
  dispositions: Record<string, ReportDisposition>;
  /** each gauge's outcome after dispositions; a gauge missing here keeps result's outcome */
  gaugeOutcomes: Record<string, GaugeOutcome>;
  /** the test's verdict after dispositions */
  verdict: TestVerdict;
  signatures: ReportSignature[];
}

/** Unit labels of a plan's unit system, ASCII for CSV headers and typographic for the PDF. */
export interface UnitLabels {
  pressure: 'MPa' | 'psi';
  stress: 'MPa' | 'psi';
  length: 'mm' | 'in';
}

export function unitLabels(units: UnitSystem): UnitLabels {
  return units === 'SI'
    ? { pressure: 'MPa', stress: 'MPa', length: 'mm' }
    : { pressure: 'psi', stress: 'psi', length: 'in' };
}

/** The input with its result in the current engine's shape: what the renderers draw from. */
export type ReportRecord = Omit<ReportInput, 'result'> & { result: ReductionResult };

/** Check the input, and read a result stored by an older engine in the current shape. */
export function toReportRecord(input: ReportInput): ReportRecord {
  assertReportInputConsistent(input);
  const result = normalizeResult(input.result, {
    yieldStrength: input.material.yieldStrength,
    yieldFraction: input.tolerances.yieldFraction,
    slopeBand: input.tolerances.slopeBand,
  });
  return { ...input, result };
}

/** Raised when the caller hands the renderers a record that contradicts itself (a wiring bug). */
export class ReportInputError extends Error {
  readonly code = 'report-input-inconsistent';
  constructor(message: string) {
    super(message);
    this.name = 'ReportInputError';
  }
}

/** Check the cross-references the renderers rely on, so a mismatch fails loudly, not silently. */
export function assertReportInputConsistent(input: ReportInput): void {
  const { result } = input;
  if (result.units !== input.units)
    throw new ReportInputError(`units say ${input.units} but the reduction result is in ${result.units}`);
  if (result.pressureUnit !== unitLabels(input.units).pressure)
    throw new ReportInputError(
      `the reduction result's pressure unit ${result.pressureUnit} does not match ${input.units} units`,
    );
  if (result.model !== input.model)
    throw new ReportInputError(`model says ${input.model} but the reduction used ${result.model}`);
  const ids = new Set(result.gauges.map((g) => g.id));
  if (ids.size !== result.gauges.length) throw new ReportInputError('the reduction result lists a gauge id twice');
  for (const id of Object.keys(input.dispositions))
    if (!ids.has(id))
      throw new ReportInputError(`disposition for gauge '${id}', which the reduction result does not list`);
  for (const id of Object.keys(input.gaugeOutcomes))
    if (!ids.has(id)) throw new ReportInputError(`outcome for gauge '${id}', which the reduction result does not list`);
}

/** The outcome to report for a gauge: after dispositions when given, else the engine's. */
export function outcomeOf(input: ReportInput | ReportRecord, gaugeId: string): GaugeOutcome {
  const gauge = input.result.gauges.find((g) => g.id === gaugeId);
  return input.gaugeOutcomes[gaugeId] ?? gauge?.outcome ?? 'not-compared';
}
