import { z } from 'zod';
import { getDb } from '../../../../db/client.server';
import { insertApiToken, listApiTokens } from '../../../../db/queries/users';
import { auditBy } from '../../../../server/audit.server';
import { API_TOKEN_PREFIX, hashToken, newToken } from '../../../../server/auth/tokens.server';
import { endpoint, json, readJson, requireUser } from '../../../../server/http';

/** GET /api/account/tokens — the caller's own API tokens (never the tokens themselves). */
export const GET = endpoint(async (ctx) => {
  const user = requireUser(ctx);
  return json({ items: await listApiTokens(getDb(), user.id) });
});

const createBody = z.object({
  name: z.string().trim().min(1, 'give the token a name, e.g. the DAQ PC it lives on').max(120),
});

/** POST /api/account/tokens — create a token; its value is in this answer only. */
export const POST = endpoint(async (ctx) => {
  const user = requireUser(ctx);
  const { name } = await readJson(ctx.request, createBody);
  const token = newToken(API_TOKEN_PREFIX);
  const id = await insertApiToken(getDb(), {
    userId: user.id,
    name,
    tokenHash: hashToken(token),
    prefix: token.slice(0, 10),
  });
  await auditBy(user, 'api-token-created', null, { tokenId: id, name });
  return json({ id, name, token, prefix: token.slice(0, 10) }, 201);
});
