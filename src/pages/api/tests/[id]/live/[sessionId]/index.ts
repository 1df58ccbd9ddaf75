import { endpoint, idParam, requirePermission } from '../../../../../../server/http';
import { abandonLiveSession } from '../../../../../../server/live.server';

/** DELETE /api/tests/{id}/live/{sessionId} — technician+ (token scope `upload`): abandon, chunks deleted → 204. */
export const DELETE = endpoint(async (ctx) => {
  const user = requirePermission(ctx, 'upload', { tokenWrite: 'upload' });
  await abandonLiveSession(user, idParam(ctx.params.id, 'test'), idParam(ctx.params.sessionId, 'live session'));
  return new Response(null, { status: 204 });
});
