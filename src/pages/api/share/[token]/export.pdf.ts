import { pdfResponse } from '../../../../server/exports.server';
import { loadTestRecord } from '../../../../server/record.server';
import { shareGet } from '../../../../server/share-endpoint';

export const { GET, ALL } = shareGet('export.pdf', async (link, ctx) =>
  pdfResponse(await loadTestRecord(link.testId), ctx.request, true),
);
