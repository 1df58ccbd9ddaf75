import { describe, expect, it } from 'vitest';
import { parsePlan, predictForPlan } from '../../lib/reduction/browser';
import { createBlankPlan, setIn } from './plan-draft';
import { planFileName, readPlanText, serializePlan } from './plan-file';
import { buildPlanPreview, describeDistance, shortenNumbers } from './plan-preview';
import { convertPlanUnits } from './plan-draft';

// A 1000 mm × 10 mm closed cylinder at 2 MPa (the REFERENCES thin-cylinder check geometry).
const filled = () => {
  let p = createBlankPlan();
  p = setIn(p, ['vessel', 'insideDiameter'], 1000);
  p = setIn(p, ['vessel', 'wallThickness'], 10);
  p = setIn(p, ['vessel', 'length'], 3000);
  p = setIn(p, ['material', 'elasticModulus'], 200000);
  p = setIn(p, ['testPressure'], 2);
  return p;
};

describe('buildPlanPreview', () => {
  it('is null while the vessel or test pressure is missing', () => {
    expect(buildPlanPreview(createBlankPlan())).toBeNull();
  });

  it('matches predictForPlan for a valid plan', () => {
    const preview = buildPlanPreview(filled())!;
    const direct = predictForPlan(parsePlan(filled()));
    expect(preview.predicted).toEqual(direct.predicted);
    expect(preview.grids).toEqual(direct.gauges);
    expect(preview.omittedGauges).toEqual([]);
    // at the outer surface membrane over Lamé = (r_mean / r_inside)² − 1 = (505/500)² − 1
    expect(preview.predicted.membraneOverLame).toBeCloseTo((505 / 500) ** 2 - 1, 10);
    // 2.5·√(r t) with the mean radius
    expect(preview.predicted.edgeZoneDistance).toBeCloseTo(2.5 * Math.sqrt(505 * 10), 6);
  });

  it('gives every grid its U95 and largest input; the plan’s uncertainties change them (DESIGN 3.4)', () => {
    const assumed = buildPlanPreview(filled())!;
    // defaults: E 3 % beats thickness 2 % on a hoop gauge
    expect(assumed.uncertainty.H1!.dominant!.input).toBe('elasticModulus');
    expect(assumed.uncertainty.H1!.dominant!.assumed).toBe(true);
    const given = buildPlanPreview(setIn(filled(), ['uncertainty'], { wallThickness: 1 }))!;
    expect(given.uncertainty.H1!.dominant!.input).toBe('wallThickness');
    expect(given.uncertainty.H1!.predictedU95).toBeGreaterThan(assumed.uncertainty.H1!.predictedU95);
  });

  it('leaves out a broken gauge row and keeps predicting the rest', () => {
    const plan = setIn(filled(), ['gauges', 1, 'channels', 0], '');
    const preview = buildPlanPreview(plan)!;
    expect(preview.omittedGauges).toEqual(['A1']);
    expect(preview.grids.map((g) => g.id)).toEqual(['H1']);
  });

  it('still shows the shell when every gauge row is broken or the columns are missing', () => {
    let plan = setIn(filled(), ['gauges'], []);
    plan = setIn(plan, ['columns', 'pressure'], '');
    const preview = buildPlanPreview(plan)!;
    expect(preview.grids).toEqual([]);
    expect(preview.predicted.lame.hoopStrainPerPressure).toBeGreaterThan(0);
  });

  it('lists every grid of a rosette with both models', () => {
    const plan = setIn(filled(), ['gauges', 2], {
      id: 'R1',
      kind: 'rosette-delta',
      channels: ['C1', 'C2', 'C3'],
      angleDeg: 0,
    });
    const r = buildPlanPreview(plan)!.grids.filter((g) => g.gaugeId === 'R1');
    expect(r.map((g) => [g.id, g.angleDeg])).toEqual([
      ['R1/A', 0],
      ['R1/B', 60],
      ['R1/C', 120],
    ]);
    expect(r.every((g) => g.membranePredictedSlope > g.lamePredictedSlope)).toBe(true);
  });
});

describe('shortenNumbers', () => {
  it('shortens conversion-length numbers in labels and leaves short ones', () => {
    expect(shortenNumbers('head seam at 165.35433070866142')).toBe('head seam at 165.354');
    expect(shortenNumbers('head seam at 4200')).toBe('head seam at 4200');
    expect(shortenNumbers('nozzle N1 at 12.5')).toBe('nozzle N1 at 12.5');
  });
  it('is applied to the distances of a US plan', () => {
    let plan = setIn(filled(), ['gauges', 0, 'axialPosition'], 2900);
    plan = convertPlanUnits(plan, 'US');
    const h1 = buildPlanPreview(plan)!.grids.find((g) => g.id === 'H1')!;
    expect(h1.distanceTo).toBe('head seam at 118.11');
    expect(h1.distanceToDiscontinuity).toBeCloseTo(100 / 25.4, 12);
  });
});

describe('describeDistance', () => {
  it.each([
    [{ distanceToDiscontinuity: 800, distanceTo: 'support Saddle W' }, 'SI', '800 mm to support Saddle W'],
    [{ distanceToDiscontinuity: 30, distanceTo: 'given in the plan' }, 'US', '30.00 in (given in the plan)'],
    [{ distanceToDiscontinuity: null, distanceTo: null }, 'SI', null],
  ] as const)('%j in %s', (g, units, text) => {
    expect(describeDistance(g, units)).toBe(text);
  });
});

describe('plan files', () => {
  it('round-trips a plan with fields the editor does not know', () => {
    const plan = { ...filled(), remarks: 'from the DAQ PC', holdDetection: { band: 0.03 } };
    const read = readPlanText(serializePlan(plan));
    expect(read).toEqual({ ok: true, plan });
  });

  it.each([
    ['', /is empty/],
    ['{"units": "SI",', /not valid JSON/],
    ['[1, 2]', /one JSON object.*a list/],
    ['"plan"', /one JSON object.*a string/],
  ])('refuses %j with a clear message', (text, message) => {
    const r = readPlanText(text, 'plan.json');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(message);
  });

  it('tolerates a byte-order mark', () => {
    expect(readPlanText('\uFEFF{"units":"US"}').ok).toBe(true);
  });

  it('names the download after the test', () => {
    expect(planFileName('AR-102 re-test (nozzle)')).toBe('ar-102-re-test-nozzle-plan.json');
    expect(planFileName('')).toBe('test-plan.json');
  });
});
