import { describe, expect, it } from 'vitest';
import {
  PSI_IN_PA,
  psiToMPa,
  mpaToPsi,
  inToMm,
  mmToIn,
  barToMPa,
  normalizePressureUnit,
  parsePressureUnit,
  pressureFactor,
  standardAtmosphere,
  unitThatFits,
} from './units';
import { splitUnit } from './text';

describe('units — NIST SP 811 appendix B.8 [read] (REFERENCES.md)', () => {
  it('1 psi = 1 lbf/in² = 0.45359237 kg × 9.80665 m/s² / (0.0254 m)² (the definitions of the pound, standard gravity and the inch)', () =>
    expect(PSI_IN_PA).toBeCloseTo((0.45359237 * 9.80665) / 0.0254 ** 2, 9));
  it.each([
    ['psi → MPa', psiToMPa(1000), 6.894757293168],
    ['MPa → psi', mpaToPsi(6.894757293168), 1000],
    ['in → mm', inToMm(1), 25.4],
    ['mm → in', mmToIn(254), 10],
    ['bar → MPa', barToMPa(34), 3.4],
  ])('%s', (_n, got, want) => expect(got).toBeCloseTo(want, 10));
  it.each([
    ['MPa', 'MPa'],
    ['mpa', 'MPa'],
    ['bar(g)', 'bar'],
    ['barg', 'bar'],
    ['psig', 'psi'],
    ['kPa', 'kPa'],
    ['V', null],
    // names that an object literal inherits are no units either
    ['constructor', null],
    ['__proto__', null],
  ])('bracket unit %s → %s', (raw, want) => expect(normalizePressureUnit(raw)).toBe(want));
  it.each([
    ['bar', 'MPa', 0.1],
    ['kPa', 'MPa', 0.001],
    ['psi', 'MPa', 0.006894757293168],
    ['MPa', 'psi', 1e6 / 6894.757293168],
  ] as const)('%s → %s × %f', (from, to, f) => expect(pressureFactor(from, to)).toBeCloseTo(f, 12));
  it('1 kgf/cm² = 98 066.5 Pa (NIST SP 811 B.8)', () =>
    expect(pressureFactor('kgf/cm²', 'kPa')).toBeCloseTo(98.0665, 12));
});

describe('absolute and gauge pressure units (DESIGN 3.2.1)', () => {
  it.each([
    ['bar', 'bar', false],
    ['bar(a)', 'bar', true],
    ['bara', 'bar', true],
    ['bar abs', 'bar', true],
    ['barg', 'bar', false],
    ['psia', 'psi', true],
    ['psi(g)', 'psi', false],
    ['kPa abs', 'kPa', true],
    ['kPa (a)', 'kPa', true],
    ['MPa absolute', 'MPa', true],
    ['kgf/cm2', 'kgf/cm²', false],
    ['N/mm²', 'N/mm²', false],
  ])('%s → %s, absolute %s', (raw, unit, absolute) => expect(parsePressureUnit(raw)).toEqual({ unit, absolute }));
  it.each(['V', 'a', 'abs', 'gauge', 'mA'])('%s is no pressure unit', (raw) =>
    expect(parsePressureUnit(raw)).toBeNull(),
  );
  it('the standard atmosphere is 101.325 kPa exactly (NIST SP 811, ISO 2533)', () => {
    expect(standardAtmosphere('MPa')).toBeCloseTo(0.101325, 15);
    expect(standardAtmosphere('psi')).toBeCloseTo(14.6959488, 7); // 101325 / 6894.757293168
  });
});

describe('units in the header: brackets and parentheses', () => {
  it.each([
    ['P [MPa]', 'P', 'MPa'],
    ['P (bar)', 'P', 'bar'],
    ['P (bar(a))', 'P', 'bar(a)'],
    ['Pressure (PT-101)', 'Pressure (PT-101)', null],
    ['P [V]', 'P', 'V'],
    ['SG1', 'SG1', null],
  ])('%s → base %s, unit %s', (name, base, unit) => expect(splitUnit(name)).toEqual({ base, unit }));
});

describe('a unitless column far above the test pressure: which unit would fit', () => {
  it.each([
    [34.2, 3.4, 'MPa', 'bar'],
    [3420, 3.4, 'MPa', 'kPa'],
    [493, 3.4, 'MPa', 'psi'],
    [3100, 450, 'psi', 'kPa'],
    [1e9, 3.4, 'MPa', null],
  ] as const)('peak %d at test %d %s → %s', (peak, tp, unit, want) => expect(unitThatFits(peak, tp, unit)).toBe(want));
});
