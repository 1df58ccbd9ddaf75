import { getDb } from '../../../../db/client.server';
import { listShareLinks } from '../../../../db/queries/review';
import { endpoint, idParam, json, readJson, requirePermission } from '../../../../server/http';
import { loadTest } from '../../../../server/plans.server';
import { shareLinkBody } from '../../../../server/api/schemas';
import { createShareLink } from '../../../../server/share.server';

/** GET /api/tests/{id}/share-links — qa. */
export const GET = endpoint(async (ctx) => {
  requirePermission(ctx, 'share');
  const id = idParam(ctx.params.id, 'test');
  await loadTest(id);
  return json({ items: await listShareLinks(getDb(), id) });
});

/** POST /api/tests/{id}/share-links {email?, expiresInDays?} — qa; allowed on a released test. */
export const POST = endpoint(async (ctx) => {
  const user = requirePermission(ctx, 'share');
  const body = await readJson(ctx.request, shareLinkBody);
  const link = await createShareLink(user, idParam(ctx.params.id, 'test'), body);
  return json(link, 201);
});
