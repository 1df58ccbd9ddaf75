// The live panel's props for a test's page: the plan's grids and tolerance, or null when the plan
// is not valid (the Plan page reports that).
import { livePlanView, type LivePlanView } from '../lib/live-grids';
import { parsePlan } from '../lib/reduction/plan';

export function livePanelProps(test: { plan: unknown; status: string }): LivePlanView | null {
  try {
    return livePlanView(parsePlan(test.plan));
  } catch {
    return null;
  }
}
