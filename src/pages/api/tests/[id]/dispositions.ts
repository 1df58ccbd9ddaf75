import { z } from 'zod';
import { dispositionOutcomes } from '../../../../lib/domain';
import { endpoint, idParam, json, readJson, requirePermission } from '../../../../server/http';
import { loadTestRecord, recordView } from '../../../../server/record.server';
import { dispositionGauge } from '../../../../server/review.server';

/** GET /api/tests/{id}/dispositions — every disposition of the current reduction (history). */
export const GET = endpoint(async (ctx) => {
  requirePermission(ctx, 'read');
  const r = await loadTestRecord(idParam(ctx.params.id, 'test'));
  return json({ latest: recordView(r).dispositions, history: r.dispositionHistory });
});

const body = z.object({
  gaugeId: z.string().trim().min(1).max(64),
  outcome: z.enum(dispositionOutcomes),
  reason: z.string().trim().min(3, 'is required: say why (at least a few words)').max(4000),
});

/** POST /api/tests/{id}/dispositions {gaugeId, outcome, reason} — engineer. */
export const POST = endpoint(async (ctx) => {
  const user = requirePermission(ctx, 'disposition');
  const d = await readJson(ctx.request, body);
  return json(await dispositionGauge(user, idParam(ctx.params.id, 'test'), d), 201);
});
