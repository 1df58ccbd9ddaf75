import { describe, expect, it } from 'vitest';
import { createHash } from 'node:crypto';
import { GENESIS_HASH, auditRowContent, auditRowHash, type ChainedContent } from './audit-chain';

const row: ChainedContent = {
  chainKey: 4,
  seq: 1,
  at: new Date('2026-12-02T07:04:05.123Z'),
  userId: 2,
  actor: 'engineer@example.com',
  action: 'review-signed',
  testId: 4,
  details: { reductionId: 17, verdict: 'conforms' },
};

describe('the audit hash chain', () => {
  it('hashes SHA-256 of the previous hash, a newline and the row\u2019s canonical content', () => {
    const content = auditRowContent(row);
    expect(content).toBe(
      '{"action":"review-signed","actor":"engineer@example.com","at":"2026-12-02T07:04:05.123Z","chain":4,"details":{"reductionId":17,"verdict":"conforms"},"seq":1,"testId":4,"userId":2,"v":1}',
    );
    expect(auditRowHash(GENESIS_HASH, row)).toBe(
      createHash('sha256').update(`${GENESIS_HASH}\n${content}`).digest('hex'),
    );
  });

  it('changes with any field, with the place in the chain, and with the previous hash', () => {
    const h = auditRowHash(GENESIS_HASH, row);
    const variants: Partial<ChainedContent>[] = [
      { actor: 'admin@example.com' },
      { action: 'test-released' },
      { details: { reductionId: 18, verdict: 'conforms' } },
      { at: new Date(row.at.getTime() + 1) },
      { seq: 2 },
      { chainKey: 5 },
      { userId: null },
    ];
    for (const v of variants) expect(auditRowHash(GENESIS_HASH, { ...row, ...v }), JSON.stringify(v)).not.toBe(h);
    expect(auditRowHash('f'.repeat(64), row)).not.toBe(h);
    // the order in which details were built does not matter
    expect(auditRowHash(GENESIS_HASH, { ...row, details: { verdict: 'conforms', reductionId: 17 } })).toBe(h);
  });
});
