// The audit trail's hash chain: each row stores SHA-256 of the previous row's hash and its own
// canonical content, so a changed, removed or reordered row shows when the chain is checked.
// One chain per test (chain key = test id), chain 0 for events of no test (sign-ins, accounts).
import { createHash } from 'node:crypto';
import { canonicalJson } from '../../lib/canonical-json';

/** The `prev_hash` of the first row of every chain. */
export const GENESIS_HASH = '0'.repeat(64);

export interface ChainedContent {
  chainKey: number;
  seq: number;
  at: Date;
  userId: number | null;
  actor: string;
  action: string;
  testId: number | null;
  details: Record<string, unknown>;
}

/** The text that is hashed for one row (versioned, so the rule can change without ambiguity). */
export function auditRowContent(r: ChainedContent): string {
  return canonicalJson({
    v: 1,
    chain: r.chainKey,
    seq: r.seq,
    at: r.at.toISOString(),
    userId: r.userId,
    actor: r.actor,
    action: r.action,
    testId: r.testId,
    details: r.details,
  });
}

/** SHA-256 (hex) of the previous row's hash and this row's content. */
export function auditRowHash(prevHash: string, r: ChainedContent): string {
  return createHash('sha256')
    .update(`${prevHash}\n${auditRowContent(r)}`, 'utf8')
    .digest('hex');
}
