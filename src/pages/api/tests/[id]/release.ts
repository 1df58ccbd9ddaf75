import { endpoint, idParam, json, requireRole } from '../../../../server/http';
import { releaseTest } from '../../../../server/review.server';

/** POST /api/tests/{id}/release — QA releases a reviewed test; it is locked from then on. */
export const POST = endpoint(async (ctx) => {
  const user = requireRole(ctx, 'qa');
  return json(await releaseTest(user, idParam(ctx.params.id, 'test')), 201);
});
