import { z } from 'zod';
import { getDb } from '../../../../db/client.server';
import { insertNote, listNotes } from '../../../../db/queries/tests';
import { noteKinds } from '../../../../lib/domain';
import { auditBy } from '../../../../server/audit.server';
import { endpoint, idParam, json, readJson, requirePermission } from '../../../../server/http';
import { loadTest } from '../../../../server/plans.server';

export const GET = endpoint(async (ctx) => {
  requirePermission(ctx, 'read');
  const id = idParam(ctx.params.id, 'test');
  await loadTest(id);
  return json({ items: await listNotes(getDb(), id) });
});

const noteBody = z.object({
  kind: z.enum(noteKinds).default('general'),
  body: z.string().trim().min(1, 'write what happened').max(4000),
});

/** POST /api/tests/{id}/notes — technician+: pressure held, leak seen, gauge re-zeroed… */
export const POST = endpoint(async (ctx) => {
  const user = requirePermission(ctx, 'upload');
  const test = await loadTest(idParam(ctx.params.id, 'test'), true);
  const body = await readJson(ctx.request, noteBody);
  const id = await insertNote(getDb(), { testId: test.id, userId: user.id, ...body });
  await auditBy(user, 'note-added', test.id, { noteId: id, kind: body.kind });
  return json({ id }, 201);
});
