import { endpoint, idParam, json, readJson, requireSessionUser } from '../../../../server/http';
import { signReview } from '../../../../server/review.server';
import { signatureBody } from '../../../../server/api/schemas';

/**
 * POST /api/tests/{id}/review {reductionId, password, statement?, shownStatement?} — the engineer signs the
 * engineering review in person: a browser session and their password; an API token never signs.
 */
export const POST = endpoint(async (ctx) => {
  const user = requireSessionUser(ctx, 'review');
  const body = await readJson(ctx.request, signatureBody);
  return json(await signReview(user, idParam(ctx.params.id, 'test'), body), 201);
});
