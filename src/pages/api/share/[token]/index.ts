import { json } from '../../../../server/http';
import { loadTestRecord, recordView } from '../../../../server/record.server';
import { shareGet } from '../../../../server/share-endpoint';

/** GET /api/share/{token} — the shared test's record, read-only. */
export const { GET, ALL } = shareGet('record', async (link) => {
  const view = recordView(await loadTestRecord(link.testId));
  return json({ ...view, link: { expiresAt: link.expiresAt } });
});
