// One gauge's strain-versus-pressure figure as vector graphics: hold-average points (loading and
// unloading with different markers), the fitted loading line, the predicted line through the
// origin and the band around it (the engine's bandSlope: ± slope band, near-zero or from the
// uncertainties; ± slope band × predicted when the result has none).
import type { GaugeOutcome, GaugeResult } from '../../lib/reduction/types';
import { OUTCOME_LABELS, formatFixed, formatPlain, formatSlopeNumber, showNumber } from './format';
import { COLOR, OUTCOME_COLOR } from './pdf-style';
import { drawTextLine, measureText } from './pdf-text';

type Doc = PDFKit.PDFDocument;

export interface Box {
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface FigureContext {
  pressureUnit: string;
  testPressure: number;
  slopeBand: number;
  outcome: GaugeOutcome;
}

/** A round step (1, 2, 2.5 or 5 × 10^k) near range / target. */
export function pickTickStep(range: number, target = 5): number {
  if (!(range > 0) || !Number.isFinite(range)) return 1;
  const raw = range / target;
  const power = 10 ** Math.floor(Math.log10(raw));
  const unit = raw / power;
  const nice = unit < 1.5 ? 1 : unit < 2.25 ? 2 : unit < 3.5 ? 2.5 : unit < 7.5 ? 5 : 10;
  return nice * power;
}

/** Fewest decimals that show a step exactly (0.25 → 2, 50 → 0). */
export function decimalsForStep(step: number): number {
  for (let d = 0; d < 8; d += 1) if (Math.abs(Math.round(step * 10 ** d) - step * 10 ** d) < 1e-6) return d;
  return 8;
}

/**
 * Axis domain padded to whole steps, always including zero. A sliver on the far side of zero
 * (a return-to-zero reading of −1 µε on a 200 µε axis) does not earn a whole extra step.
 */
export function buildAxis(values: number[], target = 5): { min: number; max: number; step: number } {
  const finite = values.filter(Number.isFinite);
  let lo = Math.min(0, ...finite);
  let hi = Math.max(0, ...finite);
  const span = hi - lo;
  if (lo < 0 && -lo < 0.03 * span) lo = 0;
  if (hi > 0 && hi < 0.03 * span) hi = 0;
  if (hi - lo < 1e-12) hi = lo + 1;
  const step = pickTickStep(hi - lo, target);
  lo = Math.floor(lo / step + 1e-9) * step;
  hi = Math.ceil(hi / step - 1e-9) * step;
  return { min: lo, max: hi, step };
}

function formatTick(value: number, decimals: number): string {
  return formatFixed(value, decimals).replace('-', '\u2212');
}

/** Draw the figure in box; everything stays inside it. */
export function drawStrainPressureFigure(doc: Doc, box: Box, gauge: GaugeResult, ctx: FigureContext): void {
  const titleHeight = 16;
  const captionHeight = 22;
  const plot = {
    x: box.x + 40,
    y: box.y + titleHeight + 6,
    width: box.width - 40 - 8,
    height: box.height - titleHeight - 6 - 24 - captionHeight,
  };

  // Title: id, channel, angle; the outcome on the right in its colour.
  drawTextLine(doc, gauge.id, box.x, box.y, { size: 9.5, weight: 700 });
  const idWidth = measureText(doc, gauge.id, { size: 9.5, weight: 700 });
  drawTextLine(doc, `${gauge.channel} · ${formatFixed(gauge.angleDeg, 0)}° from axis`, box.x + idWidth + 6, box.y + 2, {
    size: 7.5,
    color: COLOR.muted,
  });
  drawTextLine(doc, OUTCOME_LABELS[ctx.outcome].toUpperCase(), box.x, box.y + 2, {
    size: 7,
    weight: 700,
    color: OUTCOME_COLOR[ctx.outcome],
    align: 'right',
    width: box.width,
  });

  const k = gauge.predictedSlope;
  const [bandLo, bandHi] = gauge.bandSlope ?? [k * (1 - ctx.slopeBand), k * (1 + ctx.slopeBand)];
  const pressures = gauge.points.map((p) => p.pressure);
  const xAxis = buildAxis([ctx.testPressure, ...pressures], 5);
  const xEnd = xAxis.max;
  const strains = [...gauge.points.map((p) => p.strain), bandHi * xEnd, bandLo * xEnd];
  if (gauge.measuredSlope !== null) strains.push(gauge.measuredSlope * xEnd + (gauge.intercept ?? 0));
  const yAxis = buildAxis(strains, 5);
  const sx = (p: number) => plot.x + ((p - xAxis.min) / (xAxis.max - xAxis.min)) * plot.width;
  const sy = (e: number) => plot.y + plot.height - ((e - yAxis.min) / (yAxis.max - yAxis.min)) * plot.height;

  // Grid and tick labels.
  doc.save().lineWidth(0.4).strokeColor(COLOR.grid);
  const xDecimals = decimalsForStep(xAxis.step);
  const yDecimals = decimalsForStep(yAxis.step);
  for (let v = xAxis.min; v <= xAxis.max + xAxis.step / 2; v += xAxis.step) {
    doc
      .moveTo(sx(v), plot.y)
      .lineTo(sx(v), plot.y + plot.height)
      .stroke();
  }
  for (let v = yAxis.min; v <= yAxis.max + yAxis.step / 2; v += yAxis.step) {
    doc
      .moveTo(plot.x, sy(v))
      .lineTo(plot.x + plot.width, sy(v))
      .stroke();
  }
  doc.restore();
  for (let v = xAxis.min; v <= xAxis.max + xAxis.step / 2; v += xAxis.step) {
    drawTextLine(doc, formatTick(v, xDecimals), sx(v) - 20, plot.y + plot.height + 3, {
      size: 6.5,
      color: COLOR.muted,
      align: 'center',
      width: 40,
    });
  }
  for (let v = yAxis.min; v <= yAxis.max + yAxis.step / 2; v += yAxis.step) {
    drawTextLine(doc, formatTick(v, yDecimals), plot.x - 34, sy(v) - 3.6, {
      size: 6.5,
      color: COLOR.muted,
      align: 'right',
      width: 30,
    });
  }
  drawTextLine(doc, `Pressure (${ctx.pressureUnit})`, plot.x, plot.y + plot.height + 12, {
    size: 7,
    color: COLOR.muted,
    align: 'center',
    width: plot.width,
  });
  doc.save();
  doc.rotate(-90, { origin: [box.x + 2, plot.y + plot.height / 2] });
  drawTextLine(doc, 'Strain (µε)', box.x + 2 - plot.height / 2, plot.y + plot.height / 2 - 1, {
    size: 7,
    color: COLOR.muted,
    align: 'center',
    width: plot.height,
  });
  doc.restore();

  // Everything data-like is clipped to the plot area.
  doc.save();
  doc.rect(plot.x, plot.y, plot.width, plot.height).clip();
  const x0 = Math.max(0, xAxis.min);
  doc
    .polygon(
      [sx(x0), sy(bandHi * x0)],
      [sx(xEnd), sy(bandHi * xEnd)],
      [sx(xEnd), sy(bandLo * xEnd)],
      [sx(x0), sy(bandLo * x0)],
    )
    .fill(COLOR.band);
  doc
    .lineWidth(0.5)
    .strokeColor(COLOR.ink)
    .moveTo(plot.x, sy(0))
    .lineTo(plot.x + plot.width, sy(0))
    .stroke();
  doc.lineWidth(0.9).strokeColor(COLOR.muted).dash(3.5, { space: 2 });
  doc
    .moveTo(sx(x0), sy(k * x0))
    .lineTo(sx(xEnd), sy(k * xEnd))
    .stroke();
  doc.undash();
  if (gauge.measuredSlope !== null) {
    const c = gauge.intercept ?? 0;
    const pMax = Math.max(...pressures, ctx.testPressure);
    doc.lineWidth(1.2).strokeColor(COLOR.accent);
    doc
      .moveTo(sx(0), sy(c))
      .lineTo(sx(pMax), sy(c + gauge.measuredSlope * pMax))
      .stroke();
  }
  doc.restore();
  // Markers are not clipped: a point on the axis line stays whole.
  for (const p of gauge.points) {
    if (p.branch === 'loading') doc.circle(sx(p.pressure), sy(p.strain), 2.3).fill(COLOR.accent);
    else
      doc
        .lineWidth(0.9)
        .rect(sx(p.pressure) - 2.3, sy(p.strain) - 2.3, 4.6, 4.6)
        .stroke(COLOR.unloading);
  }
  doc.save().lineWidth(0.6).strokeColor(COLOR.muted);
  doc
    .moveTo(plot.x, plot.y)
    .lineTo(plot.x, plot.y + plot.height)
    .lineTo(plot.x + plot.width, plot.y + plot.height)
    .stroke();
  doc.restore();

  // Caption under the plot: the numbers the figure shows.
  const unit = `µε/${ctx.pressureUnit}`;
  const measured = gauge.measuredSlope === null ? 'no fit' : showNumber(formatSlopeNumber(gauge.measuredSlope));
  const ratio = gauge.ratio === null ? '' : ` · ratio ${formatFixed(gauge.ratio, 3)}`;
  const capY = plot.y + plot.height + 23;
  drawTextLine(
    doc,
    `measured ${measured} · predicted ${showNumber(formatSlopeNumber(k))} ${unit}${ratio}`,
    box.x,
    capY,
    {
      size: 7,
      color: COLOR.ink,
    },
  );
  if (gauge.flags.length > 0)
    drawTextLine(doc, `flags: ${gauge.flags.join(', ')}`, box.x, capY + 9.5, {
      size: 6.8,
      color: OUTCOME_COLOR.flagged,
    });
}

/** One legend line for a page of figures. */
export function drawFigureLegend(
  doc: Doc,
  x: number,
  y: number,
  slopeBand: number,
  bandMode: 'fixed' | 'uncertainty' = 'fixed',
): number {
  let cx = x;
  const item = (draw: (mx: number, my: number) => void, label: string) => {
    draw(cx, y + 4);
    cx += 18;
    cx += drawTextLine(doc, label, cx, y, { size: 7.5, color: COLOR.ink }) + 16;
  };
  item((mx, my) => doc.circle(mx + 7, my, 2.3).fill(COLOR.accent), 'loading hold');
  item(
    (mx, my) =>
      doc
        .lineWidth(0.9)
        .rect(mx + 4.7, my - 2.3, 4.6, 4.6)
        .stroke(COLOR.unloading),
    'unloading hold',
  );
  item(
    (mx, my) =>
      doc
        .lineWidth(1.2)
        .moveTo(mx, my)
        .lineTo(mx + 14, my)
        .stroke(COLOR.accent),
    'fitted loading line',
  );
  item((mx, my) => {
    doc
      .lineWidth(0.9)
      .dash(3.5, { space: 2 })
      .moveTo(mx, my)
      .lineTo(mx + 14, my)
      .stroke(COLOR.muted);
    doc.undash();
  }, 'predicted');
  item(
    (mx, my) => doc.rect(mx, my - 3.5, 14, 7).fill(COLOR.band),
    bandMode === 'uncertainty' ? 'band from the uncertainties' : `±${formatPlain(slopeBand * 100)} % band`,
  );
  return 12;
}
