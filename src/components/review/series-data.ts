// The decimated time history (GET …/series, compact columns decoded by src/lib/series-encoding)
// turned into uPlot arrays: each channel as a max and a min series with a band between them, so
// a spike inside a bucket still shows.
import type uPlot from 'uplot';
import type { DecodedSeries } from '../../lib/series-encoding';

export const SERIES_POINTS = 1500;

/**
 * `${seriesUrl}?points=1500`, with `from` and `to` (seconds) for a zoomed window, and with
 * `reduction` naming the reduction shown (its series never changes, so the browser keeps it).
 */
export function buildSeriesUrl(
  seriesUrl: string,
  range: { from: number; to: number } | null,
  points = SERIES_POINTS,
  reductionId: number | null = null,
): string {
  const params = new URLSearchParams();
  if (range) {
    params.set('from', String(roundTime(range.from)));
    params.set('to', String(roundTime(range.to)));
  }
  params.set('points', String(points));
  if (reductionId !== null) params.set('reduction', String(reductionId));
  return `${seriesUrl}${seriesUrl.includes('?') ? '&' : '?'}${params.toString()}`;
}

/** Milliseconds are plenty for a window edge; avoids 17-digit query strings. */
function roundTime(t: number): number {
  return Math.round(t * 1000) / 1000;
}

export interface PlotSeriesSpec {
  channel: string;
  edge: 'max' | 'min';
  scale: 'p' | 'y';
}

/** Arrays in uPlot's order: t, then pressure max/min (if present), then each chosen channel max/min. */
export function buildTimeHistoryData(
  series: Pick<DecodedSeries, 't' | 'min' | 'max'>,
  chosen: readonly string[],
): { data: uPlot.AlignedData; specs: PlotSeriesSpec[] } {
  const specs: PlotSeriesSpec[] = [];
  const arrays: (number | null)[][] = [series.t];
  const add = (channel: string, scale: 'p' | 'y') => {
    const max = series.max[channel];
    const min = series.min[channel];
    if (!max || !min) return;
    specs.push({ channel, edge: 'max', scale }, { channel, edge: 'min', scale });
    arrays.push(max, min);
  };
  add('pressure', 'p');
  for (const c of chosen) if (c !== 'pressure') add(c, 'y');
  return { data: arrays as uPlot.AlignedData, specs };
}

/** A window `factor` times the current one around its centre, kept inside the full span. */
export function scaleWindow(current: [number, number], full: [number, number], factor: number): [number, number] {
  const centre = (current[0] + current[1]) / 2;
  const half = ((current[1] - current[0]) * factor) / 2;
  const fullHalf = (full[1] - full[0]) / 2;
  if (half >= fullHalf) return full;
  const c = Math.min(full[1] - half, Math.max(full[0] + half, centre));
  return [c - half, c + half];
}

/**
 * Axis ranges that put zero strain and zero pressure at the same height, so a reader does not
 * take the pressure trace's baseline for a strain offset. Strain is padded by 5 %.
 */
export function alignZeroRanges(
  strainMin: number,
  strainMax: number,
  pressureMax: number,
): { strain: [number, number]; pressure: [number, number] } {
  const lo0 = Math.min(0, strainMin);
  const hi0 = Math.max(0, strainMax);
  const pad = (hi0 - lo0) * 0.05 || 1;
  const strain: [number, number] = [lo0 === 0 ? 0 : lo0 - pad, hi0 + pad];
  const pTop = pressureMax > 0 ? pressureMax * 1.08 : 1;
  if (strain[1] <= 0) return { strain, pressure: [0, pTop] };
  // zero sits at the same fraction of both axes: pLo / pTop = sLo / sHi
  return { strain, pressure: [(pTop * strain[0]) / strain[1], pTop] };
}

/** Extent of the chosen strain channels and of pressure in a plot's arrays. */
export function measureExtents(data: uPlot.AlignedData, specs: readonly PlotSeriesSpec[]) {
  let sMin = Infinity,
    sMax = -Infinity,
    pMax = -Infinity;
  specs.forEach((s, k) => {
    for (const v of data[k + 1] as (number | null)[]) {
      if (v === null || !Number.isFinite(v)) continue;
      if (s.scale === 'p') pMax = Math.max(pMax, v);
      else {
        sMin = Math.min(sMin, v);
        sMax = Math.max(sMax, v);
      }
    }
  });
  return {
    strainMin: Number.isFinite(sMin) ? sMin : 0,
    strainMax: Number.isFinite(sMax) ? sMax : 0,
    pressureMax: Number.isFinite(pMax) ? pMax : 0,
  };
}

/** What the cursor reads at one sample: time, pressure and each chosen channel's strain (bucket mean of min and max). */
export function readAtIndex(
  data: uPlot.AlignedData,
  specs: readonly PlotSeriesSpec[],
  index: number,
): { t: number | null; values: { channel: string; value: number | null }[] } {
  const t = (data[0] as (number | null)[])[index] ?? null;
  const values: { channel: string; value: number | null }[] = [];
  specs.forEach((s, k) => {
    if (s.edge !== 'max') return;
    const hi = (data[k + 1] as (number | null)[])[index];
    const lo = (data[k + 2] as (number | null)[])[index];
    values.push({
      channel: s.channel,
      value: hi === null || hi === undefined || lo === null || lo === undefined ? null : (hi + lo) / 2,
    });
  });
  return { t, values };
}
