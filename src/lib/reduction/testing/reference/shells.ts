// Elastic shells under internal pressure, written from the textbooks (REFERENCES.md "Elastic
// shells"). Independent of the engine: nothing here imports src/lib/reduction. Units: any
// consistent set (MPa and mm); strains dimensionless unless named µε.

export interface Stresses {
  hoop: number;
  axial: number;
  radial: number;
}

/** Roark 7th ed. Table 13.1 (from memory): thin cylinder, σh = p r/t, σa = p r/(2t) closed, 0 open. */
export function thinCylinder(p: number, rMean: number, t: number, closed: boolean): Stresses {
  return { hoop: (p * rMean) / t, axial: closed ? (p * rMean) / (2 * t) : 0, radial: 0 };
}

/** Roark Table 13.1 (from memory): thin sphere, σ = p r/(2t) in every tangential direction. */
export function thinSphere(p: number, rMean: number, t: number): Stresses {
  const s = (p * rMean) / (2 * t);
  return { hoop: s, axial: s, radial: 0 };
}

/**
 * Timoshenko, Strength of Materials II (from memory): Lamé thick cylinder, inner radius a, outer b,
 * at radius r. A = p a²/(b² − a²): σθ = A(1 + b²/r²), σr = A(1 − b²/r²), σz = A closed, 0 open.
 */
export function lameCylinder(p: number, a: number, b: number, r: number, closed: boolean): Stresses {
  const A = (p * a * a) / (b * b - a * a);
  return { hoop: A * (1 + (b * b) / (r * r)), radial: A * (1 - (b * b) / (r * r)), axial: closed ? A : 0 };
}

/** Thick sphere (Timoshenko, from memory): B = p a³/(b³ − a³), σt = B(1 + b³/(2r³)), σr = B(1 − b³/r³). */
export function lameSphere(p: number, a: number, b: number, r: number): Stresses {
  const B = (p * a ** 3) / (b ** 3 - a ** 3);
  const t = B * (1 + b ** 3 / (2 * r ** 3));
  return { hoop: t, axial: t, radial: B * (1 - b ** 3 / r ** 3) };
}

/** Generalised Hooke's law for the three normal strains. */
export function hooke(s: Stresses, E: number, nu: number): { hoop: number; axial: number; radial: number } {
  return {
    hoop: (s.hoop - nu * (s.axial + s.radial)) / E,
    axial: (s.axial - nu * (s.hoop + s.radial)) / E,
    radial: (s.radial - nu * (s.hoop + s.axial)) / E,
  };
}

export interface Vessel {
  shape: 'cylinder' | 'sphere';
  closed: boolean;
  /** inside diameter and wall */
  D: number;
  t: number;
  E: number;
  nu: number;
}

/** Outer-surface strains per unit pressure in µε (Lamé), the surface where gauges are bonded. */
export function lameOuterMicrostrainPerPressure(v: Vessel): { hoop: number; axial: number } {
  const a = v.D / 2,
    b = a + v.t;
  const s = v.shape === 'sphere' ? lameSphere(1, a, b, b) : lameCylinder(1, a, b, b, v.closed);
  const e = hooke(s, v.E, v.nu);
  return { hoop: e.hoop * 1e6, axial: (v.shape === 'sphere' ? e.hoop : e.axial) * 1e6 };
}

/** Membrane strains per unit pressure in µε with the mean radius. */
export function membraneMicrostrainPerPressure(v: Vessel): { hoop: number; axial: number } {
  const r = v.D / 2 + v.t / 2;
  const s = v.shape === 'sphere' ? thinSphere(1, r, v.t) : thinCylinder(1, r, v.t, v.closed);
  const e = hooke(s, v.E, v.nu);
  return { hoop: e.hoop * 1e6, axial: e.axial * 1e6 };
}

/** Normal strain along θ from the axis for principal strains along the axis and the hoop. */
export function strainAlong(axial: number, hoop: number, thetaDeg: number): number {
  const th = (thetaDeg * Math.PI) / 180;
  return axial * Math.cos(th) ** 2 + hoop * Math.sin(th) ** 2;
}

/** von Mises of three normal stresses (principal for a pressure vessel's wall). */
export function vonMises(s: Stresses): number {
  return Math.sqrt(0.5 * ((s.hoop - s.axial) ** 2 + (s.axial - s.radial) ** 2 + (s.radial - s.hoop) ** 2));
}
