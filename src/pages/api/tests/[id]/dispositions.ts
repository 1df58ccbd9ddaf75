import { dispositionBody } from '../../../../server/api/schemas';
import { endpoint, idParam, json, readJson, requirePermission } from '../../../../server/http';
import { loadTestRecord, recordView } from '../../../../server/record.server';
import { dispositionGauge } from '../../../../server/review.server';

/** GET /api/tests/{id}/dispositions — every disposition of the current reduction (history). */
export const GET = endpoint(async (ctx) => {
  requirePermission(ctx, 'read');
  const r = await loadTestRecord(idParam(ctx.params.id, 'test'));
  return json({ latest: recordView(r).dispositions, history: r.dispositionHistory });
});

/** POST /api/tests/{id}/dispositions {gaugeId, outcome, reason} — engineer. */
export const POST = endpoint(async (ctx) => {
  const user = requirePermission(ctx, 'disposition');
  const d = await readJson(ctx.request, dispositionBody);
  return json(await dispositionGauge(user, idParam(ctx.params.id, 'test'), d), 201);
});
