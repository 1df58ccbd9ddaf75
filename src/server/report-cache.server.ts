// The PDF report is rendered once per record version (reports/record-version.ts) and kept: in
// this server's memory and in object storage, so every app server shares it. A share-link
// reader who reloads the report costs a few database reads, never a render.
import { LRUCache } from 'lru-cache';
import { logger } from './observability/logger.server';
import { reportRenders } from './observability/metrics.server';
import { getObjectBytesIfExists, putObject } from './storage.server';

interface RenderJob {
  testId: number;
  render: () => Promise<Uint8Array>;
}

const reports = new LRUCache<string, Uint8Array, RenderJob>({
  maxSize: 64 * 1024 * 1024,
  sizeCalculation: (b) => Math.max(1, b.byteLength),
  // concurrent readers of one version share a single lookup and render
  fetchMethod: async (version, _stale, { context }) => {
    const key = `reports/tests/${context.testId}/${version}.pdf`;
    const stored = await getObjectBytesIfExists(key).catch((err: unknown) => {
      logger().warn({ err, key }, 'stored report could not be read; rendering it here');
      return null;
    });
    if (stored) return stored;
    const pdf = await context.render();
    reportRenders.inc();
    await putObject(key, pdf, 'application/pdf').catch((err: unknown) =>
      logger().warn({ err, key }, 'rendered report could not be stored; kept in memory only'),
    );
    return pdf;
  },
});

/** The report PDF of this record version: from memory, from object storage, or rendered once. */
export async function cachedReportPdf(testId: number, version: string, render: () => Promise<Uint8Array>) {
  const pdf = await reports.fetch(version, { context: { testId, render } });
  if (!pdf) throw new Error(`report ${version} could not be produced`);
  return pdf;
}
