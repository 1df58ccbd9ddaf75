import { endpoint, idParam, requirePermission } from '../../../../../server/http';
import { liveEventStream } from '../../../../../server/live-events.server';
import { loadTest } from '../../../../../server/plans.server';

/** GET /api/tests/{id}/live/events — every signed-in role (token scope `read`): Server-Sent Events. */
export const GET = endpoint(async (ctx) => {
  requirePermission(ctx, 'read');
  const test = await loadTest(idParam(ctx.params.id, 'test'));
  return liveEventStream(test.id, ctx.request);
});
