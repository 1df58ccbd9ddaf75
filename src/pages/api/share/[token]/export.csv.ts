import { csvResponse } from '../../../../server/exports.server';
import { loadTestRecord } from '../../../../server/record.server';
import { shareGet } from '../../../../server/share-endpoint';

export const { GET, ALL } = shareGet('export.csv', async (link) =>
  csvResponse(await loadTestRecord(link.testId), true),
);
