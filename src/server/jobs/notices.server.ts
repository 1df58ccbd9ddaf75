// E-mail notices after a reduction: the engineer who owns the test hears when it finishes or
// fails. The worker also drains the outbox, so mail queued while SMTP was down goes out later.
import { getDb } from '../../db/client.server';
import { findTest } from '../../db/queries/tests';
import { findUserById } from '../../db/queries/users';
import { getConfig } from '../../config.server';
import { queueMail } from '../outbox.server';
import type { JobHooks } from './reduction-job.server';
import { VERDICT_LABEL, VERDICT_MEANING, VERDICT_SCOPE } from '../../lib/verdict-words';

export const reductionNotices: JobHooks = {
  async onFinished(job, outcome, detail) {
    const db = getDb();
    const test = await findTest(db, job.testId);
    const owner = test?.ownerId ? await findUserById(db, test.ownerId) : undefined;
    if (!test || !owner || owner.disabled) return;
    const link = `${getConfig().PUBLIC_BASE_URL.replace(/\/$/, '')}/tests/${test.id}/review`;
    if (outcome === 'done') {
      const flagged = detail.result?.gauges.filter((g) => g.outcome === 'flagged').map((g) => g.id) ?? [];
      const verdict = detail.result?.verdict;
      const verdictLines = verdict
        ? `Strain comparison verdict before dispositions: ${VERDICT_LABEL[verdict]}.\n${VERDICT_MEANING[verdict]}\n`
        : '';
      await queueMail(
        owner.email,
        `Hoopline: reduction of "${test.name}" finished — strain comparison ${verdict ? VERDICT_LABEL[verdict].toLowerCase() : 'done'}`,
        `The reduction ${job.id} of "${test.name}" has finished.\n${verdictLines}${flagged.length ? `Flagged gauges: ${flagged.join(', ')}.` : 'No gauge is flagged.'}\n\n${VERDICT_SCOPE}\n\nReview it: ${link}\n\n— Hoopline`,
        test.id,
      );
    } else {
      await queueMail(
        owner.email,
        `Hoopline: reduction of "${test.name}" failed`,
        `The reduction ${job.id} of "${test.name}" failed:\n${detail.error}\n\nSee: ${link}\n\n— Hoopline`,
        test.id,
      );
    }
  },
};
