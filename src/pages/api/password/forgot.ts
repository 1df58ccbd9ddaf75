import { passwordForgotBody } from '../../../server/api/schemas';
import { requestPasswordReset } from '../../../server/accounts.server';
import { endpoint, json, readJson } from '../../../server/http';

/** POST /api/password/forgot {email} — anyone: a reset link goes to that address if it has an account; 202 either way. */
export const POST = endpoint(async (ctx) => {
  const { email } = await readJson(ctx.request, passwordForgotBody);
  await requestPasswordReset(email);
  return json({ accepted: true }, 202);
});
