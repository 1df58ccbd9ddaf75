// What the live panel needs of a plan: each grid's id (as the live hold events name it), its
// predicted slope and what it measures, the test pressure, the comparison tolerance and the unit.
import type { Plan } from './reduction/plan';
import { predictForPlan } from './reduction/shell';
import type { PressureUnit } from './ui-format';

export interface LivePlanView {
  grids: { id: string; predictedSlope: number; label: string }[];
  testPressure: number;
  slopeBand: number;
  pressureUnit: PressureUnit;
}

function directionWords(angleDeg: number): string {
  const a = ((angleDeg % 180) + 180) % 180;
  if (Math.abs(a) < 0.5) return 'axial (0°)';
  if (Math.abs(a - 90) < 0.5) return 'hoop (90°)';
  return `${Number(a.toFixed(1))}° from the axis`;
}

export function livePlanView(plan: Plan): LivePlanView {
  const { gauges } = predictForPlan(plan);
  return {
    grids: gauges.map((g) => ({ id: g.id, predictedSlope: g.predictedSlope, label: directionWords(g.angleDeg) })),
    testPressure: plan.testPressure,
    slopeBand: plan.tolerances.slopeBand,
    pressureUnit: plan.units === 'US' ? 'psi' : 'MPa',
  };
}
