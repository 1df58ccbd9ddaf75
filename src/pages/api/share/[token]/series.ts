import { getDb } from '../../../../db/client.server';
import { findReduction } from '../../../../db/queries/reductions';
import { findTest } from '../../../../db/queries/tests';
import { json } from '../../../../server/http';
import { readSeries } from '../../../../server/series.server';
import { shareGet } from '../../../../server/share-endpoint';

export const { GET, ALL } = shareGet('series', async (link, ctx) => {
  const test = await findTest(getDb(), link.testId);
  const reduction = test?.currentReductionId ? await findReduction(getDb(), test.currentReductionId) : undefined;
  return json(await readSeries(reduction?.seriesKey ?? null, ctx.url));
});
