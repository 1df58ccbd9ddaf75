import { endpoint, idParam, json, requirePermission } from '../../../../../../server/http';
import { finishLiveSession } from '../../../../../../server/live.server';

/**
 * POST /api/tests/{id}/live/{sessionId}/finish — technician+ (token scope `upload`): the chunks
 * become one stored log and a reduction is queued → 201 {logId, reductionId}; again → 200.
 */
export const POST = endpoint(async (ctx) => {
  const user = requirePermission(ctx, 'upload', { tokenWrite: 'upload' });
  const { status, logId, reductionId } = await finishLiveSession(
    user,
    idParam(ctx.params.id, 'test'),
    idParam(ctx.params.sessionId, 'live session'),
  );
  return json({ logId, reductionId }, status, { location: `/api/reductions/${reductionId}` });
});
