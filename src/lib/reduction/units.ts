// Unit conversions with exact factors (NIST SP 811, appendix B.8).

/** 1 psi in pascal, exact by definition of the pound-force and the inch. */
export const PSI_IN_PA = 6894.757293168;
export const MM_PER_IN = 25.4;
export const PA_PER_MPA = 1e6;
export const PA_PER_BAR = 1e5;

export function psiToMPa(psi: number): number {
  return (psi * PSI_IN_PA) / PA_PER_MPA;
}
export function mpaToPsi(mpa: number): number {
  return (mpa * PA_PER_MPA) / PSI_IN_PA;
}
export function inToMm(inch: number): number {
  return inch * MM_PER_IN;
}
export function mmToIn(mm: number): number {
  return mm / MM_PER_IN;
}
export function barToMPa(bar: number): number {
  return (bar * PA_PER_BAR) / PA_PER_MPA;
}

export type PlanUnits = 'SI' | 'US';
export type PlanPressureUnit = 'MPa' | 'psi';

export function planPressureUnit(units: PlanUnits): PlanPressureUnit {
  return units === 'US' ? 'psi' : 'MPa';
}
export function planLengthUnit(units: PlanUnits): 'mm' | 'in' {
  return units === 'US' ? 'in' : 'mm';
}

/** The standard atmosphere, 101.325 kPa exactly (NIST SP 811, ISO 2533), in pascal. */
export const STANDARD_ATMOSPHERE_PA = 101325;

/**
 * Pressure units accepted after a log's pressure column, in brackets or parentheses: lower-case
 * spelling without spaces → canonical name and value in pascal (NIST SP 811 appendix B.8). A Map,
 * so a header's `[constructor]` is no unit rather than an Object key.
 */
const PRESSURE_UNITS = new Map<string, { name: string; pa: number }>([
  ['pa', { name: 'Pa', pa: 1 }],
  ['hpa', { name: 'hPa', pa: 1e2 }],
  ['kpa', { name: 'kPa', pa: 1e3 }],
  ['mpa', { name: 'MPa', pa: 1e6 }],
  ['n/mm2', { name: 'N/mm²', pa: 1e6 }],
  ['n/mm²', { name: 'N/mm²', pa: 1e6 }],
  ['mbar', { name: 'mbar', pa: 1e2 }],
  ['bar', { name: 'bar', pa: 1e5 }],
  ['psi', { name: 'psi', pa: PSI_IN_PA }],
  ['ksi', { name: 'ksi', pa: PSI_IN_PA * 1000 }],
  // kilogram-force per square centimetre = 9.80665 × 10⁴ Pa exactly (standard gravity)
  ['kgf/cm2', { name: 'kgf/cm²', pa: 98066.5 }],
  ['kgf/cm²', { name: 'kgf/cm²', pa: 98066.5 }],
  ['kg/cm2', { name: 'kgf/cm²', pa: 98066.5 }],
  ['kg/cm²', { name: 'kgf/cm²', pa: 98066.5 }],
]);

/** A pressure unit as read from a header: canonical name, and whether it is absolute pressure. */
export interface PressureUnitSpec {
  unit: string;
  absolute: boolean;
}

const ABSOLUTE_MARK = /(?:\((?:a|abs|absolute)\)|abs|absolute)$/;
const GAUGE_MARK = /(?:\((?:g|gauge|gage)\)|gauge|gage)$/;

/**
 * `bar(g)`, `psig`, `MPA` → gauge bar, psi, MPa; `bar(a)`, `bara`, `psia`, `kPa abs` → absolute.
 * Null when it is not a pressure unit.
 */
export function parsePressureUnit(raw: string): PressureUnitSpec | null {
  let u = raw
    .trim()
    .toLowerCase()
    .replace(/\s+/g, '')
    .replace(/[,_-]+(?=(?:a|abs|absolute|g|gauge|gage)$)/, '');
  let absolute = false;
  if (ABSOLUTE_MARK.test(u)) {
    absolute = true;
    u = u.replace(ABSOLUTE_MARK, '');
  } else if (GAUGE_MARK.test(u)) u = u.replace(GAUGE_MARK, '');
  const known = PRESSURE_UNITS.get(u);
  if (known) return { unit: known.name, absolute };
  // a trailing a or g written without a mark: bara, psia, kpaa; barg, psig
  const last = u.slice(-1);
  const base = PRESSURE_UNITS.get(u.slice(0, -1));
  if (base && !absolute && (last === 'a' || last === 'g')) return { unit: base.name, absolute: last === 'a' };
  return null;
}

/** Canonical spelling of a pressure unit (`bar(g)`, `psig`, `MPA` → `bar`, `psi`, `MPa`), or null. */
export function normalizePressureUnit(raw: string): string | null {
  return parsePressureUnit(raw)?.unit ?? null;
}

/** A canonical unit's value in pascal. */
function pascalOf(unit: string): number | undefined {
  return PRESSURE_UNITS.get(unit.toLowerCase())?.pa;
}

/** Factor that turns a value in `from` (a canonical unit from normalizePressureUnit) into `to`. */
export function pressureFactor(from: string, to: string): number {
  const f = pascalOf(from);
  const t = pascalOf(to);
  if (f === undefined || t === undefined) throw new Error(`unknown pressure unit ${from} or ${to}`);
  return f / t;
}

/** The standard atmosphere in a canonical pressure unit. */
export function standardAtmosphere(unit: string): number {
  return STANDARD_ATMOSPHERE_PA / (pascalOf(unit) ?? NaN);
}

/** Units a unitless pressure column may really be in, when its values are far above the plan unit's (largest first). */
const SMALLER_UNIT_CANDIDATES = ['bar', 'psi', 'kgf/cm²', 'kPa', 'mbar', 'Pa'] as const;

/**
 * The unit that makes `peak` (read in the plan's unit) closest to the test pressure, among units
 * smaller than the plan's; null when none brings it within a factor of two.
 */
export function unitThatFits(peak: number, testPressure: number, planUnit: PlanPressureUnit): string | null {
  let best: { unit: string; miss: number } | null = null;
  for (const unit of SMALLER_UNIT_CANDIDATES) {
    const f = pressureFactor(unit, planUnit);
    if (f >= 1) continue;
    const miss = Math.abs(Math.log((peak * f) / testPressure));
    if (miss < Math.LN2 && (!best || miss < best.miss)) best = { unit, miss };
  }
  return best?.unit ?? null;
}
