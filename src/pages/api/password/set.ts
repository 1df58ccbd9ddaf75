import { passwordSetBody } from '../../../server/api/schemas';
import { setPasswordWithLink } from '../../../server/accounts.server';
import { endpoint, json, readJson } from '../../../server/http';

/** POST /api/password/set {token, password} — the holder of a one-time link chooses the account's password. */
export const POST = endpoint(async (ctx) => {
  const { token, password } = await readJson(ctx.request, passwordSetBody);
  return json(await setPasswordWithLink(token, password));
});
