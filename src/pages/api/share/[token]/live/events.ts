import { liveEventStream } from '../../../../../server/live-events.server';
import { shareGet } from '../../../../../server/share-endpoint';

/** GET /api/share/{token}/live/events — the inspector's link: the test's live events (410 expired or revoked). */
export const { GET, ALL } = shareGet('live events', (link, ctx) => liveEventStream(link.testId, ctx.request));
