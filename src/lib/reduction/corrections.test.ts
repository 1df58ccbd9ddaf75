import { describe, expect, it } from 'vitest';
import {
  correctDelta,
  correctGaugeFactor,
  correctRectangular,
  correctPerpendicularPair,
  indicatedStrain,
  uniaxialTransverseFactor,
  correctionMatrix,
  leadWireFactor,
} from './corrections';
import { transformStrain } from './rosette';

describe('gauge-factor mismatch — REFERENCES.md [memory]', () => {
  it('1000 µε at instrument F 2.00 with a 2.10 gauge → 952.38 µε', () =>
    expect(correctGaugeFactor(1000, 2.1, 2.0)).toBeCloseTo(952.381, 3));
});

describe('lead wires — REFERENCES.md [memory]: output reduced by R_G/(R_G + R_L)', () => {
  it.each([
    ['two-wire, 0.5 Ω per lead, 120 Ω gauge: both leads', 0.5, 120, 'two-wire', 121 / 120],
    ['three-wire: one lead in the gauge arm', 0.5, 120, 'three-wire', 120.5 / 120],
    ['350 Ω gauge, 5 Ω leads two-wire', 5, 350, 'two-wire', 360 / 350],
  ] as const)('%s', (_n, rl, rg, wiring, want) => expect(leadWireFactor(rl, rg, wiring)).toBeCloseTo(want, 12));
});

describe('transverse sensitivity — REFERENCES.md, Micro-Measurements TN-509 [read for the method; equations memory]', () => {
  it('delta readings (1018, 224, −1527) µε, Kt 0.02 → (1036.63, 231.05, −1545.50) [derived] (±0.01)', () => {
    const [a, b, c] = correctDelta(1018, 224, -1527, 0.02);
    expect(Math.abs(a - 1036.63)).toBeLessThan(0.01);
    expect(Math.abs(b - 231.05)).toBeLessThan(0.01);
    expect(Math.abs(c + 1545.5)).toBeLessThan(0.01);
  });
  it.each([
    // closed cylinder, ν 0.3: εh/εa = 4.25; Kt 0.02 → axial reads 9.12 % high, hoop 1.05 % [derived]
    ['axial gauge', 100, 425, 0.0912],
    ['hoop gauge', 425, 100, 0.0105],
  ])('%s on a closed cylinder reads high by the stated share', (_n, along, across, high) => {
    expect(indicatedStrain(along, across, 0.02) / along - 1).toBeCloseTo(high, 4);
    expect(indicatedStrain(along, across, 0.02) * uniaxialTransverseFactor(0.02, across / along)).toBeCloseTo(along, 9);
  });

  describe.each([
    ['rectangular', [0, 45, 90], correctRectangular],
    ['delta', [0, 60, 120], correctDelta],
  ] as const)('%s rosette: forward model then correction returns the true strains', (_n, angles, correct) => {
    it.each([
      [900, -600, -850, 0.03],
      [425, 100, 0, -0.02],
      [-200, 300, 700, 0.05],
    ])('εx %d εy %d γ %d Kt %d', (ex, ey, g, kt) => {
      const truth = angles.map((a) => transformStrain(ex, ey, g, a));
      const across = angles.map((a) => transformStrain(ex, ey, g, a + 90));
      const ind = truth.map((t, k) => indicatedStrain(t, across[k]!, kt));
      const back = correct(ind[0]!, ind[1]!, ind[2]!, kt);
      back.forEach((v, k) => expect(v).toBeCloseTo(truth[k]!, 8));
    });
  });
  it('two perpendicular grids with different Kt: the forward model solved back exactly', () => {
    const [x, y] = correctPerpendicularPair(
      indicatedStrain(425, 100, 0.04),
      indicatedStrain(100, 425, -0.01),
      0.04,
      -0.01,
    );
    expect(x).toBeCloseTo(425, 9);
    expect(y).toBeCloseTo(100, 9);
  });
  it('two perpendicular grids', () => {
    const [x, y] = correctPerpendicularPair(indicatedStrain(425, 100, 0.04), indicatedStrain(100, 425, 0.04), 0.04);
    expect(x).toBeCloseTo(425, 9);
    expect(y).toBeCloseTo(100, 9);
  });
  it('the correction matrix equals the functions (gauge factor first)', () => {
    const M = correctionMatrix('rosette-delta', 2.1, 2.0, 0.02);
    const raw = [1018, 224, -1527].map((x) => (x * 2.1) / 2.0);
    const row = M.map((r) => r.reduce((s, c, j) => s + c * raw[j]!, 0));
    correctDelta(1018, 224, -1527, 0.02).forEach((v, k) => expect(row[k]).toBeCloseTo(v, 9));
  });
});
