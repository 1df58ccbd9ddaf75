import { describe, expect, it } from 'vitest';
import { FIXTURE_GAUGES, FIXTURE_PLAN, FIXTURE_RESULT } from './fixtures';
import { makeFixtureSeries } from './fixture-series';
import { buildStrainPlotData, pressureAxisMax } from './strain-plot-data';
import { classifyDirection, layoutDeviation, ratioDomain, ratioTicks } from './deviation-layout';
import { layoutShellMap, resolveGaugeOutcome, stackTopLabels } from './shell-map-layout';
import { sortGauges } from './gauge-sort';
import { alignZeroRanges, buildSeriesUrl, buildTimeHistoryData, scaleWindow } from './series-data';
import { combineOutcomes } from './outcome-style';
import { formatTicks } from './use-uplot';

const byId = (id: string) => FIXTURE_GAUGES.find((g) => g.id === id)!;

describe('buildStrainPlotData', () => {
  const d = buildStrainPlotData(byId('H1'), 3.4, 0.1);
  it('runs the pressure axis from 0 to at least the test pressure, ascending', () => {
    expect(d.x[0]).toBe(0);
    expect(d.xMax).toBeGreaterThanOrEqual(3.4);
    expect(d.x.at(-1)).toBe(d.xMax);
    expect(d.x.every((v, i) => i === 0 || v >= d.x[i - 1]!)).toBe(true);
  });
  it('keeps each hold on its own branch: 5 loading, 4 unloading points', () => {
    expect(d.loading.filter((v) => v !== null)).toHaveLength(5);
    expect(d.unloading.filter((v) => v !== null)).toHaveLength(4);
    d.x.forEach((_, i) => expect(d.loading[i] !== null && d.unloading[i] !== null).toBe(false));
  });
  it('puts the band at predicted × (1 ± band) and the prediction through the origin', () => {
    const i = d.x.length - 1;
    expect(d.predicted[0]).toBe(0);
    expect(d.bandUpper[i]).toBeCloseTo(236.956 * 1.1 * d.xMax, 6);
    expect(d.bandLower[i]).toBeCloseTo(236.956 * 0.9 * d.xMax, 6);
    expect(d.fit[i]).toBeCloseTo(0.49 + 233.725 * d.xMax, 6);
  });
  it('orders band edges for a negative prediction too', () => {
    const neg = buildStrainPlotData({ ...byId('A1'), predictedSlope: -50 }, 3.4, 0.1);
    neg.x.forEach((_, i) => expect(neg.bandUpper[i]).toBeGreaterThanOrEqual(neg.bandLower[i]!));
  });
  it('extends the axis past a point above the test pressure', () => {
    expect(pressureAxisMax(3.4, [3.6])).toBeCloseTo(3.78, 9);
  });
});

describe('layoutDeviation', () => {
  const layout = layoutDeviation(FIXTURE_GAUGES, 0.1);
  it('groups by direction and lists the not-compared gauge without plotting it', () => {
    expect(layout.groups.map((g) => g.group)).toEqual(['hoop', 'axial', 'other', 'rosette']);
    expect(layout.groups.find((g) => g.group === 'hoop')!.rows.map((r) => r.gauge.id)).toEqual(['H1', 'H2']);
    expect(layout.notPlotted.map((g) => g.id)).toEqual(['H3']);
  });
  it('divides the slope interval by the predicted slope', () => {
    const h1 = layout.groups[0]!.rows[0]!;
    expect(h1.ci![0]).toBeCloseTo(232.378 / 236.956, 9);
    expect(h1.ci![1]).toBeCloseTo(235.072 / 236.956, 9);
  });
  it('keeps the axis within 1 ± 5 bands even for a reversed gauge (ratio −0.98)', () => {
    expect(layout.domain).toEqual([0.5, expect.closeTo(129.555 / 101.055, 9)]); // D1's upper 95 % limit
    expect(ratioDomain([1.02], 0.05)).toEqual([expect.closeTo(0.925, 9), expect.closeTo(1.075, 9)]);
    expect(ratioTicks([0.5, 1.15])).toContain(1);
  });
  it.each([
    [90, 'hoop'],
    [270, 'hoop'],
    [-88, 'hoop'],
    [0, 'axial'],
    [180, 'axial'],
    [178, 'axial'],
    [30, 'other'],
  ] as const)('classifies %f° as %s', (angleDeg, want) => expect(classifyDirection({ id: 'X', angleDeg })).toBe(want));
});

describe('layoutShellMap', () => {
  const m = layoutShellMap(FIXTURE_PLAN, FIXTURE_RESULT.predicted.edgeZoneDistance)!;
  it('lays the outer circumference (π × 1832 mm) against the length', () => {
    expect(m.circumference).toBeCloseTo(Math.PI * 1832, 9);
    expect(m.length).toBe(6000);
  });
  it('shades edge zones at both head seams and around ring features, the nozzle zone reaching size/2 + 2.5√(rt)', () => {
    expect(m.ringZones[0]).toEqual({ x0: 0, x1: expect.closeTo(301.33, 6), label: 'edge zone' });
    expect(m.ringZones[1]!.x1).toBe(6000);
    expect(m.ringZones).toHaveLength(5); // 2 seams + S1 + S2 + T1
    expect(m.pointZones).toEqual([
      {
        x: 4700,
        arc: expect.closeTo((10 / 360) * Math.PI * 1832, 6),
        radius: expect.closeTo(451.33, 6),
        label: 'edge zone',
      },
    ]);
  });
  it('places gauges with a position and lists the rest', () => {
    expect(m.placed.map((p) => p.gauge.id)).toEqual(['H1', 'H2', 'A1', 'R1', 'A2', 'H3']);
    expect(m.unplaced.map((g) => g.id)).toEqual(['D1']);
  });
  it('has no map for a sphere', () => {
    expect(layoutShellMap({ ...FIXTURE_PLAN, vessel: { ...FIXTURE_PLAN.vessel, shape: 'sphere' } }, 300)).toBeNull();
  });
  it('gives a rosette the worst outcome of its grids', () => {
    const results = Object.fromEntries(FIXTURE_GAUGES.map((g) => [g.id, g]));
    expect(resolveGaugeOutcome('R1', results)).toBe('in-band');
    expect(resolveGaugeOutcome('R1', { ...results, 'R1/B': { outcome: 'flagged' } })).toBe('flagged');
    expect(combineOutcomes(['excluded', 'not-compared'])).toBe('not-compared');
  });
  it('stacks overlapping labels into rows', () => {
    const rows = stackTopLabels([
      { text: 'S1 support', x: 190, anchor: 'middle' },
      { text: 'T1 thickness change', x: 234, anchor: 'middle' },
      { text: 'S2 support', x: 800, anchor: 'middle' },
    ]);
    expect(rows.map((r) => r.row)).toEqual([0, 1, 0]);
  });
});

describe('sortGauges', () => {
  it('sorts ids naturally and numbers with empty values last in both directions', () => {
    const rows = [...FIXTURE_GAUGES, { ...byId('H1'), id: 'H10', ratio: null }];
    expect(
      sortGauges(rows, 'id', 'ascending')
        .slice(0, 4)
        .map((g) => g.id),
    ).toEqual(['A1', 'A2', 'D1', 'H1']);
    expect(
      sortGauges(rows, 'ratio', 'ascending')
        .map((g) => g.id)
        .slice(0, 2),
    ).toEqual(['A2', 'H1']);
    expect(sortGauges(rows, 'ratio', 'descending').at(-1)!.id).toBe('H10');
    expect(sortGauges(rows, 'ratio', 'descending')[0]!.id).toBe('H3');
    expect(sortGauges(rows, 'outcome', 'ascending')[0]!.outcome).toBe('flagged');
  });
});

describe('series helpers', () => {
  it('builds the series URL for the full log and for a zoomed window', () => {
    expect(buildSeriesUrl('/api/tests/12/series', null)).toBe('/api/tests/12/series?points=1500');
    expect(buildSeriesUrl('/api/share/TOK/series', { from: 100.12345, to: 400 })).toBe(
      '/api/share/TOK/series?from=100.123&to=400&points=1500',
    );
  });
  it('orders plot arrays t, pressure max/min, then each chosen channel max/min', () => {
    const s = makeFixtureSeries({ points: 200 });
    const { data, specs } = buildTimeHistoryData(s, ['SG1', 'SG2', 'missing']);
    expect(data).toHaveLength(1 + 2 * 3);
    expect(specs.map((x) => `${x.channel}:${x.edge}`)).toEqual([
      'pressure:max',
      'pressure:min',
      'SG1:max',
      'SG1:min',
      'SG2:max',
      'SG2:min',
    ]);
    expect(s.t.length).toBeLessThanOrEqual(200);
  });
  it('keeps a spike inside a bucket in the bucket maximum', () => {
    const s = makeFixtureSeries({ points: 100 });
    expect(Math.max(...s.max.SG2!)).toBeGreaterThan(Math.max(...s.min.SG2!) + 30);
  });
  it('zooms a window around its centre and stays inside the full span', () => {
    expect(scaleWindow([0, 1000], [0, 1000], 0.5)).toEqual([250, 750]);
    expect(scaleWindow([0, 200], [0, 1000], 2)).toEqual([0, 400]);
    expect(scaleWindow([200, 600], [0, 1000], 4)).toEqual([0, 1000]);
  });
});

describe('alignZeroRanges', () => {
  it('puts zero strain and zero pressure at the same fraction of the height', () => {
    const r = alignZeroRanges(-100, 900, 3.4);
    const zs = (0 - r.strain[0]) / (r.strain[1] - r.strain[0]);
    const zp = (0 - r.pressure[0]) / (r.pressure[1] - r.pressure[0]);
    expect(zp).toBeCloseTo(zs, 12);
    expect(r.pressure[1]).toBeCloseTo(3.4 * 1.08, 12);
  });
  it('starts both at zero when no strain is negative', () => {
    expect(alignZeroRanges(0, 500, 2)).toEqual({ strain: [0, 525], pressure: [0, expect.closeTo(2.16, 12)] });
  });
});

describe('formatTicks', () => {
  it('uses the decimals the step needs and a true minus', () => {
    expect(formatTicks([-50, 0, 50], 50)).toEqual(['\u221250', '0', '50']);
    expect(formatTicks([0, 0.5, 1], 0.5)).toEqual(['0.0', '0.5', '1.0']);
    expect(formatTicks([0.9, 0.95], 0.05)).toEqual(['0.90', '0.95']);
    // a quarter step keeps both decimals (it read 0.3, 0.5, 0.8 on the pressure axis)
    expect(formatTicks([0, 0.25, 0.5, 0.75], 0.25)).toEqual(['0.00', '0.25', '0.50', '0.75']);
    expect(formatTicks([0, 2.5, 5], 2.5)).toEqual(['0.0', '2.5', '5.0']);
  });
});
