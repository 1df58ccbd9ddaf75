import { getDb } from '../../../../db/client.server';
import { listApiTokens } from '../../../../db/queries/users';
import { createApiToken } from '../../../../server/accounts.server';
import { tokenBody } from '../../../../server/api/schemas';
import { endpoint, json, readJson, requireSessionUser, requireUser } from '../../../../server/http';

/** GET /api/account/tokens — the caller's own API tokens (never the tokens themselves). */
export const GET = endpoint(async (ctx) => {
  const user = requireUser(ctx);
  return json({ items: await listApiTokens(getDb(), user.id) });
});

/**
 * POST /api/account/tokens {name, scopes?, expiresInDays?} — a token (scopes `read`, `upload`;
 * 90 days unless given, at most 365); its value is in this answer only. A token cannot make tokens.
 */
export const POST = endpoint(async (ctx) => {
  const user = requireSessionUser(ctx);
  const body = await readJson(ctx.request, tokenBody);
  return json(await createApiToken(user, body), 201);
});
