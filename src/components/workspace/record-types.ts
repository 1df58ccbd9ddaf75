// The record as the API's /record and /share endpoints serialise it (src/server/record.server.ts recordView).
import type { GaugeResult, ReductionResult, TestVerdict } from '../../lib/reduction/types';
import type { StoredGauge, StoredResult } from '../../lib/reduction/compat';
import type { Plan } from '../../lib/reduction/plan';
import { normalizeResult } from '../../lib/reduction/compat';

export interface RecordDisposition {
  gaugeId: string;
  outcome: 'accepted' | 'excluded' | 'retest';
  reason: string;
  by: string;
  at: string;
}
type GaugeDisposition = {
  disposition?: { gaugeId: string; outcome: 'accepted' | 'excluded' | 'retest'; reason: string };
};
/** A gauge as the review shows it: the current engine's fields (normalizeResult fills older results). */
export type RecordGauge = GaugeResult & GaugeDisposition;
/** A stored result of any engine version, with dispositions applied: read it through normalizeRecordResult. */
export type StoredRecordResult = Omit<StoredResult, 'gauges' | 'verdict'> & {
  gauges: (StoredGauge & GaugeDisposition)[];
  verdict: TestVerdict;
};
export type RecordResult = Omit<ReductionResult, 'gauges' | 'verdict'> & {
  gauges: RecordGauge[];
  verdict: TestVerdict;
};

export interface RecordView {
  test: {
    id: number;
    name: string;
    status: 'draft' | 'logging' | 'reduced' | 'reviewed' | 'released';
    verdict: TestVerdict | null;
  };
  vessel: { id: number; tag: string; name: string };
  plan: Plan | null;
  reduction: {
    id: number;
    status: string;
    progress: number;
    engineVersion: string | null;
    finishedAt: string | null;
    error: string | null;
  } | null;
  result: StoredRecordResult | null;
  dispositions: RecordDisposition[];
  signatures: {
    kind: 'review' | 'release';
    name: string;
    /** left out of the inspector's view */
    email?: string;
    at: string;
    reductionId: number;
    statement: string;
  }[];
  logs: { id: number; filename: string; sha256: string }[];
  openFlags: string[];
}

/** The record's result in the current engine's shape, dispositions kept (older results are filled in). */
export function normalizeRecordResult(result: StoredRecordResult, plan: Plan): RecordResult {
  const n = normalizeResult(result, {
    yieldStrength: plan.material.yieldStrength,
    yieldFraction: plan.tolerances.yieldFraction,
    slopeBand: plan.tolerances.slopeBand,
  });
  return {
    ...n,
    verdict: result.verdict,
    gauges: n.gauges.map((g, i) => ({ ...g, disposition: result.gauges[i]?.disposition })),
  };
}
