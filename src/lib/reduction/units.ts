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

/** Pressure units accepted in brackets after a log's pressure column, in pascal. */
const PRESSURE_UNIT_PA: Record<string, number> = {
  pa: 1,
  kpa: 1e3,
  mpa: 1e6,
  mbar: 1e2,
  bar: 1e5,
  psi: PSI_IN_PA,
  ksi: PSI_IN_PA * 1000,
};

/** Canonical spelling of a bracketed pressure unit (`bar(g)`, `psig`, `MPA` → `bar`, `psi`, `MPa`), or null. */
export function normalizePressureUnit(raw: string): string | null {
  let u = raw.trim().toLowerCase().replace(/\s+/g, '');
  u = u.replace(/\((g|gauge|a|abs)\)$/, '').replace(/(gauge|abs)$/, '');
  if (!(u in PRESSURE_UNIT_PA) && /g$/.test(u) && u.slice(0, -1) in PRESSURE_UNIT_PA) u = u.slice(0, -1);
  if (!(u in PRESSURE_UNIT_PA)) return null;
  return { pa: 'Pa', kpa: 'kPa', mpa: 'MPa', mbar: 'mbar', bar: 'bar', psi: 'psi', ksi: 'ksi' }[u]!;
}

/** Factor that turns a value in `from` (a canonical unit from normalizePressureUnit) into `to`. */
export function pressureFactor(from: string, to: string): number {
  const f = PRESSURE_UNIT_PA[from.toLowerCase()];
  const t = PRESSURE_UNIT_PA[to.toLowerCase()];
  if (f === undefined || t === undefined) throw new Error(`unknown pressure unit ${from} or ${to}`);
  return f / t;
}
