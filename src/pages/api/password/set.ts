import { z } from 'zod';
import { setPasswordWithLink } from '../../../server/accounts.server';
import { endpoint, json, readJson } from '../../../server/http';

const body = z.object({ token: z.string().min(20).max(100), password: z.string().min(1).max(1024) });

/** POST /api/password/set {token, password} — the holder of a one-time link chooses the account's password. */
export const POST = endpoint(async (ctx) => {
  const { token, password } = await readJson(ctx.request, body);
  return json(await setPasswordWithLink(token, password));
});
