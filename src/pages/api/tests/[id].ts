import { getDb } from '../../../db/client.server';
import { listLogs } from '../../../db/queries/logs';
import { findReduction } from '../../../db/queries/reductions';
import { findTestWithVessel } from '../../../db/queries/tests';
import { testPatchBody } from '../../../server/api/schemas';
import { errors } from '../../../server/errors';
import { endpoint, idParam, json, readJson, requirePermission } from '../../../server/http';
import { renameTest } from '../../../server/plans.server';

/** GET /api/tests/{id} — the test's summary. */
export const GET = endpoint(async (ctx) => {
  requirePermission(ctx, 'read');
  const id = idParam(ctx.params.id, 'test');
  const db = getDb();
  const row = await findTestWithVessel(db, id);
  if (!row) throw errors.notFound('test');
  const [logs, reduction] = await Promise.all([
    listLogs(db, id),
    row.test.currentReductionId ? findReduction(db, row.test.currentReductionId) : undefined,
  ]);
  const { plan: _plan, ...test } = row.test;
  return json({
    ...test,
    vessel: row.vessel,
    material: row.material,
    owner: row.owner,
    logCount: logs.length,
    currentReduction: reduction
      ? {
          id: reduction.id,
          status: reduction.status,
          engineVersion: reduction.engineVersion,
          finishedAt: reduction.finishedAt,
        }
      : null,
  });
});

/** PATCH /api/tests/{id} {name} — engineer; 409 once released. */
export const PATCH = endpoint(async (ctx) => {
  const user = requirePermission(ctx, 'plan');
  const id = idParam(ctx.params.id, 'test');
  const body = await readJson(ctx.request, testPatchBody);
  await renameTest(user, id, body.name);
  return json({ id, name: body.name });
});
