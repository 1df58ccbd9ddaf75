import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { renderSummaryCsv } from './csv';
import { REPORT_CAUTION, formatFixed } from './format';
import { ReportInputError, type ReportInput } from './report-input';
import {
  ACCEPT_REASON,
  EXCLUDE_REASON,
  buildReleasedReportInput,
  buildSiReportInput,
  buildUsReportInput,
  engine2Input,
} from './testing/report-fixture';

interface ParsedCsv {
  raw: string;
  header: Map<string, string>;
  gaugeColumns: string[];
  gauges: Record<string, string>[];
  rosetteColumns: string[];
  rosettes: Record<string, string>[];
}

/** Read the CSV back the way a script would: header block, then the two tables. */
function parseSummary(csv: string): ParsedCsv {
  expect(csv.startsWith('\uFEFF')).toBe(true);
  const rows = Papa.parse<string[]>(csv.slice(1), { skipEmptyLines: false }).data;
  const header = new Map<string, string>();
  const sections = new Map<string, string[][]>();
  let current: string[][] | null = null;
  for (const row of rows) {
    if (row.length === 1 && row[0] === '') continue;
    if (row[0] === '# section') {
      current = [];
      sections.set(row[1]!, current);
    } else if (current) current.push(row);
    else if (row[0]!.startsWith('# ') && row.length === 2) header.set(row[0]!.slice(2), row[1]!);
  }
  const table = (name: string) => {
    const [columns, ...data] = sections.get(name) ?? [];
    expect(columns, `section ${name}`).toBeDefined();
    for (const r of data) expect(r).toHaveLength(columns!.length);
    return { columns: columns!, rows: data.map((r) => Object.fromEntries(columns!.map((c, i) => [c, r[i]!]))) };
  };
  const g = table('gauges');
  const r = table('rosettes');
  return { raw: csv, header, gaugeColumns: g.columns, gauges: g.rows, rosetteColumns: r.columns, rosettes: r.rows };
}

const SI_GAUGE_COLUMNS = [
  'gauge_id',
  'channel',
  'angle_deg',
  'predicted_slope_ue_per_MPa',
  'measured_slope_ue_per_MPa',
  'ratio',
  'deviation_pct',
  'slope_ci95_low_ue_per_MPa',
  'slope_ci95_high_ue_per_MPa',
  'band_low_ue_per_MPa',
  'band_high_ue_per_MPa',
  'band_basis',
  'predicted_u95_ue_per_MPa',
  'dominant_uncertainty_input',
  'dominant_uncertainty_share_pct',
  'r_squared',
  'unloading_slope_ue_per_MPa',
  'hysteresis_pct',
  'zero_shift_ue',
  'peak_strain_ue',
  'hold_creep_ue',
  'transverse_correction',
  'paired_with',
  'water_head_MPa',
  'effective_thickness_mm',
  'distance_to_discontinuity_mm',
  'flags',
  'outcome',
  'disposition',
  'disposition_reason',
  'disposed_by',
  'disposed_at',
];

describe.each([
  { units: 'SI', build: buildSiReportInput, p: 'MPa', len: 'mm', pressure: '3.4' },
  { units: 'US', build: buildUsReportInput, p: 'psi', len: 'in', pressure: '450' },
])('renderSummaryCsv ($units)', ({ build, p, len, pressure }) => {
  // four significant figures, as on the screens
  const sig4 = (v: number) => v.toPrecision(4);
  const input = build();
  const csv = parseSummary(renderSummaryCsv(input));

  it('has exactly one row per gauge, in the engine order, with unit-named columns', () => {
    expect(csv.gauges.map((g) => g.gauge_id)).toEqual(['H1', 'H2', 'H3', 'A1', 'E1', 'R1/A', 'R1/B', 'R1/C']);
    expect(csv.gaugeColumns).toEqual(SI_GAUGE_COLUMNS.map((c) => c.replace('MPa', p).replace(/_mm$/, `_${len}`)));
    for (const c of csv.gaugeColumns) expect(c).toMatch(/^[a-z0-9_]+(MPa|psi)?[a-z0-9_]*$/);
  });

  it("carries the engine values at the screens' precision, and blanks for absent ones", () => {
    input.result.gauges.forEach((g, i) => {
      const row = csv.gauges[i]!;
      expect(row.channel).toBe(g.channel);
      expect(row[`measured_slope_ue_per_${p}`]).toBe(sig4(g.measuredSlope!));
      expect(row[`predicted_slope_ue_per_${p}`]).toBe(sig4(g.predictedSlope));
      expect(row.ratio).toBe(formatFixed(g.ratio, 4));
      expect(row.deviation_pct).toBe(formatFixed(g.deviation! * 100, 2));
      expect(Number(row[`slope_ci95_low_ue_per_${p}`])).toBeLessThan(Number(row[`slope_ci95_high_ue_per_${p}`]));
      expect(row.flags).toBe(g.flags.join(';'));
    });
    const h3 = csv.gauges.find((g) => g.gauge_id === 'H3')!;
    expect(h3[`effective_thickness_${len}`]).toBe('');
    expect(h3.flags).toBe('no-response;outside-band;nonlinear');
    const rb = csv.gauges.find((g) => g.gauge_id === 'R1/B')!;
    expect(rb.angle_deg).toBe('45.0');
  });

  it('reports the outcome after dispositions, with the disposition beside it', () => {
    const h3 = csv.gauges.find((g) => g.gauge_id === 'H3')!;
    expect(input.result.gauges.find((g) => g.id === 'H3')!.outcome).toBe('flagged');
    expect(h3.outcome).toBe('excluded');
    expect(h3.disposition).toBe('excluded');
    expect(h3.disposition_reason).toBe(EXCLUDE_REASON);
    const e1 = csv.gauges.find((g) => g.gauge_id === 'E1')!;
    expect(e1.outcome).toBe('not-compared');
    expect(e1.flags).toBe('edge-zone');
    expect(e1.disposition).toBe('');
  });

  it('quotes a reason holding a comma and double quotes, and reads it back unchanged', () => {
    const h2 = csv.gauges.find((g) => g.gauge_id === 'H2')!;
    expect(h2.disposition_reason).toBe(ACCEPT_REASON);
    expect(h2.disposed_by).toBe('Ines Okafor');
    expect(h2.disposed_at).toBe('2026-12-02T16:40:00Z');
    expect(csv.raw).toContain(
      '"Gauge sits 40 mm from the ""repad"" edge, where the wall is locally stiffer; accepted, see note 4"',
    );
  });

  it('writes the header block: test, vessel, material, model, pressure with unit, tolerances, logs, verdict, signatures', () => {
    const h = csv.header;
    expect(h.get('test_name')).toBe(input.test.name);
    expect(h.get('vessel_tag')).toBe('T-101');
    expect(h.get(`vessel_inside_diameter_${len}`)).toBe(String(input.vessel.insideDiameter));
    expect(h.get(`material_elastic_modulus_${p}`)).toBe(String(input.material.elasticModulus));
    expect(h.get('material_poisson_ratio')).toBe('0.3');
    expect(h.get('model')).toBe('lame');
    expect(h.get(`test_pressure_${p}`)).toBe(pressure);
    expect(h.get('tolerance_slope_band_pct')).toBe('10.0');
    expect(h.get('tolerance_min_r_squared')).toBe('0.995');
    expect(h.get('tolerance_zero_shift_ue')).toBe('20');
    expect(h.get('engine_version')).toBe('1.0.0');
    expect(h.get('reduction_id')).toBe('34');
    expect(h.get('log_1_sha256')).toBe(input.logs[0]!.sha256);
    expect(h.get('log_2_sha256')).toBe(input.logs[1]!.sha256);
    expect(h.get('log_2_rows')).toBe('');
    expect(h.get('verdict')).toBe('conforms');
    expect(h.get('gauges_excluded')).toBe('1');
    expect(h.get('signature_1_kind')).toBe('review');
    expect(h.get('signature_1_reduction_id')).toBe('34');
    expect(h.get('caution')).toBe(REPORT_CAUTION);
    expect(h.has('encoding')).toBe(false);
    expect(h.get('verdict_meaning')).toMatch(/^Conforms: the measured strain slopes agree/);
    expect(h.get('verdict_scope')).toMatch(/It is not acceptance of the hydrostatic test/);
    expect(h.get('release_scope')).toMatch(/Returning the vessel to service is the owner’s/);
    expect(h.get('caution')).toMatch(/Follow the written test procedure/);
  });

  it('records the test conduct from the plan and the words each signer signed', () => {
    const h = csv.header;
    expect(h.get('procedure_reference')).toBe('WP-HT-031 rev B');
    expect(h.get('code_edition')).toBe('the governing pressure vessel code, 2025 edition');
    expect(h.get('test_medium')).toBe('demineralised water');
    expect(h.get('test_temperature')).toBe(input.units === 'SI' ? '14 °C' : '57.2 °F');
    expect(h.get('witness')).toBe('R. Adeyemi, authorised inspector');
    expect(h.get('signature_1_statement')).toBe(input.signatures[0]!.statement);
  });

  it('leaves a conduct fact blank when the plan does not record it', () => {
    const bare = buildSiReportInput();
    bare.procedure = { procedureReference: '=HYPERLINK("x")' };
    const h = parseSummary(renderSummaryCsv(bare)).header;
    expect(h.get('procedure_reference')).toBe('\'=HYPERLINK("x")');
    expect(h.get('witness')).toBe('');
  });

  it('marks the unreleased record as DRAFT', () => {
    expect(csv.header.get('record')).toBe('DRAFT');
    expect(csv.header.has('DRAFT')).toBe(true);
  });

  it('lists the rosette with principal strains, angle, stresses at test pressure and von Mises over yield', () => {
    expect(csv.rosettes).toHaveLength(1);
    const r = csv.rosettes[0]!;
    const result = input.result.rosettes[0]!;
    expect(r.rosette_id).toBe('R1');
    expect(r.kind).toBe('rosette-rectangular');
    expect(r[`eps1_ue_per_${p}`]).toBe(sig4(result.principalStrains[0]));
    expect(r[`eps2_ue_per_${p}`]).toBe(sig4(result.principalStrains[1]));
    expect(r.principal_angle_from_axis_deg).toBe(result.principalAngleDeg.toFixed(1));
    expect(Number(r[`sigma1_at_test_pressure_${p}`])).toBeGreaterThan(Number(r[`sigma2_at_test_pressure_${p}`]));
    expect(r[`von_mises_at_test_pressure_${p}`]).not.toBe('');
    expect(r.von_mises_over_yield).toBe(result.yieldFraction.toFixed(3));
    // Hoop-dominated: ε1 lies near 90° from the axis.
    expect(Math.abs(Number(r.principal_angle_from_axis_deg))).toBeGreaterThan(85);
  });
});

describe('renderSummaryCsv: the yield check and the uncertainty budget', () => {
  it('a thick wall at 94 % of yield (REFERENCES "Added for engine v2"): the bore governs, near yield', async () => {
    const input = await engine2Input();
    const csv = parseSummary(renderSummaryCsv(input));
    const h = csv.header;
    expect(h.get('yield_check_surface')).toBe('inner');
    expect(h.get('yield_check_fraction')).toBe('0.943');
    expect(h.get('yield_check_stress_MPa')).toBe('282.9'); // √3·80·140²/(140² − 100²)
    expect(h.get('near_yield')).toBe('yes');
    expect(h.get('band_mode')).toBe('fixed');
    expect(h.get('uncertainty_wall_thickness_mm')).toBe('0.8'); // 2 % of 40 mm, assumed
    expect(h.get('uncertainty_wall_thickness_assumed')).toBe('yes');
    expect(h.get('uncertainty_elastic_modulus_fraction')).toBe('0.03');
    for (const g of csv.gauges) {
      expect(g.flags).toContain('near-yield');
      expect(Number(g.predicted_u95_ue_per_MPa)).toBeGreaterThan(0);
      expect(g.dominant_uncertainty_input).not.toBe('');
      expect(g.band_basis).toBe('relative');
    }
  }, 30_000);
  it('an engine 1 result still gives the yield check, from its stored fraction, and no budget', () => {
    const input = buildSiReportInput();
    const csv = parseSummary(renderSummaryCsv(input));
    expect(csv.header.get('yield_check_surface')).toBe('inner');
    expect(csv.header.get('yield_check_fraction')).toBe(formatFixed(input.result.predicted.lame.yieldFraction, 3));
    expect(csv.gauges[0]!.predicted_u95_ue_per_MPa).toBe('');
    expect(csv.gauges[0]!.band_low_ue_per_MPa).not.toBe('');
  });
});

describe('renderSummaryCsv edge cases', () => {
  it('says RELEASED and has no DRAFT line once released', () => {
    const csv = parseSummary(renderSummaryCsv(buildReleasedReportInput()));
    expect(csv.header.get('record')).toBe('RELEASED');
    expect(csv.header.has('DRAFT')).toBe(false);
    expect(csv.header.get('signature_2_kind')).toBe('release');
  });

  it('keeps a reason that looks like a spreadsheet formula as text', () => {
    const input = buildSiReportInput();
    input.dispositions.H2!.reason = '=HYPERLINK("http://example.com","x")';
    const csv = parseSummary(renderSummaryCsv(input));
    expect(csv.gauges.find((g) => g.gauge_id === 'H2')!.disposition_reason).toBe(
      `'=HYPERLINK("http://example.com","x")`,
    );
    // Negative numbers are numbers, not formulas: left alone.
    expect(csv.gauges.find((g) => g.gauge_id === 'H1')!.deviation_pct).toMatch(/^-\d/);
  });

  it('notes a signature that names another reduction', () => {
    const input = buildSiReportInput();
    input.signatures[0]!.reductionId = 33;
    const csv = parseSummary(renderSummaryCsv(input));
    expect(csv.header.get('signature_1_note')).toBe('signed reduction 33, not this reduction 34');
  });

  it('writes an empty rosette table when the plan has no rosette', () => {
    const input = buildSiReportInput();
    input.result.rosettes = [];
    const csv = parseSummary(renderSummaryCsv(input));
    expect(csv.rosettes).toHaveLength(0);
    expect(csv.rosetteColumns[0]).toBe('rosette_id');
  });

  it.each<[string, (i: ReportInput) => void, RegExp]>([
    ['units', (i) => (i.units = 'US'), /units say US but the reduction result is in SI/],
    [
      'a disposition for an unknown gauge',
      (i) => (i.dispositions.X9 = { ...i.dispositions.H2! }),
      /disposition for gauge 'X9'/,
    ],
    ['model', (i) => (i.model = 'membrane'), /model says membrane but the reduction used lame/],
  ])('refuses a record whose %s contradicts the result', (_, spoil, message) => {
    const input = buildSiReportInput();
    spoil(input);
    expect(() => renderSummaryCsv(input)).toThrow(ReportInputError);
    expect(() => renderSummaryCsv(input)).toThrow(message);
  });
});
