import { describe, expect, it } from 'vitest';
import { signatureStatement, signedText } from './signing';

const facts = {
  signerName: 'Imke Sorensen',
  testName: 'AR-102 hydrotest',
  testId: 4,
  reductionId: 17,
  engineVersion: '1.0.0',
  verdict: 'conforms',
};

describe('the signed statement', () => {
  it('names the signer, the test and the exact reduction, and the verdict', () => {
    const s = signatureStatement({ kind: 'review', ...facts });
    expect(s).toBe(
      'I, Imke Sorensen, have reviewed reduction 17 (engine 1.0.0) of test 4 "AR-102 hydrotest", its predicted-versus-measured comparison and every disposition, and sign the engineering review with the verdict conforms.',
    );
    const r = signatureStatement({
      kind: 'release',
      ...facts,
      signerName: 'Quentin Abara',
      reviewerName: 'Imke Sorensen',
    });
    expect(r).toContain('I, Quentin Abara, release reduction 17');
    expect(r).toContain('reviewed by Imke Sorensen');
    expect(r).toContain('locked');
  });

  it('keeps the signer\u2019s remark after the statement, and nothing when there is none', () => {
    expect(signedText('Statement.', '  checked on site  ')).toBe('Statement.\nRemark: checked on site');
    expect(signedText('Statement.', '   ')).toBe('Statement.');
    expect(signedText('Statement.', undefined)).toBe('Statement.');
  });
});
