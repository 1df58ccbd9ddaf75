import { getDb } from '../../../../db/client.server';
import { listNotes } from '../../../../db/queries/tests';
import { noteBody } from '../../../../server/api/schemas';
import { endpoint, idParam, json, readJson, requirePermission } from '../../../../server/http';
import { loadTest } from '../../../../server/plans.server';
import { addTestNote } from '../../../../server/reductions.server';

export const GET = endpoint(async (ctx) => {
  requirePermission(ctx, 'read');
  const id = idParam(ctx.params.id, 'test');
  await loadTest(id);
  return json({ items: await listNotes(getDb(), id) });
});

/** POST /api/tests/{id}/notes — technician+: pressure held, leak seen, gauge re-zeroed… */
export const POST = endpoint(async (ctx) => {
  const user = requirePermission(ctx, 'upload');
  const id = idParam(ctx.params.id, 'test');
  const body = await readJson(ctx.request, noteBody);
  return json({ id: await addTestNote(user, id, body) }, 201);
});
