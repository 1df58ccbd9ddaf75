// What a verdict, an outcome and a disposition mean, in the words every screen, the PDF, the CSV
// and the e-mails use. The codes (`conforms`, `retest`, …) stay in tooltips, the CSV and the API;
// people read these words. One module, so the banner and the report can never disagree.

export type VerdictCode = 'conforms' | 'flagged' | 'incomplete';
export type DispositionCode = 'accepted' | 'excluded' | 'retest';

/** The verdict as a word, e.g. on a chip or in a table cell. */
export const VERDICT_LABEL: Record<VerdictCode, string> = {
  conforms: 'Conforms',
  flagged: 'Flagged',
  incomplete: 'Incomplete',
};

/**
 * The verdict sentence. The rule behind `flagged` (README, "Retest"): a gauge outside tolerance
 * keeps the verdict flagged until an engineer accepts or excludes it; a gauge marked for retest
 * also keeps it flagged, but it is a disposition, so it no longer blocks signing the review.
 */
export const VERDICT_MEANING: Record<VerdictCode, string> = {
  conforms:
    'Conforms: the measured strain slopes agree with the elastic prediction within the comparison tolerances, ' +
    'or an engineer has accepted or excluded each gauge that did not.',
  flagged: 'Flagged: gauges outside tolerance, awaiting a disposition, or marked for retest.',
  incomplete:
    'Incomplete: the log has not yet reached the test pressure (within 5 %) and come back to zero; the comparison ' +
    'covers what has been logged so far and is provisional.',
};

/**
 * Said wherever a verdict is shown: the strain comparison is one piece of evidence, not the
 * acceptance of the hydrotest.
 */
export const VERDICT_SCOPE =
  'This verdict compares measured strain with the elastic prediction only. It is not acceptance of the ' +
  'hydrostatic test: holding the test pressure, the leak examination and the authorised inspector’s witness are ' +
  'judged under the governing code.';

/** What releasing the record does, and what it does not. */
export const RELEASE_SCOPE =
  'Releasing locks the strain record as reviewed. Returning the vessel to service is the owner’s and the ' +
  'authorised inspector’s decision under the governing code.';

/** A disposition as words: shown to people; the code goes in a tooltip, the CSV and the API. */
export const DISPOSITION_LABEL: Record<DispositionCode, string> = {
  accepted: 'Accepted by engineer',
  excluded: 'Excluded by engineer',
  retest: 'Marked for retest',
};

/** A gauge outcome as words. */
export const OUTCOME_LABEL: Record<'in-band' | 'flagged' | 'excluded' | 'not-compared', string> = {
  'in-band': 'In band',
  flagged: 'Flagged',
  excluded: 'Excluded',
  'not-compared': 'Not compared',
};

export interface VerdictCounts {
  /** flagged gauges that no engineer has dispositioned yet: these block the review */
  awaiting: number;
  /** flagged gauges an engineer marked for retest: the verdict stays flagged, signing is allowed */
  retest: number;
}

interface GaugeLike {
  outcome: string;
  disposition?: { outcome: string };
}

/** Flagged gauges awaiting a disposition and those marked for retest. */
export function countVerdictGauges(gauges: readonly GaugeLike[]): VerdictCounts {
  let awaiting = 0;
  let retest = 0;
  for (const g of gauges) {
    if (g.outcome !== 'flagged') continue;
    if (!g.disposition) awaiting += 1;
    else if (g.disposition.outcome === 'retest') retest += 1;
  }
  return { awaiting, retest };
}

function gaugesWord(n: number): string {
  return n === 1 ? '1 gauge' : `${n} gauges`;
}

/** What still stands between this verdict and the review, in one sentence (same on every screen). */
export function verdictStanding(verdict: VerdictCode, counts: VerdictCounts): string {
  if (verdict === 'incomplete') return 'The review can be signed once the log is complete.';
  const parts: string[] = [];
  if (counts.awaiting > 0)
    parts.push(
      `${gaugesWord(counts.awaiting)} outside tolerance ${counts.awaiting === 1 ? 'awaits' : 'await'} a disposition before the review can be signed`,
    );
  if (counts.retest > 0)
    parts.push(
      `${gaugesWord(counts.retest)} marked for retest keep${counts.retest === 1 ? 's' : ''} the verdict flagged; the review can still be signed`,
    );
  if (parts.length === 0) return 'No flagged gauge awaits a disposition.';
  return `${parts.join('; ')}.`.replace(/^./, (c) => c.toUpperCase());
}

/** The one name of each shell model, everywhere (plan editor, review, PDF, CSV). */
export const MODEL_NAME: Record<'lame' | 'membrane', string> = {
  lame: 'Lamé thick wall',
  membrane: 'membrane thin wall',
};

/** Where each model's predicted strain applies: said beside the model as the comparison's basis. */
export const MODEL_BASIS: Record<'lame' | 'membrane', string> = {
  lame: 'strain predicted at the outer surface, where the gauges are bonded',
  membrane: 'strain from the mean radius (the hand calculation)',
};

/** The edge zone's size with r defined, wherever 2.5·√(r t) is shown. */
export const EDGE_ZONE_RULE = '2.5·√(r t), r the mean radius and t the wall thickness';

/** Near-yield advice that fits a test in progress and a test already run. */
export const NEAR_YIELD_ADVICE =
  'During the test: do not raise the pressure further, hold or reduce it as the written procedure says, and consult ' +
  'the responsible engineer. After the test: the responsible engineer assesses the wall (local yielding, permanent ' +
  'set) before the record is relied on.';

/** A gauge whose place is not given cannot be checked against the edge zone. */
export const EDGE_ZONE_UNCHECKED =
  'not checked against the edge zone: no distance to a discontinuity and no place on the shell in the plan';

/** A verdict code from anywhere (a stored row, an API answer) in words; an unknown code as it is. */
export function verdictLabel(code: string): string {
  return code in VERDICT_LABEL ? VERDICT_LABEL[code as VerdictCode] : code;
}
