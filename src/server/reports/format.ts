// Formatting shared by the CSV and PDF renderers, so both show the same numbers with the same
// precision, and the column list that both tables are built from.
import type {
  FlagCode,
  GaugeOutcome,
  GaugeResult,
  ReductionResult,
  RosetteResult,
  ShellModel,
  TestVerdict,
} from '../../lib/reduction/types';
import { CONDUCT_FIELDS } from '../../lib/signing';
import { SLOPE_FIGURES, formatSignificant } from '../../lib/ui-format';
import { MODEL_NAME, VERDICT_LABEL, VERDICT_MEANING, VERDICT_SCOPE } from '../../lib/verdict-words';
import { outcomeOf, unitLabels, type ReportInput, type ReportRecord, type UnitSystem } from './report-input';

/**
 * Decimal places per quantity in the plan's units. Slopes are not here: they take significant
 * figures (formatSlopeNumber), as on every screen.
 */
export interface Precision {
  /** the water head, a pressure (MPa or psi) */
  head: number;
  stress: number;
  length: number;
  distance: number;
}

export function precisionFor(units: UnitSystem): Precision {
  return units === 'SI'
    ? { head: 4, stress: 1, length: 2, distance: 0 }
    : { head: 6, stress: 0, length: 4, distance: 2 };
}

/** Fixed decimals, '' for null or non-finite, and never "-0.00". */
export function formatFixed(value: number | null | undefined, decimals: number): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '';
  const text = value.toFixed(decimals);
  return /^-0(\.0+)?$/.test(text) ? text.slice(1) : text;
}

/**
 * A strain-per-pressure slope with the significant figures every screen shows (ui-format's
 * formatSlope: 237.0 µε/MPa, 1.634 µε/psi), written with an ASCII minus so a spreadsheet reads the
 * CSV cell as a number; the PDF turns it into a true minus with showNumber. '' when absent.
 */
export function formatSlopeNumber(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '';
  return formatSignificant(value, SLOPE_FIGURES).replace('\u2212', '-');
}

/**
 * A number as the PDF shows it: typographic minus, and digits grouped by spaces from five
 * digits up (29 500 000 psi), as ISO 80000 writes them. The CSV keeps plain ASCII.
 */
export function showNumber(text: string): string {
  const match = /^(-?)(\d+)(\.\d+)?$/.exec(text);
  if (!match) return text;
  const [, sign, whole, fraction = ''] = match;
  const grouped = whole!.length >= 5 ? whole!.replace(/\B(?=(\d{3})+$)/g, ' ') : whole!;
  return `${sign ? '\u2212' : ''}${grouped}${fraction}`;
}

/** A fraction (0.05) as a percentage number (5.00), fixed decimals. */
export function formatPercent(fraction: number | null | undefined, decimals = 2): string {
  if (fraction === null || fraction === undefined || !Number.isFinite(fraction)) return '';
  return formatFixed(fraction * 100, decimals);
}

/** A plan value as typed (3.4, 1800), without binary-float noise such as 0.30000000000000004. */
export function formatPlain(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '';
  return String(Number(value.toPrecision(12)));
}

/** ISO 8601 in UTC to the second, e.g. 2026-12-01T14:05:00Z. */
export function formatIsoUtc(at: Date): string {
  return at.toISOString().replace(/\.\d{3}Z$/, 'Z');
}

/** Human date and time in UTC for the PDF, e.g. 2026-12-01 14:05 UTC. */
export function formatDateTimeUtc(at: Date): string {
  return `${at.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}

export const OUTCOME_LABELS: Record<GaugeOutcome, string> = {
  'in-band': 'in band',
  flagged: 'flagged',
  excluded: 'excluded',
  'not-compared': 'not compared',
};

export const VERDICT_LABELS: Record<TestVerdict, string> = VERDICT_LABEL;

/** The verdict's meaning, as on the review banner (src/lib/verdict-words.ts). */
export const VERDICT_EXPLANATIONS: Record<TestVerdict, string> = VERDICT_MEANING;

export const MODEL_LABELS: Record<ShellModel, string> = MODEL_NAME;

/** A flag in words, short enough for a table cell; the code stays in the CSV. */
export const FLAG_LABELS: Record<FlagCode, string> = {
  'outside-band': 'outside tolerance',
  nonlinear: 'not linear',
  hysteresis: 'hysteresis',
  'zero-shift': 'zero shift',
  'no-response': 'no response',
  'reversed-sign': 'reversed sign',
  'edge-zone': 'edge zone, not compared',
  'near-yield': 'near yield',
  'hold-creep': 'creeps in hold',
  'principal-direction': 'principal direction off',
};

/** Where the stress of the yield check sits, in words (DESIGN 3.1). */
export const YIELD_SURFACE_LABELS: Record<ReductionResult['yieldCheck']['surface'], string> = {
  inner: 'von Mises at the bore (inner surface)',
  outer: 'von Mises at the outer surface',
  'mid-wall': 'membrane von Mises (mid-wall)',
};

/** The input that contributes most to a gauge's predicted-slope uncertainty, as a plain ASCII name. */
export function dominantUncertainty(g: GaugeResult): string {
  const [top] = g.uncertaintyBudget;
  return top && top.contribution > 0 ? top.input : '';
}

/** The test conduct facts in their fixed order: CSV key, PDF label, value ('' when the plan does not say). */
export function conductRows(input: ReportRecord | ReportInput): { csv: string; label: string; value: string }[] {
  return CONDUCT_FIELDS.map((f) => ({ csv: f.csv, label: f.short, value: input.procedure[f.key] ?? '' }));
}

/** The caution every export carries (DESIGN: reports carry it on every page). */
export const REPORT_CAUTION =
  'Caution: a hydrotest stores energy. Follow the written test procedure. This comparison of measured strain with ' +
  'the elastic prediction supports, and does not replace, the judgement of the responsible engineer and the ' +
  'authorised inspector; it is not acceptance of the hydrostatic test. The governing code and the jurisdiction decide.';

/** Said beside every verdict in the exports. */
export const VERDICT_SCOPE_TEXT = VERDICT_SCOPE;

/** Spreadsheets run a cell that starts with = + - @ as a formula: quote free text so it stays text. */
export function neutraliseFormula(text: string): string {
  return /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
}

export interface GaugeColumn {
  /** plain ASCII CSV header with units, e.g. predicted_slope_ue_per_MPa */
  csv: string;
  /** the cell text, already at the column's precision ('' when absent) */
  value: (g: GaugeResult) => string;
  /** free text typed by a person (quoted against formula injection in the CSV) */
  freeText?: boolean;
}

/** The gauge table's columns in order; the PDF picks from the same list by csv name. */
export function buildGaugeColumns(input: ReportRecord): GaugeColumn[] {
  const u = unitLabels(input.units);
  const p = precisionFor(input.units);
  const slope = `ue_per_${u.pressure}`;
  const disposition = (g: GaugeResult) => input.dispositions[g.id];
  return [
    { csv: 'gauge_id', value: (g) => g.id },
    { csv: 'channel', value: (g) => g.channel },
    { csv: 'angle_deg', value: (g) => formatFixed(g.angleDeg, 1) },
    { csv: `predicted_slope_${slope}`, value: (g) => formatSlopeNumber(g.predictedSlope) },
    { csv: `measured_slope_${slope}`, value: (g) => formatSlopeNumber(g.measuredSlope) },
    { csv: 'ratio', value: (g) => formatFixed(g.ratio, 4) },
    { csv: 'deviation_pct', value: (g) => formatPercent(g.deviation, 2) },
    { csv: `slope_ci95_low_${slope}`, value: (g) => formatSlopeNumber(g.slopeCI95?.[0]) },
    { csv: `slope_ci95_high_${slope}`, value: (g) => formatSlopeNumber(g.slopeCI95?.[1]) },
    { csv: `band_low_${slope}`, value: (g) => formatSlopeNumber(g.bandSlope?.[0]) },
    { csv: `band_high_${slope}`, value: (g) => formatSlopeNumber(g.bandSlope?.[1]) },
    { csv: 'band_basis', value: (g) => g.bandBasis },
    { csv: `predicted_u95_${slope}`, value: (g) => formatSlopeNumber(g.predictedU95) },
    { csv: 'dominant_uncertainty_input', value: dominantUncertainty },
    { csv: 'dominant_uncertainty_share_pct', value: (g) => formatPercent(g.uncertaintyBudget[0]?.share, 1) },
    { csv: 'r_squared', value: (g) => formatFixed(g.rSquared, 5) },
    { csv: `unloading_slope_${slope}`, value: (g) => formatSlopeNumber(g.unloadingSlope) },
    { csv: 'hysteresis_pct', value: (g) => formatPercent(g.hysteresis, 2) },
    { csv: 'zero_shift_ue', value: (g) => formatFixed(g.zeroShift, 1) },
    { csv: 'peak_strain_ue', value: (g) => formatFixed(g.peakStrain, 1) },
    { csv: 'hold_creep_ue', value: (g) => formatFixed(g.holdCreep, 1) },
    { csv: 'transverse_correction', value: (g) => g.transverseCorrection },
    { csv: 'paired_with', value: (g) => g.pairedWith ?? '' },
    { csv: `water_head_${u.pressure}`, value: (g) => formatFixed(g.headPressure, p.head) },
    { csv: `effective_thickness_${u.length}`, value: (g) => formatFixed(g.effectiveThickness, p.length) },
    { csv: `distance_to_discontinuity_${u.length}`, value: (g) => formatFixed(g.distanceToDiscontinuity, p.distance) },
    { csv: 'flags', value: (g) => g.flags.join(';') },
    { csv: 'outcome', value: (g) => outcomeOf(input, g.id) },
    { csv: 'disposition', value: (g) => disposition(g)?.outcome ?? '' },
    { csv: 'disposition_reason', value: (g) => disposition(g)?.reason ?? '', freeText: true },
    { csv: 'disposed_by', value: (g) => disposition(g)?.by ?? '', freeText: true },
    { csv: 'disposed_at', value: (g) => (disposition(g) ? formatIsoUtc(disposition(g)!.at) : '') },
  ];
}

export interface RosetteColumn {
  csv: string;
  value: (r: RosetteResult) => string;
}

/** The rosette table's columns: per unit pressure strains, stresses at test pressure. */
export function buildRosetteColumns(input: ReportRecord): RosetteColumn[] {
  const u = unitLabels(input.units);
  const p = precisionFor(input.units);
  const slope = `ue_per_${u.pressure}`;
  return [
    { csv: 'rosette_id', value: (r) => r.id },
    { csv: 'kind', value: (r) => r.kind },
    { csv: 'angle_deg', value: (r) => formatFixed(r.angleDeg, 1) },
    { csv: `eps1_${slope}`, value: (r) => formatSlopeNumber(r.principalStrains[0]) },
    { csv: `eps2_${slope}`, value: (r) => formatSlopeNumber(r.principalStrains[1]) },
    { csv: `predicted_eps1_${slope}`, value: (r) => formatSlopeNumber(r.predictedPrincipalStrains[0]) },
    { csv: `predicted_eps2_${slope}`, value: (r) => formatSlopeNumber(r.predictedPrincipalStrains[1]) },
    { csv: 'principal_angle_from_axis_deg', value: (r) => formatFixed(r.principalAngleDeg, 1) },
    { csv: 'expected_principal_angle_deg', value: (r) => formatFixed(r.expectedPrincipalAngleDeg, 1) },
    { csv: `sigma1_per_${u.pressure}`, value: (r) => formatFixed(r.stressesPerUnitPressure[0], 4) },
    { csv: `sigma2_per_${u.pressure}`, value: (r) => formatFixed(r.stressesPerUnitPressure[1], 4) },
    { csv: `von_mises_per_${u.pressure}`, value: (r) => formatFixed(r.vonMisesPerUnitPressure, 4) },
    { csv: `sigma1_at_test_pressure_${u.stress}`, value: (r) => formatFixed(r.principalStresses[0], p.stress) },
    { csv: `sigma2_at_test_pressure_${u.stress}`, value: (r) => formatFixed(r.principalStresses[1], p.stress) },
    { csv: `von_mises_at_test_pressure_${u.stress}`, value: (r) => formatFixed(r.vonMises, p.stress) },
    { csv: 'von_mises_over_yield', value: (r) => formatFixed(r.yieldFraction, 3) },
    { csv: 'flags', value: (r) => r.flags.join(';') },
  ];
}

/** How many gauges ended in each outcome, in a fixed order. */
export function countOutcomes(input: ReportRecord): Record<GaugeOutcome, number> {
  const counts: Record<GaugeOutcome, number> = { 'in-band': 0, flagged: 0, excluded: 0, 'not-compared': 0 };
  for (const g of input.result.gauges) counts[outcomeOf(input, g.id)] += 1;
  return counts;
}

/** A signature is only good for the reduction it names: say so when that is not this one. */
export function isSignatureStale(input: ReportRecord, reductionId: number): boolean {
  return reductionId !== input.reductionId;
}

/** A download name such as hoopline-test-12-north-tank-r34.pdf (ASCII, no spaces). */
export function buildExportFilename(input: ReportInput, extension: 'csv' | 'pdf'): string {
  const slug = input.test.name
    .normalize('NFKD')
    .replace(/[\u0080-\uffff]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 40);
  const parts = ['hoopline-test', String(input.test.id), slug, `r${input.reductionId}`, input.draft ? 'draft' : ''];
  return `${parts.filter(Boolean).join('-')}.${extension}`;
}
