// Plans used by the engine's tests and reusable by integration tests and the demo seed.
import { parsePlan, type Plan, type PlanInput } from '../plan';

/** DESIGN 4.1's example vessel with two hoop, two axial gauges and two rosettes. */
export const demoPlanInput: PlanInput = {
  units: 'SI',
  vessel: { shape: 'cylinder', ends: 'closed', insideDiameter: 1800, wallThickness: 16, length: 6000 },
  material: { name: 'carbon steel, generic', elasticModulus: 200000, poissonRatio: 0.3, yieldStrength: 260 },
  model: 'lame',
  testPressure: 3.4,
  columns: { time: 'time_s', pressure: 'P [MPa]' },
  gauges: [
    { id: 'H1', kind: 'uniaxial', channels: ['SG1'], angleDeg: 90, distanceToDiscontinuity: 1500 },
    { id: 'H2', kind: 'uniaxial', channels: ['SG2'], angleDeg: 90, axialPosition: 3000, clockDeg: 90 },
    { id: 'A1', kind: 'uniaxial', channels: ['SG3'], angleDeg: 0, distanceToDiscontinuity: 1500 },
    { id: 'A2', kind: 'uniaxial', channels: ['SG7'], angleDeg: 0, axialPosition: 2000, clockDeg: 270 },
    {
      id: 'R1',
      kind: 'rosette-rectangular',
      channels: ['SG4', 'SG5', 'SG6'],
      angleDeg: 0,
      distanceToDiscontinuity: 1500,
    },
    {
      id: 'R2',
      kind: 'rosette-delta',
      channels: ['SG8', 'SG9', 'SG10'],
      angleDeg: 30,
      axialPosition: 4000,
      clockDeg: 180,
    },
  ],
};

export function demoPlan(overrides: Partial<PlanInput> = {}): Plan {
  return parsePlan({ ...demoPlanInput, ...overrides });
}
