import { endpoint, idParam, json, requirePermission } from '../../../../server/http';
import { releaseTest } from '../../../../server/review.server';

/** POST /api/tests/{id}/release — QA releases a reviewed test; it is locked from then on. */
export const POST = endpoint(async (ctx) => {
  const user = requirePermission(ctx, 'release');
  return json(await releaseTest(user, idParam(ctx.params.id, 'test')), 201);
});
