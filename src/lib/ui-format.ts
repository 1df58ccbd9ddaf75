// Number formatting for the review screens: one place decides digits, the minus sign and unit
// labels, so a table, a caption and a tooltip show the same value the same way. Pure; no React.

export type UnitSystem = 'SI' | 'US';
export type PressureUnit = 'MPa' | 'psi';

/** Typographic minus (U+2212): a hyphen next to a number reads as a dash on a test-bay screen. */
const MINUS = '\u2212';
export const DASH = '—';

/** Unit labels of a plan's unit system (DESIGN 4.1: SI MPa + mm, US psi + in). */
export function getUnitLabels(units: UnitSystem) {
  const pressure: PressureUnit = units === 'US' ? 'psi' : 'MPa';
  return {
    pressure,
    stress: pressure,
    length: units === 'US' ? 'in' : 'mm',
    slope: `µε/${pressure}`,
    strain: 'µε',
  } as const;
}

/** The slope unit for a pressure unit: microstrain per pressure unit. */
export function formatSlopeUnit(pressureUnit: PressureUnit): string {
  return `µε/${pressureUnit}`;
}

function isNumber(v: number | null | undefined): v is number {
  return typeof v === 'number' && Number.isFinite(v);
}

/** Fixed decimals with a true minus sign; '—' for null, undefined, NaN or ±Infinity. */
export function formatFixed(v: number | null | undefined, digits: number): string {
  if (!isNumber(v)) return DASH;
  const s = Math.abs(v).toFixed(digits);
  // −0.0 reads as a value below zero: show it as 0.0
  return v < 0 && Number(s) !== 0 ? MINUS + s : s;
}

/** Significant figures without exponent notation for 0.001 ≤ |v| < 1e7 (slopes in µε/psi are small). */
export function formatSignificant(v: number | null | undefined, figures = 4): string {
  if (!isNumber(v)) return DASH;
  if (v === 0) return '0';
  const magnitude = Math.floor(Math.log10(Math.abs(v)));
  const digits = Math.max(0, Math.min(6, figures - 1 - magnitude));
  return formatFixed(v, digits);
}

/** Same as formatFixed with an explicit plus sign for positive values (deviations, shifts). */
export function formatSigned(v: number | null | undefined, digits: number): string {
  if (!isNumber(v)) return DASH;
  const s = formatFixed(v, digits);
  return v > 0 && Number(Math.abs(v).toFixed(digits)) !== 0 ? '+' + s : s;
}

/** Microstrain with one decimal: `−12.3 µε`. */
export function formatMicrostrain(v: number | null | undefined, digits = 1): string {
  return isNumber(v) ? `${formatFixed(v, digits)} µε` : DASH;
}

/** Significant figures of every strain-per-pressure slope: screens, the PDF and the CSV. */
export const SLOPE_FIGURES = 4;

/** A strain-per-pressure slope with 4 significant figures and its unit: `237.0 µε/MPa`, `1.634 µε/psi`. */
export function formatSlope(v: number | null | undefined, pressureUnit: PressureUnit, withUnit = true): string {
  if (!isNumber(v)) return DASH;
  const s = formatSignificant(v, SLOPE_FIGURES);
  return withUnit ? `${s} ${formatSlopeUnit(pressureUnit)}` : s;
}

/** A fraction as a percentage: 0.052 → `5.2 %` (signed: `+5.2 %`). */
export function formatPercent(fraction: number | null | undefined, digits = 1, signed = false): string {
  if (!isNumber(fraction)) return DASH;
  const pct = fraction * 100;
  return `${signed ? formatSigned(pct, digits) : formatFixed(pct, digits)} %`;
}

/** Measured over predicted ratio with three decimals: `1.024`. */
export function formatRatio(v: number | null | undefined): string {
  return formatFixed(v, 3);
}

/** R² with four decimals: the default limit 0.995 needs the fourth to be readable. */
export function formatRSquared(v: number | null | undefined): string {
  return formatFixed(v, 4);
}

/** Pressure with digits fitted to the unit: `3.40 MPa`, `493 psi`. */
export function formatPressure(v: number | null | undefined, unit: PressureUnit): string {
  if (!isNumber(v)) return DASH;
  return `${formatFixed(v, unit === 'psi' ? 0 : 2)} ${unit}`;
}

/** Stress in the plan's stress unit: `189.6 MPa`, `27490 psi`. */
export function formatStress(v: number | null | undefined, unit: PressureUnit): string {
  if (!isNumber(v)) return DASH;
  return `${formatFixed(v, unit === 'psi' ? 0 : 1)} ${unit}`;
}

/** An angle in degrees: `90°`, `−7.0°` with `digits`. */
export function formatAngle(deg: number | null | undefined, digits = 0): string {
  return isNumber(deg) ? `${formatFixed(deg, digits)}°` : DASH;
}

/** A closed interval `lo – hi` with the same formatter on both ends. */
export function formatInterval(
  range: readonly [number, number] | null | undefined,
  format: (v: number) => string,
): string {
  if (!range || !isNumber(range[0]) || !isNumber(range[1])) return DASH;
  return `${format(range[0])} – ${format(range[1])}`;
}

/** A moment as every screen shows it: `2026-12-03 14:04 UTC` (the PDF and the CSV write the same). */
export function formatUtc(at: Date | string): string {
  const d = typeof at === 'string' ? new Date(at) : at;
  return Number.isNaN(d.getTime()) ? DASH : `${d.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}
