import { endpoint, idParam, json, requirePermission } from '../../../../server/http';
import { signReview } from '../../../../server/review.server';

/** POST /api/tests/{id}/review — the engineer signs the engineering review. */
export const POST = endpoint(async (ctx) => {
  const user = requirePermission(ctx, 'review');
  return json(await signReview(user, idParam(ctx.params.id, 'test')), 201);
});
