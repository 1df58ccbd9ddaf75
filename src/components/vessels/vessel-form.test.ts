import { describe, expect, it } from 'vitest';
import {
  convertMaterialForm,
  convertVesselForm,
  formatLength,
  formatStress,
  formKeyForServerPath,
  materialFormToBody,
  vesselFormToBody,
  vesselToForm,
  type VesselRow,
} from './vessel-form';

const stored: VesselRow = {
  id: 1,
  tag: 'LM-AR-102',
  name: 'Air receiver',
  shape: 'cylinder',
  ends: 'closed',
  insideDiameterMm: 1200,
  wallThicknessMm: 12,
  lengthMm: 4200,
  features: [
    { kind: 'nozzle', name: 'N1', axialPosition: 2100, clockDeg: 0, size: 150 },
    { kind: 'support', axialPosition: 700 },
  ],
  materialId: 3,
  units: 'SI',
};

describe('vessel form', () => {
  it('a stored vessel shown in US and saved again gives back the same SI body', () => {
    const us = vesselToForm(stored, 'US');
    expect(us.insideDiameter).toBeCloseTo(1200 / 25.4, 12);
    const r = vesselFormToBody(us, 'US');
    expect(r.ok).toBe(true);
    if (r.ok)
      expect(r.body).toEqual({
        tag: 'LM-AR-102',
        name: 'Air receiver',
        shape: 'cylinder',
        ends: 'closed',
        insideDiameterMm: 1200,
        wallThicknessMm: 12,
        lengthMm: 4200,
        materialId: 3,
        units: 'US',
        features: [
          { kind: 'nozzle', name: 'N1', axialPosition: 2100, clockDeg: 0, size: 150 },
          { kind: 'support', axialPosition: 700 },
        ],
      });
  });

  it('switching the form SI → US → SI returns the same numbers', () => {
    const si = vesselToForm(stored, 'SI');
    expect(convertVesselForm(convertVesselForm(si, 'SI', 'US'), 'US', 'SI')).toEqual(si);
  });

  it('names every problem by field', () => {
    const f = {
      ...vesselToForm(null, 'SI'),
      tag: ' ',
      insideDiameter: 100,
      wallThickness: 60,
      features: [{ kind: 'nozzle', axialPosition: 'x' as const, clockDeg: 400, size: undefined }],
    };
    const r = vesselFormToBody(f, 'SI');
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.issues.tag).toBe('give the vessel a tag');
      expect(r.issues.name).toBe('give the vessel a name');
      expect(r.issues['features-0-axialPosition']).toBe('must be a number');
      expect(r.issues['features-0-clockDeg']).toBe('must be between 0 and 360');
    }
    const r2 = vesselFormToBody({ ...vesselToForm(stored, 'SI'), wallThickness: 600, length: undefined }, 'SI');
    expect(r2.ok ? null : r2.issues).toEqual({
      length: 'is required for a cylinder',
      wallThickness: 'must be less than the inside radius',
    });
  });

  it('a sphere needs no length and stores none', () => {
    const r = vesselFormToBody({ ...vesselToForm(stored, 'SI'), shape: 'sphere', length: 4200 }, 'SI');
    expect(r.ok && r.body.lengthMm).toBeNull();
  });
});

describe('material form', () => {
  it('US values become MPa exactly', () => {
    const r = materialFormToBody(
      { name: 'SA-516-70', elasticModulus: 29500000, poissonRatio: 0.3, yieldStrength: 38000 },
      'US',
    );
    expect(r.ok).toBe(true);
    if (r.ok) {
      expect(r.body.elasticModulusMPa).toBeCloseTo((29500000 * 6894.757293168) / 1e6, 6);
      expect(r.body.yieldStrengthMPa).toBeCloseTo(38000 * 0.006894757293168, 9);
    }
  });
  it('catches a modulus typed in GPa, and yield above E', () => {
    const r = materialFormToBody({ name: 'x', elasticModulus: 200, poissonRatio: 0.3, yieldStrength: 250 }, 'SI');
    expect(r.ok ? null : r.issues).toEqual({
      elasticModulus: 'is in MPa: 200 GPa is 200000',
      yieldStrength: 'must be smaller than the elastic modulus',
    });
  });
  it('round-trips SI → US → SI', () => {
    const f = { name: 'steel', elasticModulus: 203000, poissonRatio: 0.3, yieldStrength: 260 };
    expect(convertMaterialForm(convertMaterialForm(f, 'SI', 'US'), 'US', 'SI')).toEqual(f);
  });
});

describe('display and server paths', () => {
  it.each([
    [1200, 'SI', '1200 mm'],
    [1200, 'US', '47.244 in'],
    [null, 'SI', '—'],
  ] as const)('length %s in %s', (mm, u, text) => {
    expect(formatLength(mm, u)).toBe(text);
  });
  it('stress', () => {
    expect(formatStress(203000, 'US')).toBe('29442661 psi');
    expect(formatStress(260, 'SI')).toBe('260 MPa');
  });
  it.each([
    ['lengthMm', 'length'],
    ['features.0.size', 'features-0-size'],
    ['elasticModulusMPa', 'elasticModulus'],
    ['tag', 'tag'],
  ])('%s → %s', (p, k) => {
    expect(formKeyForServerPath(p)).toBe(k);
  });
});
