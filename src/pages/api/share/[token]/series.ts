import { json } from '../../../../server/http';
import { seriesKeyOf } from '../../../../server/record.server';
import { readSeries } from '../../../../server/series.server';
import { shareGet } from '../../../../server/share-endpoint';

export const { GET, ALL } = shareGet('series', async (link, ctx) =>
  json(await readSeries(await seriesKeyOf(link.testId), ctx.url)),
);
