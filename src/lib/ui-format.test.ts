import { describe, expect, it } from 'vitest';
import {
  formatAngle,
  formatFixed,
  formatInterval,
  formatMicrostrain,
  formatPercent,
  formatPressure,
  formatRatio,
  formatSignificant,
  formatSigned,
  formatSlope,
  formatStress,
  getUnitLabels,
} from './ui-format';

describe('ui-format', () => {
  it.each<[number | null, number, string]>([
    [425, 1, '425.0'],
    [-225, 1, '\u2212225.0'],
    [-0.04, 1, '0.0'], // no "−0.0"
    [null, 1, '—'],
    [Number.NaN, 2, '—'],
  ])('formatFixed(%s, %i) → %s', (v, d, want) => expect(formatFixed(v, d)).toBe(want));

  it('keeps four significant figures for slopes in either unit system', () => {
    expect(formatSignificant(236.95622)).toBe('237.0');
    expect(formatSignificant(1.6338)).toBe('1.634');
    expect(formatSignificant(0.012345)).toBe('0.01235');
    expect(formatSlope(236.95622, 'MPa')).toBe('237.0 µε/MPa');
    expect(formatSlope(-1.6338, 'psi')).toBe('\u22121.634 µε/psi');
    expect(formatSlope(null, 'MPa')).toBe('—');
  });

  it('formats strain, percent, ratio, pressure, stress and angles', () => {
    expect(formatMicrostrain(-12.345)).toBe('\u221212.3 µε');
    expect(formatPercent(0.052)).toBe('5.2 %');
    expect(formatPercent(0.052, 1, true)).toBe('+5.2 %');
    expect(formatPercent(-0.1, 0, true)).toBe('\u221210 %');
    expect(formatSigned(0.0001, 1)).toBe('0.0');
    expect(formatRatio(1.02449)).toBe('1.024');
    expect(formatPressure(3.4, 'MPa')).toBe('3.40 MPa');
    expect(formatPressure(493.1, 'psi')).toBe('493 psi');
    expect(formatStress(189.565, 'MPa')).toBe('189.6 MPa');
    expect(formatAngle(82.98, 1)).toBe('83.0°');
    expect(formatInterval([231.2, 240.84], (v) => formatFixed(v, 1))).toBe('231.2 – 240.8');
    expect(formatInterval(null, String)).toBe('—');
  });

  it('labels units for SI and US plans (DESIGN 4.1: SI MPa + mm, US psi + in)', () => {
    expect(getUnitLabels('SI')).toMatchObject({ pressure: 'MPa', length: 'mm', slope: 'µε/MPa' });
    expect(getUnitLabels('US')).toMatchObject({ pressure: 'psi', length: 'in', stress: 'psi', slope: 'µε/psi' });
  });
});
