// The record as the API's /record and /share endpoints serialise it (src/server/record.server.ts recordView).
import type { GaugeResult, ReductionResult, TestVerdict } from '../../lib/reduction/types';
import type { Plan } from '../../lib/reduction/plan';

export interface RecordDisposition {
  gaugeId: string;
  outcome: 'accepted' | 'excluded' | 'retest';
  reason: string;
  by: string;
  at: string;
}
export type RecordGauge = GaugeResult & {
  disposition?: { gaugeId: string; outcome: 'accepted' | 'excluded' | 'retest'; reason: string };
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
  result: (Omit<ReductionResult, 'gauges' | 'verdict'> & { gauges: RecordGauge[]; verdict: TestVerdict }) | null;
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
