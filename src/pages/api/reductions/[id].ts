import { getDb } from '../../../db/client.server';
import { findReduction } from '../../../db/queries/reductions';
import { errors } from '../../../server/errors';
import { endpoint, idParam, json, requirePermission } from '../../../server/http';

/** GET /api/reductions/{id} — status, progress 0–1, error, and the result (DESIGN 4.2) when done. */
export const GET = endpoint(async (ctx) => {
  requirePermission(ctx, 'read');
  const r = await findReduction(getDb(), idParam(ctx.params.id, 'reduction'));
  if (!r) throw errors.notFound('reduction');
  return json({
    id: r.id,
    testId: r.testId,
    status: r.status,
    progress: r.progress,
    attempts: r.attempts,
    error: r.error,
    superseded: r.superseded,
    engineVersion: r.engineVersion,
    logIds: r.parameters.logIds,
    createdAt: r.createdAt,
    startedAt: r.startedAt,
    finishedAt: r.finishedAt,
    result: r.status === 'done' ? r.result : null,
  });
});
