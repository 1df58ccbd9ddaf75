// Point markers drawn on a uPlot canvas in its draw hook: uPlot's own points are circles only,
// and loading and unloading holds must differ in shape as well as colour.
import uPlot from 'uplot';

export type CanvasMarker = 'dot' | 'square-open';

/** Draw series `seriesIdx` of the chart's data as markers (canvas pixels, device-pixel aware). */
export function drawSeriesMarkers(
  u: uPlot,
  seriesIdx: number,
  marker: CanvasMarker,
  color: string,
  sizeCssPx = 9,
): void {
  const xs = u.data[0];
  const ys = u.data[seriesIdx];
  if (!ys) return;
  const ctx = u.ctx;
  const px = uPlot.pxRatio;
  const half = (sizeCssPx / 2) * px;
  ctx.save();
  ctx.beginPath();
  // clip with room for a whole marker, so a hold at zero pressure is not cut in half
  ctx.rect(u.bbox.left - 2 * half, u.bbox.top - 2 * half, u.bbox.width + 4 * half, u.bbox.height + 4 * half);
  ctx.clip();
  ctx.lineWidth = 2 * px;
  ctx.strokeStyle = color;
  ctx.fillStyle = marker === 'dot' ? color : '#ffffff';
  for (let i = 0; i < xs.length; i++) {
    const y = ys[i];
    if (y === null || y === undefined) continue;
    const cx = u.valToPos(xs[i]!, 'x', true);
    const cy = u.valToPos(y, 'y', true);
    ctx.beginPath();
    if (marker === 'dot') ctx.arc(cx, cy, half, 0, 2 * Math.PI);
    else ctx.rect(cx - half, cy - half, 2 * half, 2 * half);
    ctx.fill();
    ctx.stroke();
  }
  ctx.restore();
}

/** A dashed vertical line at x with a small label at its top (e.g. the test pressure). */
export function drawVerticalMarker(u: uPlot, xValue: number, label: string, color: string): void {
  const ctx = u.ctx;
  const px = uPlot.pxRatio;
  const x = u.valToPos(xValue, 'x', true);
  ctx.save();
  ctx.strokeStyle = color;
  ctx.lineWidth = 1.5 * px;
  ctx.setLineDash([4 * px, 4 * px]);
  ctx.beginPath();
  ctx.moveTo(x, u.bbox.top);
  ctx.lineTo(x, u.bbox.top + u.bbox.height);
  ctx.stroke();
  ctx.setLineDash([]);
  ctx.fillStyle = color;
  ctx.font = `${600} ${12 * px}px Inter, system-ui, sans-serif`;
  ctx.textAlign = 'right';
  ctx.textBaseline = 'top';
  ctx.fillText(label, x - 4 * px, u.bbox.top + 4 * px);
  ctx.restore();
}
