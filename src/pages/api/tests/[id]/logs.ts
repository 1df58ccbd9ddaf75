import { getDb } from '../../../../db/client.server';
import { listLogs } from '../../../../db/queries/logs';
import { endpoint, idParam, json, requirePermission } from '../../../../server/http';
import { loadTest, validatePlan } from '../../../../server/plans.server';
import { receiveLogUpload } from '../../../../server/logs.server';

/** GET /api/tests/{id}/logs — the test's logs with size, rows, time span, sha256 and header preview. */
export const GET = endpoint(async (ctx) => {
  requirePermission(ctx, 'read');
  const id = idParam(ctx.params.id, 'test');
  await loadTest(id);
  return json({ items: await listLogs(getDb(), id) });
});

/** POST /api/tests/{id}/logs — technician+; multipart `file` or raw text/csv. 201 new, 200 same bytes again. */
export const POST = endpoint(async (ctx) => {
  const user = requirePermission(ctx, 'upload', { tokenWrite: 'upload' });
  const test = await loadTest(idParam(ctx.params.id, 'test'), true);
  const plan = validatePlan(test.plan);
  const { log, created } = await receiveLogUpload(ctx.request, test, plan, user);
  return json(
    {
      id: log.id,
      sha256: log.sha256,
      rows: log.rows,
      sizeBytes: log.sizeBytes,
      timeStart: log.timeStart,
      timeEnd: log.timeEnd,
      existing: !created,
    },
    created ? 201 : 200,
  );
});
