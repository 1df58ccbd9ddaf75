// The PDF report: title, verdict, test header, gauge and rosette tables, dispositions,
// signatures and one strain-versus-pressure figure per gauge; then, on every page, the running
// header, the caution, "Page n of N" and, for an unreleased record, a diagonal DRAFT.
import PDFDocument from 'pdfkit';
import type { GaugeResult } from '../../lib/reduction/types';
import {
  FLAG_LABELS,
  MODEL_LABELS,
  OUTCOME_LABELS,
  REPORT_CAUTION,
  VERDICT_EXPLANATIONS,
  VERDICT_LABELS,
  buildGaugeColumns,
  buildRosetteColumns,
  conductRows,
  countOutcomes,
  formatDateTimeUtc,
  formatFixed,
  formatPercent,
  formatPlain,
  formatSlopeNumber,
  isSignatureStale,
  showNumber,
  precisionFor,
  YIELD_SURFACE_LABELS,
  dominantUncertainty,
} from './format';
import { drawFigureLegend, drawStrainPressureFigure } from './pdf-figure';
import { PageFlow, drawTable, type TableCell } from './pdf-layout';
import {
  DISPOSITION_LABEL,
  MODEL_BASIS,
  NEAR_YIELD_ADVICE,
  VERDICT_SCOPE,
  verdictStanding,
  type DispositionCode,
} from '../../lib/verdict-words';
import { COLOR, CONTENT_BOTTOM, CONTENT_WIDTH, MARGIN, OUTCOME_COLOR, PAGE, VERDICT_COLOR } from './pdf-style';
import {
  asArtifact,
  beginTagging,
  drawParagraph,
  drawTextLine,
  endTagging,
  lineHeight,
  measureParagraph,
  measureText,
  tagged,
} from './pdf-text';
import { outcomeOf, toReportRecord, unitLabels, type ReportInput, type ReportRecord } from './report-input';

export const PDF_CONTENT_TYPE = 'application/pdf';

/** The budget's inputs in words, for the gauge table (DESIGN 3.4). */
const UNCERTAINTY_WORDS: Record<string, string> = {
  wallThickness: 'wall thickness',
  insideDiameter: 'inside diameter',
  elasticModulus: 'elastic modulus',
  poissonRatio: "Poisson's ratio",
  gaugeFactor: 'gauge factor',
  transverseSensitivity: 'transverse sens.',
  misalignmentDeg: 'misalignment',
};

export interface RenderPdfOptions {
  /** deflate page streams (default true); tests turn it off to read the bytes */
  compress?: boolean;
}

type Doc = PDFKit.PDFDocument;

/** Render the report. Output is byte-for-byte repeatable for the same input. */
export async function renderReportPdf(raw: ReportInput, options: RenderPdfOptions = {}): Promise<Buffer> {
  const input = toReportRecord(raw);
  const doc = new PDFDocument({
    autoFirstPage: false,
    bufferPages: true,
    compress: options.compress ?? true,
    size: [PAGE.width, PAGE.height],
    // No default font: pdfkit would load Helvetica, and a default Inter opened here (same
    // PostScript name as a registered face) defeats pdfkit's font cache, reopening it per call.
    font: null as unknown as string,
    lang: 'en-GB',
    displayTitle: true,
    // structure tags for screen readers (see pdf-text.ts); 1.7 is where tagged PDF is settled
    tagged: true,
    pdfVersion: '1.7',
    info: {
      Title: `Hydrotest strain report: ${input.test.name}`,
      Subject: `Test ${input.test.id}, vessel ${input.vessel.tag}, reduction ${input.reductionId}${input.draft ? ' (DRAFT)' : ''}`,
      Author: 'Hoopline',
      Creator: 'Hoopline',
      Producer: 'Hoopline',
      CreationDate: input.generatedAt,
      ModDate: input.generatedAt,
    },
  });
  const done = collectBytes(doc);

  beginTagging(doc);
  const flow = new PageFlow(doc);
  flow.addPage();
  drawTitleBlock(flow, input);
  drawVerdictBox(flow, input);
  drawYieldCheck(flow, input);
  drawConduct(flow, input);
  drawTestHeader(flow, input);
  drawGaugeTables(flow, input);
  drawRosettes(flow, input);
  drawDispositions(flow, input);
  drawSignatures(flow, input);
  drawWarnings(flow, input);
  drawFigures(flow, input);
  finishPages(doc, input);
  endTagging(doc);

  doc.end();
  return done;
}

function collectBytes(doc: Doc): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    doc.on('data', (chunk: Buffer) => chunks.push(chunk));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
}

function drawTitleBlock(flow: PageFlow, input: ReportRecord): void {
  const { doc } = flow;
  const x = MARGIN.left;
  let y = 40;
  drawTextLine(doc, 'HOOPLINE', x, y, { size: 8, weight: 700, color: COLOR.accent });
  drawTextLine(doc, input.draft ? 'DRAFT · not released' : 'Released record', x, y, {
    size: 8,
    weight: 700,
    color: input.draft ? COLOR.draft : VERDICT_COLOR.conforms,
    align: 'right',
    width: CONTENT_WIDTH,
  });
  y += 13;
  drawTextLine(doc, 'Hydrotest strain report', x, y, { size: 20, weight: 700, tag: 'H1' });
  y += 27;
  y += drawParagraph(doc, input.test.name, x, y, CONTENT_WIDTH, { size: 12.5, weight: 600 });
  y += 2;
  const meta = `Vessel ${input.vessel.tag} · ${input.vessel.name} · test #${input.test.id} (${input.test.status}) · reduction #${input.reductionId} · generated ${formatDateTimeUtc(input.generatedAt)}`;
  y += drawParagraph(doc, meta, x, y, CONTENT_WIDTH, { size: 8.5, color: COLOR.muted });
  y += 6;
  doc
    .save()
    .lineWidth(1.2)
    .strokeColor(COLOR.accent)
    .moveTo(x, y)
    .lineTo(x + CONTENT_WIDTH, y)
    .stroke()
    .restore();
  flow.y = y + 12;
}

/** Flagged gauges with no disposition yet. */
function undisposedCount(input: ReportRecord): number {
  return input.result.gauges.filter((g) => outcomeOf(input, g.id) === 'flagged' && !input.dispositions[g.id]).length;
}

/** Flagged gauges an engineer marked for retest. */
function retestIds(input: ReportRecord): string[] {
  return input.result.gauges
    .filter((g) => outcomeOf(input, g.id) === 'flagged' && input.dispositions[g.id]?.outcome === 'retest')
    .map((g) => g.id);
}

function dispositionWords(code: DispositionCode | undefined): string {
  return code ? DISPOSITION_LABEL[code] : '–';
}

function drawVerdictBox(flow: PageFlow, input: ReportRecord): void {
  const { doc } = flow;
  const counts = countOutcomes(input);
  const disposed = input.result.gauges.filter(
    (g) => outcomeOf(input, g.id) === 'flagged' && input.dispositions[g.id],
  ).length;
  const color = VERDICT_COLOR[input.verdict];
  const x = MARGIN.left;
  const textX = x + 16;
  const textWidth = CONTENT_WIDTH - 16 - 190;
  const explanation = [
    VERDICT_EXPLANATIONS[input.verdict],
    verdictStanding(input.verdict, { awaiting: undisposedCount(input), retest: retestIds(input).length }),
    VERDICT_SCOPE,
  ].join(' ');
  const height = Math.max(70, 40 + measureParagraph(doc, explanation, textWidth, { size: 8.5 }) + 8);
  flow.ensureSpace(height + 12);
  const y = flow.y;
  doc.save().lineWidth(1).roundedRect(x, y, CONTENT_WIDTH, height, 3).fillAndStroke('#fbfcfd', color).restore();
  doc
    .save()
    .rect(x + 0.5, y + 0.5, 6, height - 1)
    .fill(color)
    .restore();
  drawTextLine(doc, 'STRAIN COMPARISON VERDICT', textX, y + 9, { size: 7, weight: 600, color: COLOR.muted });
  drawTextLine(doc, VERDICT_LABELS[input.verdict].toUpperCase(), textX, y + 19, { size: 18, weight: 700, color });
  drawParagraph(doc, explanation, textX, y + 42, textWidth, { size: 8.5, color: COLOR.ink });

  const rightX = x + CONTENT_WIDTH - 180;
  const lines: [string, string, string][] = [
    ['in band', String(counts['in-band']), OUTCOME_COLOR['in-band']],
    ['flagged', `${counts.flagged}${counts.flagged ? ` (${disposed} dispositioned)` : ''}`, OUTCOME_COLOR.flagged],
    ['excluded', String(counts.excluded), OUTCOME_COLOR.excluded],
    ['not compared', String(counts['not-compared']), OUTCOME_COLOR['not-compared']],
  ];
  drawTextLine(doc, `Gauge channels (${input.result.gauges.length})`, rightX, y + 9, {
    size: 7,
    weight: 600,
    color: COLOR.muted,
  });
  lines.forEach(([label, value, c], i) => {
    const ly = y + 21 + i * 11;
    doc.circle(rightX + 3, ly + 4, 2.5).fill(c);
    drawTextLine(doc, label, rightX + 10, ly, { size: 8.5, color: COLOR.ink });
    drawTextLine(doc, value, rightX + 80, ly, { size: 8.5, weight: 600, color: COLOR.ink });
  });
  flow.y = y + height + 12;
}

/** The yield check (DESIGN 3.1) in one line under the verdict; near yield in the flag colour, in bold. */
function drawYieldCheck(flow: PageFlow, input: ReportRecord): void {
  const y = input.result.yieldCheck;
  const u = unitLabels(input.units);
  const p = precisionFor(input.units);
  const text =
    `Yield check: ${YIELD_SURFACE_LABELS[y.surface]} (${MODEL_LABELS[y.model]}) ` +
    `${showNumber(formatFixed(y.stress, p.stress))} ${u.stress} at ${formatPlain(y.pressure)} ${u.pressure} = ` +
    `${formatPercent(y.fraction, 1)} % of yield (near-yield limit ${formatPercent(y.limit, 0)} %)` +
    (y.nearYield ? `. NEAR YIELD. ${NEAR_YIELD_ADVICE}` : '.');
  flow.paragraph(text, 8.5, y.nearYield ? OUTCOME_COLOR.flagged : COLOR.ink, y.nearYield ? 700 : 400);
  flow.y += 4;
}

/** Two blocks of label/value rows side by side. */
function drawDefinitionColumns(flow: PageFlow, blocks: { title: string; rows: [string, string][] }[]): void {
  const { doc } = flow;
  const gap = 18;
  const blockWidth = (CONTENT_WIDTH - gap * (blocks.length - 1)) / blocks.length;
  const labelWidth = 92;
  const size = 8;
  const heights = blocks.map((b) =>
    b.rows.reduce(
      (a, [, v]) => a + Math.max(lineHeight(size), measureParagraph(doc, v, blockWidth - labelWidth, { size })) + 2,
      16,
    ),
  );
  flow.ensureSpace(Math.max(...heights));
  const top = flow.y;
  blocks.forEach((block, i) => {
    const x = MARGIN.left + i * (blockWidth + gap);
    let y = top;
    drawTextLine(doc, block.title, x, y, { size: 8.5, weight: 700, color: COLOR.ink });
    y += 14;
    for (const [label, value] of block.rows) {
      drawTextLine(doc, label, x, y, { size, color: COLOR.muted });
      const h = drawParagraph(doc, value, x + labelWidth, y, blockWidth - labelWidth, { size, color: COLOR.ink });
      y += Math.max(lineHeight(size), h) + 2;
    }
  });
  flow.y = top + Math.max(...heights) + 6;
}

/** How the test was conducted, as the plan records it; a fact the plan leaves out says so. */
function drawConduct(flow: PageFlow, input: ReportRecord): void {
  const rows = conductRows(input).map((r): [string, string] => [r.label, r.value || 'not recorded in the plan']);
  flow.heading('Test conduct', 60);
  drawDefinitionColumns(flow, [
    { title: 'Procedure and code', rows: rows.slice(0, 3) },
    { title: 'Conditions and witness', rows: rows.slice(3) },
  ]);
}

function drawTestHeader(flow: PageFlow, input: ReportRecord): void {
  const u = unitLabels(input.units);
  const p = precisionFor(input.units);
  const { predicted } = input.result;
  const used = predicted[input.model];
  const other = input.model === 'lame' ? 'membrane' : 'lame';
  const slopeUnit = `µε/${u.pressure}`;
  const t = input.tolerances;
  const v = input.vessel;
  const pct = (fraction: number) => formatPlain(fraction * 100);
  flow.heading('Test, vessel and prediction', 160);
  const shape = v.shape === 'sphere' ? 'sphere' : `cylinder, ${v.ends} ends`;
  drawDefinitionColumns(flow, [
    {
      title: 'Vessel and material',
      rows: [
        ['Vessel', `${v.tag} · ${v.name}`],
        ['Shape', shape],
        ['Inside diameter', `${formatPlain(v.insideDiameter)} ${u.length}`],
        ['Wall thickness', `${formatPlain(v.wallThickness)} ${u.length} (nominal)`],
        ...(v.length !== undefined ? ([['Length', `${formatPlain(v.length)} ${u.length}`]] as [string, string][]) : []),
        ['Material', input.material.name],
        ['Elastic modulus E', `${showNumber(formatPlain(input.material.elasticModulus))} ${u.stress}`],
        ["Poisson's ratio ν", formatPlain(input.material.poissonRatio)],
        ['Yield strength', `${showNumber(formatPlain(input.material.yieldStrength))} ${u.stress}`],
      ],
    },
    {
      title: 'Test and prediction',
      rows: [
        ['Test pressure', `${formatPlain(input.testPressure)} ${u.pressure}`],
        ['Model', `${MODEL_LABELS[input.model]}: ${MODEL_BASIS[input.model]} (${input.units} units)`],
        [
          'Predicted hoop',
          `${showNumber(formatSlopeNumber(used.hoopStrainPerPressure))} ${slopeUnit} (${other} ${showNumber(formatSlopeNumber(predicted[other].hoopStrainPerPressure))})`,
        ],
        [
          'Predicted axial',
          `${showNumber(formatSlopeNumber(used.axialStrainPerPressure))} ${slopeUnit} (${other} ${showNumber(formatSlopeNumber(predicted[other].axialStrainPerPressure))})`,
        ],
        [
          'Membrane vs Lamé',
          `membrane predicts ${showNumber(formatPercent(predicted.membraneOverLame, 2))} % more hoop strain at the outer surface`,
        ],
        [
          'At test pressure',
          `σh ${showNumber(formatFixed(used.hoopStress, p.stress))} ${u.stress}, σa ${showNumber(formatFixed(used.axialStress, p.stress))} ${u.stress}; ${formatPercent(used.yieldFraction, 1)} % of yield`,
        ],
        [
          `Change (${u.length})`,
          (() => {
            const d = used.dimensionChanges;
            const f = (v: number | null) => showNumber(formatFixed(v, p.length + 1) || '–');
            return `inside Ø ${f(d.insideDiameter)}, mean Ø ${f(d.meanDiameter)}, outside Ø ${f(d.outsideDiameter)}, length ${f(d.length)}, wall ${f(d.thickness)}`;
          })(),
        ],
        [
          'Edge-zone distance',
          `${formatFixed(predicted.edgeZoneDistance, p.length)} ${u.length} (2.5·√(r t), r mean radius)`,
        ],
        ['Engine', `version ${input.engineVersion} · reduction #${input.reductionId}`],
      ],
    },
  ]);
  const tolerances =
    `Slope band ±${pct(t.slopeBand)} % of predicted · loading R² min. ${formatPlain(t.minRSquared)} · ` +
    `hysteresis max. ${pct(t.hysteresis)} % of peak · zero shift max. ${formatPlain(t.zeroShiftMicrostrain)} µε or ` +
    `${pct(t.zeroShiftFraction)} % of peak (the larger) · no response below ${formatPlain(t.noResponseMicrostrain)} µε · ` +
    `near yield from ${pct(t.yieldFraction)} % of yield · creep in the top hold max. ${formatPlain(t.holdCreepMicrostrain)} µε or ` +
    `${pct(t.holdCreepFraction)} % of peak · rosette ε1 within ${formatPlain(t.principalDirectionDeg)}° of the predicted direction · ` +
    (input.result.bandMode === 'uncertainty'
      ? 'band from the uncertainties, √(U_pred² + U_fit²).'
      : 'band fixed at the slope band.');
  flow.ensureSpace(30);
  drawTextLine(flow.doc, 'Tolerances', MARGIN.left, flow.y, { size: 8.5, weight: 700 });
  flow.y += 13;
  flow.paragraph(tolerances, 8);
  flow.y += 4;
  drawTable(
    flow,
    [
      { label: 'Log file', width: 30 },
      { label: 'Rows', width: 8, align: 'right' },
      { label: 'SHA-256', width: 62 },
    ],
    input.logs.map((l) => [l.filename, l.rows === null ? '–' : String(l.rows), { text: l.sha256, color: COLOR.muted }]),
    { size: 7 },
  );
}

function drawGaugeTables(flow: PageFlow, input: ReportRecord): void {
  const u = unitLabels(input.units);
  const columns = new Map(buildGaugeColumns(input).map((c) => [c.csv, c]));
  const slope = `ue_per_${u.pressure}`;
  const value = (key: string, g: GaugeResult) => showNumber(columns.get(key)!.value(g) || '–');
  const outcomeCell = (g: GaugeResult): TableCell => {
    const outcome = outcomeOf(input, g.id);
    return { text: OUTCOME_LABELS[outcome], color: OUTCOME_COLOR[outcome], weight: 600 };
  };
  const gauges = input.result.gauges;

  flow.heading('Gauge results', 120);
  flow.paragraph(
    `Slopes in µε/${u.pressure} from a least-squares fit of the loading holds; ratio = measured / predicted; ` +
      'CI95 = 95 % confidence interval of the measured slope. Rosette grids are listed as R/A, R/B, R/C.',
    7.5,
    COLOR.muted,
  );
  drawTable(
    flow,
    [
      { label: 'Gauge', width: 7 },
      { label: 'Channel', width: 7 },
      { label: 'Angle °', width: 5.5, align: 'right' },
      { label: `Predicted µε/${u.pressure}`, width: 8.5, align: 'right' },
      { label: `Measured µε/${u.pressure}`, width: 8.5, align: 'right' },
      { label: 'Ratio', width: 6.5, align: 'right' },
      { label: 'Deviation %', width: 7.5, align: 'right' },
      { label: 'CI95 low', width: 7.5, align: 'right' },
      { label: 'CI95 high', width: 7.5, align: 'right' },
      { label: 'R²', width: 7, align: 'right' },
      { label: 'Outcome', width: 9.5 },
    ],
    gauges.map((g) => [
      { text: g.id, weight: 600 },
      g.channel,
      value('angle_deg', g),
      value(`predicted_slope_${slope}`, g),
      value(`measured_slope_${slope}`, g),
      value('ratio', g),
      value('deviation_pct', g),
      value(`slope_ci95_low_${slope}`, g),
      value(`slope_ci95_high_${slope}`, g),
      value('r_squared', g),
      outcomeCell(g),
    ]),
  );
  drawTable(
    flow,
    [
      { label: 'Gauge', width: 7 },
      { label: `Unloading slope µε/${u.pressure}`, width: 9, align: 'right' },
      { label: 'Hysteresis %', width: 7.5, align: 'right' },
      { label: 'Zero shift µε', width: 7, align: 'right' },
      { label: 'Peak strain µε', width: 7.5, align: 'right' },
      { label: `Effective thickness ${u.length}`, width: 8.5, align: 'right' },
      { label: `To discontinuity ${u.length}`, width: 7.5, align: 'right' },
      { label: `Prediction U95 µε/${u.pressure}`, width: 7.5, align: 'right' },
      { label: 'Largest uncertainty', width: 9 },
      { label: 'Flags', width: 13 },
      { label: 'Disposition', width: 7.5 },
    ],
    gauges.map((g) => [
      { text: g.id, weight: 600 },
      value(`unloading_slope_${slope}`, g),
      value('hysteresis_pct', g),
      value('zero_shift_ue', g),
      value('peak_strain_ue', g),
      value(`effective_thickness_${u.length}`, g),
      value(`distance_to_discontinuity_${u.length}`, g),
      value(`predicted_u95_${slope}`, g),
      { text: UNCERTAINTY_WORDS[dominantUncertainty(g)] ?? '–', color: COLOR.muted },
      {
        text: g.flags.length ? g.flags.map((f) => FLAG_LABELS[f]).join(', ') : '–',
        color: g.flags.length ? OUTCOME_COLOR.flagged : COLOR.faint,
      },
      dispositionWords(input.dispositions[g.id]?.outcome),
    ]),
  );
}

function drawRosettes(flow: PageFlow, input: ReportRecord): void {
  if (input.result.rosettes.length === 0) return;
  const u = unitLabels(input.units);
  const columns = new Map(buildRosetteColumns(input).map((c) => [c.csv, c]));
  const slope = `ue_per_${u.pressure}`;
  flow.heading('Rosettes', 80);
  flow.paragraph(
    `Principal strains per unit pressure (µε/${u.pressure}); angle of ε1 from the vessel axis; principal and von Mises ` +
      `stresses at test pressure ${formatPlain(input.testPressure)} ${u.pressure} in plane stress.`,
    7.5,
    COLOR.muted,
  );
  drawTable(
    flow,
    [
      { label: 'Rosette', width: 6.5 },
      { label: 'Type', width: 10.5 },
      { label: 'ε1', width: 7, align: 'right' },
      { label: 'ε2', width: 7, align: 'right' },
      { label: 'Predicted ε1', width: 8, align: 'right' },
      { label: 'Predicted ε2', width: 8, align: 'right' },
      { label: 'ε1 from axis °', width: 7.5, align: 'right' },
      { label: `σ1 ${u.stress}`, width: 7, align: 'right' },
      { label: `σ2 ${u.stress}`, width: 7, align: 'right' },
      { label: `von Mises ${u.stress}`, width: 7.5, align: 'right' },
      { label: 'von Mises / yield', width: 7.5, align: 'right' },
      { label: 'Flags', width: 8 },
    ],
    input.result.rosettes.map((r) => {
      const v = (key: string) => showNumber(columns.get(key)!.value(r) || '–');
      return [
        { text: r.id, weight: 600 },
        r.kind === 'rosette-rectangular' ? 'rectangular' : 'delta',
        v(`eps1_${slope}`),
        v(`eps2_${slope}`),
        v(`predicted_eps1_${slope}`),
        v(`predicted_eps2_${slope}`),
        v('principal_angle_from_axis_deg'),
        v(`sigma1_at_test_pressure_${u.stress}`),
        v(`sigma2_at_test_pressure_${u.stress}`),
        v(`von_mises_at_test_pressure_${u.stress}`),
        {
          text: v('von_mises_over_yield'),
          color: r.yieldFraction > input.tolerances.yieldFraction ? OUTCOME_COLOR.flagged : COLOR.ink,
        },
        {
          text: r.flags.length ? r.flags.map((f) => FLAG_LABELS[f]).join(', ') : '–',
          color: r.flags.length ? OUTCOME_COLOR.flagged : COLOR.faint,
        },
      ];
    }),
  );
}

function drawDispositions(flow: PageFlow, input: ReportRecord): void {
  const entries = input.result.gauges.filter((g) => input.dispositions[g.id]);
  flow.heading('Dispositions', 40);
  const undisposed = input.result.gauges.filter(
    (g) => outcomeOf(input, g.id) === 'flagged' && !input.dispositions[g.id],
  );
  if (entries.length === 0) flow.paragraph('No gauge has been dispositioned.', 8.5, COLOR.muted);
  else
    drawTable(
      flow,
      [
        { label: 'Gauge', width: 7 },
        { label: 'Disposition', width: 10 },
        { label: 'Reason', width: 53 },
        { label: 'By', width: 14 },
        { label: 'At (UTC)', width: 16 },
      ],
      entries.map((g) => {
        const d = input.dispositions[g.id]!;
        return [
          { text: g.id, weight: 600 },
          { text: dispositionWords(d.outcome), weight: 600 },
          d.reason,
          d.by,
          formatDateTimeUtc(d.at).replace(' UTC', ''),
        ];
      }),
      { size: 7.8 },
    );
  if (undisposed.length > 0)
    flow.paragraph(
      `Outside tolerance, awaiting a disposition: ${undisposed.map((g) => g.id).join(', ')}.`,
      8.5,
      OUTCOME_COLOR.flagged,
      600,
    );
  const retest = retestIds(input);
  if (retest.length > 0)
    flow.paragraph(
      `Marked for retest (the verdict stays flagged until they are tested again): ${retest.join(', ')}.`,
      8.5,
      OUTCOME_COLOR.flagged,
      600,
    );
}

function drawSignatures(flow: PageFlow, input: ReportRecord): void {
  flow.heading('Signatures', 40);
  if (input.signatures.length === 0) {
    flow.paragraph('Not yet signed: no engineering review and no release.', 8.5, COLOR.muted);
    return;
  }
  drawTable(
    flow,
    [
      { label: 'Signature', width: 18 },
      { label: 'Name', width: 20 },
      { label: 'E-mail', width: 24 },
      { label: 'Signed (UTC)', width: 16 },
      { label: 'Reduction', width: 22 },
    ],
    input.signatures.map((s) => {
      const stale = isSignatureStale(input, s.reductionId);
      return [
        { text: s.kind === 'review' ? 'Engineering review' : 'Release', weight: 600 },
        s.name,
        s.email,
        formatDateTimeUtc(s.at).replace(' UTC', ''),
        stale
          ? {
              text: `#${s.reductionId}: not this reduction (#${input.reductionId})`,
              color: OUTCOME_COLOR.flagged,
              weight: 600,
            }
          : `#${s.reductionId} (this report)`,
      ];
    }),
    { size: 7.8 },
  );
  for (const s of input.signatures) {
    const who = `${s.kind === 'review' ? 'Engineering review' : 'Release'} signed by ${s.name}: `;
    flow.paragraph(who + s.statement.replace(/\n/g, ' '), 7.8, COLOR.muted);
  }
}

function drawWarnings(flow: PageFlow, input: ReportRecord): void {
  const notes = input.result.gauges.flatMap((g) => g.notes.map((n) => `${g.id}: ${n}`));
  if (input.result.warnings.length === 0 && notes.length === 0) return;
  flow.heading('Reduction warnings and notes', 30);
  for (const w of input.result.warnings) flow.paragraph(`• ${w}`, 8);
  for (const n of notes) flow.paragraph(`• ${n}`, 8, COLOR.muted);
}

function drawFigures(flow: PageFlow, input: ReportRecord): void {
  const gauges = input.result.gauges;
  if (gauges.length === 0) return;
  const u = unitLabels(input.units);
  const columns = 2;
  const gapX = 22;
  const gapY = 16;
  const width = (CONTENT_WIDTH - gapX) / columns;
  const height = 204;
  const legendHeight = 22;
  const rowsPerPage = Math.floor((CONTENT_BOTTOM - MARGIN.top - 30 - legendHeight + gapY) / (height + gapY));
  const perPage = rowsPerPage * columns;
  for (let start = 0; start < gauges.length; start += perPage) {
    flow.addPage();
    flow.heading(start === 0 ? 'Strain versus pressure' : 'Strain versus pressure (continued)', 0);
    flow.y +=
      drawFigureLegend(flow.doc, MARGIN.left, flow.y, input.tolerances.slopeBand, input.result.bandMode) +
      legendHeight -
      12;
    const top = flow.y;
    gauges.slice(start, start + perPage).forEach((g, i) => {
      const col = i % columns;
      const row = Math.floor(i / columns);
      const alt =
        `Strain against pressure for gauge ${g.id}: measured slope ${showNumber(formatSlopeNumber(g.measuredSlope)) || 'none'}, ` +
        `predicted ${showNumber(formatSlopeNumber(g.predictedSlope))} µε/${u.pressure}, ${OUTCOME_LABELS[outcomeOf(input, g.id)]}.`;
      tagged(
        flow.doc,
        'Figure',
        () =>
          drawStrainPressureFigure(
            flow.doc,
            { x: MARGIN.left + col * (width + gapX), y: top + row * (height + gapY), width, height },
            g,
            {
              pressureUnit: u.pressure,
              testPressure: input.testPressure,
              slopeBand: input.tolerances.slopeBand,
              outcome: outcomeOf(input, g.id),
            },
          ),
        { alt },
      );
    });
  }
}

/** Running header, footer with caution and page numbers, and the DRAFT mark, on every page. */
function finishPages(doc: Doc, input: ReportRecord): void {
  const range = doc.bufferedPageRange();
  const total = range.count;
  for (let i = 0; i < total; i += 1) {
    doc.switchToPage(range.start + i);
    asArtifact(doc, () => drawRunningHeader(doc, input, i));
    const footerY = CONTENT_BOTTOM + 16;
    const pageLabel = `Page ${i + 1} of ${total}`;
    const labelWidth = measureText(doc, pageLabel, { size: 7.5, weight: 600 });
    const caution = () =>
      drawParagraph(doc, REPORT_CAUTION, MARGIN.left, footerY, CONTENT_WIDTH - labelWidth - 24, {
        size: 6.8,
        color: COLOR.muted,
      });
    // the caution is read once, on the first page; on the others it is page furniture
    if (i === 0) tagged(doc, 'P', caution);
    else asArtifact(doc, caution);
    asArtifact(doc, () => {
      drawTextLine(doc, pageLabel, MARGIN.left, footerY, {
        size: 7.5,
        weight: 600,
        color: COLOR.ink,
        align: 'right',
        width: CONTENT_WIDTH,
      });
      if (input.draft) drawDraftMark(doc);
    });
  }
}

/** The running header of pages after the first, and the footer rule. */
function drawRunningHeader(doc: Doc, input: ReportRecord, i: number): void {
  {
    if (i > 0) {
      drawTextLine(doc, 'Hoopline · Hydrotest strain report', MARGIN.left, 26, { size: 7.5, color: COLOR.muted });
      drawTextLine(
        doc,
        `${input.vessel.tag} · test #${input.test.id} · reduction #${input.reductionId}`,
        MARGIN.left,
        26,
        {
          size: 7.5,
          color: COLOR.muted,
          align: 'right',
          width: CONTENT_WIDTH,
        },
      );
      doc
        .save()
        .lineWidth(0.5)
        .strokeColor(COLOR.rule)
        .moveTo(MARGIN.left, 38)
        .lineTo(MARGIN.left + CONTENT_WIDTH, 38)
        .stroke()
        .restore();
    }
    const footerY = CONTENT_BOTTOM + 16;
    doc
      .save()
      .lineWidth(0.5)
      .strokeColor(COLOR.rule)
      .moveTo(MARGIN.left, footerY - 6)
      .lineTo(MARGIN.left + CONTENT_WIDTH, footerY - 6)
      .stroke()
      .restore();
  }
}

function drawDraftMark(doc: Doc): void {
  const size = 130;
  const angle = (-Math.atan2(PAGE.height, PAGE.width) * 180) / Math.PI;
  const width = measureText(doc, 'DRAFT', { size, weight: 700 });
  doc.save();
  doc.fillOpacity(0.09);
  doc.rotate(angle, { origin: [PAGE.width / 2, PAGE.height / 2] });
  drawTextLine(doc, 'DRAFT', PAGE.width / 2 - width / 2, PAGE.height / 2 - size * 0.55, {
    size,
    weight: 700,
    color: COLOR.draft,
  });
  doc.restore();
}
