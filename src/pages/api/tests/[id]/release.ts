import { endpoint, idParam, json, readJson, requireSessionUser } from '../../../../server/http';
import { releaseTest } from '../../../../server/review.server';
import { signatureBody } from '../../../../server/api/schemas';

/**
 * POST /api/tests/{id}/release {reductionId, password, statement?, shownStatement?} — QA releases a reviewed test
 * in person (session and password, never a token); it is locked and its record frozen from then on.
 */
export const POST = endpoint(async (ctx) => {
  const user = requireSessionUser(ctx, 'release');
  const body = await readJson(ctx.request, signatureBody);
  return json(await releaseTest(user, idParam(ctx.params.id, 'test'), body), 201);
});
