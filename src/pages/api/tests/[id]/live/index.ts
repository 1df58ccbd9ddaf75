import { endpoint, idParam, json, requirePermission } from '../../../../../server/http';
import { openLiveSession } from '../../../../../server/live.server';

/** POST /api/tests/{id}/live — technician+ (token scope `upload`): open a live session → 201 {sessionId}. */
export const POST = endpoint(async (ctx) => {
  const user = requirePermission(ctx, 'upload', { tokenWrite: 'upload' });
  const testId = idParam(ctx.params.id, 'test');
  const sessionId = await openLiveSession(user, testId);
  return json({ sessionId }, 201, { location: `/api/tests/${testId}/live/${sessionId}` });
});
