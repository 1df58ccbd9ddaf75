import { seriesResponse } from '../../../../server/series.server';
import { shareGet } from '../../../../server/share-endpoint';

export const { GET, ALL } = shareGet('series', async (link, ctx) =>
  seriesResponse(ctx.request, ctx.url, link.testId, { shareLink: true }),
);
