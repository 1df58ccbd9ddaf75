import { json } from '../../../../server/http';
import { loadTestRecord, shareRecordView } from '../../../../server/record.server';
import { shareGet } from '../../../../server/share-endpoint';

/** GET /api/share/{token} — the shared test's record, read-only, without staff e-mail addresses. */
export const { GET, ALL } = shareGet('record', async (link) => {
  const view = shareRecordView(await loadTestRecord(link.testId));
  return json({ ...view, link: { expiresAt: link.expiresAt } });
});
