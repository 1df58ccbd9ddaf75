// Final verdict with the engineers' dispositions (DESIGN 3.3): the engine flags, people decide.
import type { GaugeResult, ReductionResult, TestVerdict } from './types';

export type DispositionOutcome = 'accepted' | 'excluded' | 'retest';

export interface Disposition {
  /** a gauge id, a rosette grid id (`R1/A`), or a rosette id (`R1`, applies to its grids) */
  gaugeId: string;
  outcome: DispositionOutcome;
  reason: string;
}

export type DispositionedGauge = GaugeResult & { disposition?: Disposition };

/**
 * Apply dispositions (the last one for a gauge wins; a grid's own beats its rosette's):
 * `excluded` sets the outcome to excluded, `accepted` resolves a flag, `retest` leaves it open.
 * The verdict is `conforms` only when no flagged gauge is left without accepted/excluded;
 * `incomplete` stays incomplete.
 */
export function applyDispositions(
  result: Pick<ReductionResult, 'verdict' | 'gauges'>,
  dispositions: readonly Disposition[],
): { verdict: TestVerdict; gauges: DispositionedGauge[] } {
  const byId = new Map<string, Disposition>();
  for (const d of dispositions) byId.set(d.gaugeId, d);
  const gauges = result.gauges.map((g): DispositionedGauge => {
    const slash = g.id.lastIndexOf('/');
    const d = byId.get(g.id) ?? (slash > 0 ? byId.get(g.id.slice(0, slash)) : undefined);
    if (!d) return { ...g };
    return { ...g, outcome: d.outcome === 'excluded' ? 'excluded' : g.outcome, disposition: d };
  });
  if (result.verdict === 'incomplete') return { verdict: 'incomplete', gauges };
  const open = gauges.some((g) => g.outcome === 'flagged' && g.disposition?.outcome !== 'accepted');
  return { verdict: open ? 'flagged' : 'conforms', gauges };
}
