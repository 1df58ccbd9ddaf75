import { z } from 'zod';
import { requestPasswordReset } from '../../../server/accounts.server';
import { endpoint, json, readJson } from '../../../server/http';

const body = z.object({ email: z.string().trim().min(3).max(254) });

/** POST /api/password/forgot {email} — anyone: a reset link goes to that address if it has an account; 202 either way. */
export const POST = endpoint(async (ctx) => {
  const { email } = await readJson(ctx.request, body);
  await requestPasswordReset(email);
  return json({ accepted: true }, 202);
});
