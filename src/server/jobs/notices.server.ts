// E-mail notices after a reduction (issue: review and release). Placeholder hooks object that
// the worker passes to runNextReduction; filled in with the outbox.
import type { JobHooks } from './reduction-job.server';

export const reductionNotices: JobHooks = {};
