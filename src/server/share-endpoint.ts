// The inspector's link endpoints: read-only. Every method but GET answers 405.
import type { APIContext, APIRoute } from 'astro';
import { AppError } from './errors';
import { endpoint } from './http';
import { useShareLink } from './share.server';
import type { ShareLink } from '../db/schema';

export function shareGet(
  what: string,
  handler: (link: ShareLink, ctx: APIContext) => Promise<Response>,
): { GET: APIRoute; ALL: APIRoute } {
  return {
    GET: endpoint(async (ctx) => handler(await useShareLink(ctx.params.token, what), ctx)),
    ALL: endpoint(async () => {
      throw new AppError('method-not-allowed');
    }),
  };
}
