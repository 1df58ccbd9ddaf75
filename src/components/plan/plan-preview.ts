// The live preview's numbers: the engine's predictForPlan on the plan being typed. A gauge row
// with a problem is left out (and named) instead of blanking the whole preview, so the shell
// prediction keeps updating while the gauge table is half filled in. Pure.
import {
  gridBudget,
  listPlanIssues,
  parsePlan,
  planGridSetups,
  predictForPlan,
  shellInputFromPlan,
  type BudgetEntry,
  type PlannedGrid,
  type PredictedBlock,
} from '../../lib/reduction/browser';
import { formatFixed } from '../../lib/ui-format';
import { formatNumberForInput, type PlanDraft } from './plan-draft';
import { parseIssuePath } from './plan-fields';

export interface PlanPreview {
  predicted: PredictedBlock;
  grids: PlannedGrid[];
  model: 'lame' | 'membrane';
  testPressure: number;
  /** ids (or row numbers) of gauges left out because their row has a problem */
  omittedGauges: string[];
  /** per grid id: 2 u_c of the predicted slope and the input that contributes most (DESIGN 3.4) */
  uncertainty: Record<string, { predictedU95: number; dominant: BudgetEntry | null }>;
}

const PLACEHOLDER_CHANNEL = '\u0000preview';
const PLACEHOLDER_GAUGE = { id: '\u0000preview', kind: 'uniaxial', channels: [PLACEHOLDER_CHANNEL], angleDeg: 90 };

/** Predictions for the plan as typed, or null while the vessel, material or test pressure is incomplete. */
export function buildPlanPreview(plan: PlanDraft): PlanPreview | null {
  const issues = listPlanIssues(plan);
  const badGauges = new Set<number>();
  const dropSections = new Set<string>();
  for (const i of issues) {
    const path = parseIssuePath(i.path);
    if (path[0] === 'gauges' && typeof path[1] === 'number') badGauges.add(path[1]);
    else if (path[0] === 'columns' || path[0] === 'tolerances' || path[0] === 'holdDetection')
      dropSections.add(path[0]);
    else if (path[0] === 'gauges') dropSections.add('gauges');
  }
  const gauges = Array.isArray(plan.gauges) ? (plan.gauges as unknown[]) : [];
  const kept = dropSections.has('gauges') ? [] : gauges.filter((_, i) => !badGauges.has(i));
  const omittedGauges = gauges
    .map((g, i) => ({ g, i }))
    .filter(({ i }) => dropSections.has('gauges') || badGauges.has(i))
    .map(({ g, i }) => {
      const id = (g as { id?: unknown } | null)?.id;
      return typeof id === 'string' && id.trim() ? id : `row ${i + 1}`;
    });
  const candidate: PlanDraft = { ...plan, gauges: kept.length ? kept : [PLACEHOLDER_GAUGE] };
  if (dropSections.has('columns')) candidate.columns = { pressure: '\u0000pressure' };
  if (dropSections.has('tolerances')) delete candidate.tolerances;
  if (dropSections.has('holdDetection')) delete candidate.holdDetection;
  let parsed;
  try {
    parsed = parsePlan(candidate);
  } catch {
    return null;
  }
  const { predicted, gauges: grids } = predictForPlan(parsed);
  const model = predicted[parsed.model];
  const setups = planGridSetups(parsed, grids, model);
  const shell = shellInputFromPlan(parsed);
  const uncertainty = Object.fromEntries(
    setups.map((s) => {
      const b = gridBudget(parsed, shell, s, setups, model);
      return [s.grid.id, { predictedU95: b.predictedU95, dominant: b.budget[0] ?? null }];
    }),
  );
  return {
    uncertainty,
    predicted,
    grids: grids
      .filter((g) => g.gaugeId !== PLACEHOLDER_GAUGE.id)
      .map((g) => ({ ...g, distanceTo: g.distanceTo && shortenNumbers(g.distanceTo) })),
    model: parsed.model,
    testPressure: parsed.testPressure,
    omittedGauges,
  };
}

/** Long numbers in the engine's labels ("head seam at 165.35433070866142") shown as an input shows them. */
export function shortenNumbers(text: string): string {
  return text.replace(/-?\d+\.\d{5,}/g, (n) => formatNumberForInput(Number(n)));
}

/** "800 mm to support Saddle W", or "30.00 in (given in the plan)"; null when the distance is unknown. */
export function describeDistance(
  g: Pick<PlannedGrid, 'distanceToDiscontinuity' | 'distanceTo'>,
  units: 'SI' | 'US',
): string | null {
  if (g.distanceToDiscontinuity === null) return null;
  const d = `${formatFixed(g.distanceToDiscontinuity, units === 'US' ? 2 : 0)} ${units === 'US' ? 'in' : 'mm'}`;
  if (!g.distanceTo || g.distanceTo === 'given in the plan') return `${d} (given in the plan)`;
  return `${d} to ${g.distanceTo}`;
}
