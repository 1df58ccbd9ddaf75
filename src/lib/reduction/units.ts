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

/**
 * Pressure units accepted in brackets after a log's pressure column: lower-case spelling → canonical
 * name and value in pascal. A Map, so a header's `[constructor]` is no unit rather than an Object key.
 */
const PRESSURE_UNITS = new Map<string, { name: string; pa: number }>([
  ['pa', { name: 'Pa', pa: 1 }],
  ['kpa', { name: 'kPa', pa: 1e3 }],
  ['mpa', { name: 'MPa', pa: 1e6 }],
  ['mbar', { name: 'mbar', pa: 1e2 }],
  ['bar', { name: 'bar', pa: 1e5 }],
  ['psi', { name: 'psi', pa: PSI_IN_PA }],
  ['ksi', { name: 'ksi', pa: PSI_IN_PA * 1000 }],
]);

/** Canonical spelling of a bracketed pressure unit (`bar(g)`, `psig`, `MPA` → `bar`, `psi`, `MPa`), or null. */
export function normalizePressureUnit(raw: string): string | null {
  let u = raw.trim().toLowerCase().replace(/\s+/g, '');
  u = u.replace(/\((g|gauge|a|abs)\)$/, '').replace(/(gauge|abs)$/, '');
  if (!PRESSURE_UNITS.has(u) && /g$/.test(u) && PRESSURE_UNITS.has(u.slice(0, -1))) u = u.slice(0, -1);
  return PRESSURE_UNITS.get(u)?.name ?? null;
}

/** Factor that turns a value in `from` (a canonical unit from normalizePressureUnit) into `to`. */
export function pressureFactor(from: string, to: string): number {
  const f = PRESSURE_UNITS.get(from.toLowerCase())?.pa;
  const t = PRESSURE_UNITS.get(to.toLowerCase())?.pa;
  if (f === undefined || t === undefined) throw new Error(`unknown pressure unit ${from} or ${to}`);
  return f / t;
}
