import { describe, expect, it } from 'vitest';
import type { Series } from './reduction/types';
import { channelResolution, decodeSeries, encodeSeries, SERIES_FORMAT, type EncodedSeries } from './series-encoding';

/** A min/max series of `n` buckets: pressure logged at 0.0001 MPa, strains corrected (not decimal). */
function sampleSeries(n: number, gauges = 18): Series {
  const t: number[] = [];
  const min: Record<string, number[]> = { pressure: [] };
  const max: Record<string, number[]> = { pressure: [] };
  const channels = ['pressure', ...Array.from({ length: gauges }, (_, i) => `SG${i + 1}`)];
  for (const c of channels.slice(1)) {
    min[c] = [];
    max[c] = [];
  }
  for (let i = 0; i < n; i++) {
    t.push(i * 0.512);
    const p = Math.round(2 * Math.sin((i / n) * Math.PI) * 1e4) / 1e4;
    min.pressure!.push(p);
    max.pressure!.push(p + 0.0003);
    channels.slice(1).forEach((c, k) => {
      const e = (p * (300 + 40 * k) + Math.sin(i * 7.1 + k) * 1.5) * (2 / 2.09);
      min[c]!.push(e);
      max[c]!.push(e + 2.25 + (i === 700 && k === 3 ? 5000 : 0));
    });
  }
  return { t, min, max, channels, timeIsIndex: false };
}

describe('channelResolution', () => {
  it('finds the decimal step values were recorded at', () => {
    expect(channelResolution([[0, 0.25, 1.5, -3.75]])).toBe(0.01);
    expect(channelResolution([[12, 40, -7]])).toBe(1);
    expect(channelResolution([[0.1 + 0.2, 0.7]])).toBe(0.1); // binary noise is not a finer step
    expect(
      channelResolution([
        [1.2345, 0.5],
        [null, 2],
      ]),
    ).toBe(0.0001);
  });
  it('never goes finer than 1/100 000 of the range for values that are not decimal', () => {
    expect(channelResolution([[0, 1000 / 3, 1000]])).toBe(0.01);
    expect(channelResolution([[0, Math.PI]])).toBe(1e-5);
  });
  it('gives 1 for a column with no finite value', () => {
    expect(channelResolution([[NaN, null]])).toBe(1);
    expect(channelResolution([])).toBe(1);
  });
});

describe('encodeSeries / decodeSeries', () => {
  it('round-trips every value to within half its channel step, gaps as null', () => {
    const s = sampleSeries(500, 4);
    s.min.SG2![10] = NaN;
    s.max.SG2![10] = NaN;
    const e = encodeSeries(s, 42);
    expect(e.format).toBe(SERIES_FORMAT);
    const d = decodeSeries(JSON.parse(JSON.stringify(e)) as EncodedSeries);
    expect(d.reductionId).toBe(42);
    expect(d.channels).toEqual(s.channels);
    const tStep = e.t.step;
    d.t.forEach((v, i) => expect(Math.abs(v - s.t[i]!)).toBeLessThanOrEqual(tStep / 2 + 1e-12));
    for (const c of e.channels) {
      const lo = d.min[c.name]!,
        hi = d.max[c.name]!;
      for (let i = 0; i < s.t.length; i++) {
        if (c.name === 'SG2' && i === 10) {
          expect(lo[i]).toBeNull();
          expect(hi[i]).toBeNull();
          continue;
        }
        expect(Math.abs(lo[i]! - s.min[c.name]![i]!)).toBeLessThanOrEqual(c.step / 2 + 1e-9);
        expect(Math.abs(hi[i]! - s.max[c.name]![i]!)).toBeLessThanOrEqual(c.step / 2 + 1e-9);
        expect(hi[i]!).toBeGreaterThanOrEqual(lo[i]!);
      }
    }
    // pressure was written with four decimals: it comes back exactly
    expect(e.channels[0]!.step).toBe(0.0001);
    expect(d.min.pressure).toEqual(s.min.pressure);
  });
  it('keeps a spike inside a bucket and uses the steps it is given', () => {
    const s = sampleSeries(1000, 5);
    const e = encodeSeries(s, 1, { channels: { SG4: 0.5 }, t: 0.001 });
    expect(e.channels.find((c) => c.name === 'SG4')!.step).toBe(0.5);
    expect(e.t.step).toBe(0.001);
    const d = decodeSeries(e);
    expect(Math.max(...(d.max.SG4 as number[]))).toBeGreaterThan(5000);
  });
  it('is well under the size of the plain min/max JSON at 2000 buckets and 18 gauges', () => {
    const s = sampleSeries(2000, 18);
    const round = (v: number) => Math.round(v * 1000) / 1000;
    const plain = JSON.stringify({
      ...s,
      t: s.t.map(round),
      min: Object.fromEntries(Object.entries(s.min).map(([k, v]) => [k, v.map(round)])),
      max: Object.fromEntries(Object.entries(s.max).map(([k, v]) => [k, v.map(round)])),
    });
    const compact = JSON.stringify(encodeSeries(s, 1));
    expect(compact.length).toBeLessThan(plain.length * 0.6);
  });
  it('refuses a format it does not know', () => {
    const e = { ...encodeSeries(sampleSeries(3, 1), 1), format: 'other' } as unknown as EncodedSeries;
    expect(() => decodeSeries(e)).toThrow(/unknown series format/);
  });
});
