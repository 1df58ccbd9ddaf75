import { endpoint, idParam, json, requirePermission } from '../../../../../../../server/http';
import { receiveChunk } from '../../../../../../../server/live.server';

/**
 * PUT /api/tests/{id}/live/{sessionId}/chunks/{n} — technician+ (token scope `upload`), raw body:
 * 201 {n, bytes, rows} stored; 200 the same bytes again; 409 other bytes or a gap (details.expected).
 */
export const PUT = endpoint(async (ctx) => {
  requirePermission(ctx, 'upload', { tokenWrite: 'upload' });
  const testId = idParam(ctx.params.id, 'test');
  const sessionId = idParam(ctx.params.sessionId, 'live session');
  const n = idParam(ctx.params.n, 'chunk');
  const { status, ...answer } = await receiveChunk(ctx.request, testId, sessionId, n);
  return json(answer, status);
});
