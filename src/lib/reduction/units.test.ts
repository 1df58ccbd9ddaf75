import { describe, expect, it } from 'vitest';
import {
  PSI_IN_PA,
  psiToMPa,
  mpaToPsi,
  inToMm,
  mmToIn,
  barToMPa,
  normalizePressureUnit,
  pressureFactor,
} from './units';

describe('units — NIST SP 811 appendix B.8 [read] (REFERENCES.md)', () => {
  it('1 psi = 6894.757293168 Pa exactly', () => expect(PSI_IN_PA).toBe(6894.757293168));
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
});
