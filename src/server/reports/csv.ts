// The pass/flag summary as CSV: a header block of `# key,value` lines, then one row per gauge,
// then the rosettes. Sections are separated by a blank line and a `# section,<name>` line, so a
// reader that skips `#` comment lines gets two plain tables.
import { MODEL_BASIS, RELEASE_SCOPE, VERDICT_MEANING, VERDICT_SCOPE } from '../../lib/verdict-words';
import Papa from 'papaparse';
import {
  REPORT_CAUTION,
  buildGaugeColumns,
  buildRosetteColumns,
  conductRows,
  countOutcomes,
  formatFixed,
  formatIsoUtc,
  formatPercent,
  formatPlain,
  formatSlopeNumber,
  isSignatureStale,
  neutraliseFormula,
  precisionFor,
  MODEL_LABELS,
  YIELD_SURFACE_LABELS,
} from './format';
import { toReportRecord, unitLabels, type ReportInput, type ReportRecord } from './report-input';
import { describeConversion } from '../../lib/reduction/reader';

/** RFC 4180 line ends; spreadsheet programs accept them everywhere. */
const NEWLINE = '\r\n';
/** Byte-order mark: without it several spreadsheet programs read UTF-8 as a legacy code page and garble µ. */
const BOM = '\uFEFF';

export const CSV_CONTENT_TYPE = 'text/csv; charset=utf-8';

type HeaderEntry = [key: string, value: string];

/**
 * Render the summary CSV. The string starts with a BOM: encode it as UTF-8 unchanged
 * (e.g. `new Response(csv, { headers: { 'content-type': CSV_CONTENT_TYPE } })`).
 */
export function renderSummaryCsv(raw: ReportInput): string {
  const input = toReportRecord(raw);
  const header = buildHeaderEntries(input).map(([key, value]) => [`# ${key}`, value]);

  const gaugeColumns = buildGaugeColumns(input);
  const gaugeRows = input.result.gauges.map((g) =>
    gaugeColumns.map((c) => (c.freeText ? neutraliseFormula(c.value(g)) : c.value(g))),
  );
  const rosetteColumns = buildRosetteColumns(input);
  const rosetteRows = input.result.rosettes.map((r) => rosetteColumns.map((c) => c.value(r)));

  const blocks = [
    unparse([['# Hoopline hydrotest strain summary'], ...header]),
    unparse([['# section', 'gauges'], gaugeColumns.map((c) => c.csv), ...gaugeRows]),
    unparse([['# section', 'rosettes'], rosetteColumns.map((c) => c.csv), ...rosetteRows]),
  ];
  return BOM + blocks.join(NEWLINE + NEWLINE) + NEWLINE;
}

function unparse(rows: string[][]): string {
  return Papa.unparse(
    rows.map((r) => r.map(safeCell)),
    { newline: NEWLINE, quotes: false, header: false },
  );
}

/** A number as the renderers format it (`12`, `-0.35`, `1.2e-7`): left exactly as it is. */
const NUMBER_CELL = /^-?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i;

/**
 * Every text cell is neutralised against spreadsheet formulas (a leading `=`, `+`, `-`, `@`, tab
 * or CR gets a `'`), whoever typed it — gauge ids, names, file names, reasons; numbers stay numbers.
 */
export function safeCell(cell: string): string {
  return NUMBER_CELL.test(cell) ? cell : neutraliseFormula(cell);
}

/** The header block as key/value pairs, keys plain ASCII with units in the name. */
function buildHeaderEntries(input: ReportRecord): HeaderEntry[] {
  const u = unitLabels(input.units);
  const p = precisionFor(input.units);
  const slope = `ue_per_${u.pressure}`;
  const { predicted } = input.result;
  const used = predicted[input.model];
  const text = (s: string) => neutraliseFormula(s);
  const t = input.tolerances;
  const counts = countOutcomes(input);

  const entries: HeaderEntry[] = [['record', input.draft ? 'DRAFT' : 'RELEASED']];
  if (input.draft) entries.push(['DRAFT', 'not released: results, dispositions and signatures may still change']);
  entries.push(
    ['caution', REPORT_CAUTION],
    ['release_scope', RELEASE_SCOPE],
    ['generated_at', formatIsoUtc(input.generatedAt)],
    ['test_id', String(input.test.id)],
    ['test_name', text(input.test.name)],
    ['test_status', input.test.status],
    ['vessel_tag', text(input.vessel.tag)],
    ['vessel_name', text(input.vessel.name)],
    ['vessel_shape', input.vessel.shape],
    ['vessel_ends', input.vessel.shape === 'sphere' ? '' : input.vessel.ends],
    [`vessel_inside_diameter_${u.length}`, formatPlain(input.vessel.insideDiameter)],
    [`vessel_wall_thickness_${u.length}`, formatPlain(input.vessel.wallThickness)],
    [`vessel_length_${u.length}`, formatPlain(input.vessel.length)],
    ['material_name', text(input.material.name)],
    [`material_elastic_modulus_${u.stress}`, formatPlain(input.material.elasticModulus)],
    ['material_poisson_ratio', formatPlain(input.material.poissonRatio)],
    [`material_yield_strength_${u.stress}`, formatPlain(input.material.yieldStrength)],
    ...conductRows(input).map((r): HeaderEntry => [r.csv, text(r.value)]),
    ['units', input.units],
    ['model', input.model],
    ['model_description', `${MODEL_LABELS[input.model]}: ${MODEL_BASIS[input.model]}`],
    [`test_pressure_${u.pressure}`, formatPlain(input.testPressure)],
    [`predicted_hoop_${slope}_lame`, formatSlopeNumber(predicted.lame.hoopStrainPerPressure)],
    [`predicted_axial_${slope}_lame`, formatSlopeNumber(predicted.lame.axialStrainPerPressure)],
    [`predicted_hoop_${slope}_membrane`, formatSlopeNumber(predicted.membrane.hoopStrainPerPressure)],
    [`predicted_axial_${slope}_membrane`, formatSlopeNumber(predicted.membrane.axialStrainPerPressure)],
    ['membrane_over_lame_pct', formatPercent(predicted.membraneOverLame, 2)],
    [`edge_zone_distance_${u.length}`, formatFixed(predicted.edgeZoneDistance, p.length)],
    [`hoop_stress_at_test_pressure_${u.stress}`, formatFixed(used.hoopStress, p.stress)],
    [`axial_stress_at_test_pressure_${u.stress}`, formatFixed(used.axialStress, p.stress)],
    ['stress_over_yield_at_test_pressure', formatFixed(used.yieldFraction, 3)],
    ...yieldCheckEntries(input),
    ['tolerance_slope_band_pct', formatPercent(t.slopeBand, 1)],
    ['tolerance_min_r_squared', formatPlain(t.minRSquared)],
    ['tolerance_hysteresis_pct', formatPercent(t.hysteresis, 1)],
    ['tolerance_zero_shift_ue', formatPlain(t.zeroShiftMicrostrain)],
    ['tolerance_zero_shift_pct_of_peak', formatPercent(t.zeroShiftFraction, 1)],
    ['tolerance_no_response_ue', formatPlain(t.noResponseMicrostrain)],
    ['tolerance_near_yield_pct', formatPercent(t.yieldFraction, 1)],
    ['tolerance_hold_creep_ue', formatPlain(t.holdCreepMicrostrain)],
    ['tolerance_hold_creep_pct_of_peak', formatPercent(t.holdCreepFraction, 1)],
    ['tolerance_principal_direction_deg', formatPlain(t.principalDirectionDeg)],
    ['band_mode', input.result.bandMode],
    ...uncertaintyEntries(input),
    [
      'pressure_conversion',
      input.result.log.pressureConversion
        ? describeConversion(input.result.log.pressureConversion)
        : 'none (the plan unit)',
    ],
    ['cycle_count', String(input.result.cycles.length)],
    ['compared_cycle', String((input.result.cycles.find((c) => c.compared)?.index ?? 0) + 1)],
    ['engine_version', input.engineVersion],
    ['reduction_id', String(input.reductionId)],
    ['log_count', String(input.logs.length)],
  );
  input.logs.forEach((log, i) => {
    entries.push(
      [`log_${i + 1}_filename`, text(log.filename)],
      [`log_${i + 1}_sha256`, log.sha256],
      [`log_${i + 1}_rows`, log.rows === null ? '' : String(log.rows)],
    );
  });
  entries.push(
    ['verdict', input.verdict],
    ['verdict_meaning', VERDICT_MEANING[input.verdict]],
    ['verdict_scope', VERDICT_SCOPE],
    ['gauges_in_band', String(counts['in-band'])],
    ['gauges_flagged', String(counts.flagged)],
    ['gauges_excluded', String(counts.excluded)],
    ['gauges_not_compared', String(counts['not-compared'])],
    ['signature_count', String(input.signatures.length)],
  );
  input.signatures.forEach((s, i) => {
    const k = `signature_${i + 1}`;
    entries.push(
      [`${k}_kind`, s.kind],
      [`${k}_name`, text(s.name)],
      [`${k}_email`, text(s.email)],
      [`${k}_at`, formatIsoUtc(s.at)],
      [`${k}_reduction_id`, String(s.reductionId)],
      [`${k}_statement`, text(s.statement)],
    );
    if (isSignatureStale(input, s.reductionId))
      entries.push([`${k}_note`, `signed reduction ${s.reductionId}, not this reduction ${input.reductionId}`]);
  });
  input.result.warnings.forEach((w, i) => entries.push([`warning_${i + 1}`, text(w)]));
  return entries;
}

/** The yield check of DESIGN 3.1: the largest stress in the wall, where it sits, and against yield. */
function yieldCheckEntries(input: ReportRecord): HeaderEntry[] {
  const y = input.result.yieldCheck;
  const u = unitLabels(input.units);
  const p = precisionFor(input.units);
  return [
    [`yield_check_stress_${u.stress}`, formatFixed(y.stress, p.stress)],
    ['yield_check_fraction', formatFixed(y.fraction, 3)],
    ['yield_check_surface', y.surface],
    ['yield_check_where', YIELD_SURFACE_LABELS[y.surface]],
    [`yield_check_pressure_${u.pressure}`, formatPlain(y.pressure)],
    ['near_yield', y.nearYield ? 'yes' : 'no'],
  ];
}

/** The uncertainty inputs of DESIGN 3.4 as used (k = 1), each with whether it was assumed. */
function uncertaintyEntries(input: ReportRecord): HeaderEntry[] {
  const snake = (s: string) => s.replace(/Deg$/, '').replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`);
  const suffix = (unit: string) =>
    unit === 'relative' ? '_fraction' : unit === '°' ? '_deg' : unit === 'mm' || unit === 'in' ? `_${unit}` : '';
  return input.result.uncertaintyInputs.flatMap((i): HeaderEntry[] => [
    [`uncertainty_${snake(i.input)}${suffix(i.unit)}`, formatPlain(i.standardUncertainty)],
    [`uncertainty_${snake(i.input)}_assumed`, i.assumed ? 'yes' : 'no'],
  ]);
}
