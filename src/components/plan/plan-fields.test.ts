import { describe, expect, it } from 'vitest';
import { listPlanIssues } from '../../lib/reduction/browser';
import { createBlankPlan, setIn } from './plan-draft';
import { fieldIdForPath, labelForPath, listFieldIds, parseIssuePath, placeIssues, resolveFieldId } from './plan-fields';

const plan = {
  ...createBlankPlan(),
  testPressure: 2,
  vessel: {
    shape: 'cylinder',
    insideDiameter: 1000,
    wallThickness: 10,
    length: 3000,
    features: [{ kind: 'nozzle', axialPosition: 100 }],
  },
  gauges: [
    { id: 'H1', kind: 'uniaxial', channels: ['CH1'], angleDeg: 90 },
    { id: 'R1', kind: 'rosette-rectangular', channels: ['CH2', 'CH3', 'CH4'], angleDeg: 0 },
  ],
};

describe('parseIssuePath', () => {
  it.each([
    ['vessel.wallThickness', ['vessel', 'wallThickness']],
    ['gauges[2].channels', ['gauges', 2, 'channels']],
    ['gauges[1].channels[2]', ['gauges', 1, 'channels', 2]],
    ['vessel.features[0].clockDeg', ['vessel', 'features', 0, 'clockDeg']],
    ['plan', []],
  ])('%s', (text, path) => {
    expect(parseIssuePath(text)).toEqual(path);
  });
});

describe('resolveFieldId', () => {
  const ids = listFieldIds(plan);
  it.each([
    ['vessel.wallThickness', 'plan-vessel-wallThickness'],
    ['material.elasticModulus', 'plan-material-elasticModulus'],
    ['tolerances.zeroShiftFraction', 'plan-tolerances-zeroShiftFraction'],
    ['testPressure', 'plan-testPressure'],
    ['columns.pressure', 'plan-columns-pressure'],
    ['gauges[1].channels[2]', 'plan-gauges-1-channels-2'],
    // a wrong channel count points at the first channel input
    ['gauges[0].channels', 'plan-gauges-0-channels-0'],
    ['gauges[1].angleDeg', 'plan-gauges-1-angleDeg'],
    ['vessel.features[0].clockDeg', 'plan-vessel-features-0-clockDeg'],
    // no input of its own: the nearest section
    ['gauges[5].id', 'plan-gauges'],
    ['gauges', 'plan-gauges'],
    ['vessel', 'plan-vessel'],
    ['tolerances.unknownThing', 'plan-tolerances'],
  ])('%s → %s', (path, id) => {
    expect(resolveFieldId(parseIssuePath(path), ids)).toBe(id);
  });

  it('has no field for the plan as a whole or for fields the editor does not show', () => {
    expect(resolveFieldId([], ids)).toBeNull();
    expect(resolveFieldId(parseIssuePath('holdDetection.band'), ids)).toBeNull();
  });

  it('a rosette has three channel inputs and a uniaxial gauge one', () => {
    expect(ids.has('plan-gauges-1-channels-2')).toBe(true);
    expect(ids.has('plan-gauges-0-channels-1')).toBe(false);
  });

  it('every issue the schema finds in a broken plan lands on an input or section the editor shows', () => {
    let broken = setIn(plan, ['vessel', 'wallThickness'], -1);
    broken = setIn(broken, ['material', 'poissonRatio'], 0.7);
    broken = setIn(broken, ['gauges', 0, 'kind'], 'strain');
    broken = setIn(broken, ['tolerances', 'slopeBand'], 'ten');
    const issues = listPlanIssues(broken);
    expect(issues.length).toBe(4);
    const { placed, byField } = placeIssues(issues, broken);
    expect(placed.every((p) => p.fieldId !== null)).toBe(true);
    expect(byField.get('plan-vessel-wallThickness')).toEqual(['must be greater than 0']);
    expect(byField.get('plan-tolerances-slopeBand')).toEqual(['must be a number']);
    expect(byField.get('plan-gauges-0-kind')?.[0]).toMatch(/must be one of uniaxial/);
  });

  it('cross-field problems (a channel used twice, a gauge off the shell) land on the field too', () => {
    let broken = setIn(plan, ['gauges', 1, 'channels', 1], 'CH1');
    broken = setIn(broken, ['gauges', 0, 'axialPosition'], 4000);
    const { byField } = placeIssues(listPlanIssues(broken), broken);
    expect(byField.get('plan-gauges-1-channels-1')?.[0]).toMatch(/already used by gauge H1/);
    expect(byField.get('plan-gauges-0-axialPosition')?.[0]).toMatch(/between 0 and the vessel length 3000/);
  });
});

describe('labelForPath', () => {
  it.each([
    ['gauges[1].channels[2]', 'Gauge R1, channel of grid C'],
    ['gauges[0].angleDeg', 'Gauge H1, angle'],
    ['columns.pressure', 'Pressure column'],
    ['uncertainty.gaugeFactor', 'Uncertainty of the gauge factor'],
    ['vessel.wallThickness', 'Vessel wall thickness'],
    ['vessel.features[0].axialPosition', 'Feature 1 axial position'],
    ['tolerances.minRSquared', 'Tolerances minimum R²'],
    ['plan', 'Plan'],
  ])('%s → %s', (path, label) => {
    expect(labelForPath(parseIssuePath(path), plan)).toBe(label);
  });

  it('fieldIdForPath joins the path', () => {
    expect(fieldIdForPath(['gauges', 3, 'clockDeg'])).toBe('plan-gauges-3-clockDeg');
  });
});
