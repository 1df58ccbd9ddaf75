import { describe, expect, it } from 'vitest';
import { procedureFacts, signatureStatement, signedText } from './signing';

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
    expect(s).toContain(
      'I, Imke Sorensen, have reviewed reduction 17 (engine 1.0.0) of test 4 "AR-102 hydrotest": the plan\'s vessel, material and gauge installation as recorded',
    );
    expect(s).toContain('the disposition and reason of every flagged gauge');
    expect(s).toContain('strain comparison verdict: Conforms.');
    expect(s).toContain('It is not acceptance of the hydrostatic test');
    const r = signatureStatement({
      kind: 'release',
      ...facts,
      signerName: 'Quentin Abara',
      reviewerName: 'Imke Sorensen',
    });
    expect(r).toContain('I, Quentin Abara, release the strain record of reduction 17');
    expect(r).toContain('reviewed by Imke Sorensen');
    expect(r).toContain('locked');
    expect(r).toContain('Returning the vessel to service is the owner’s and the authorised inspector’s decision');
  });

  it('names the written procedure, code edition, medium, temperature and witness when the plan gives them', () => {
    const s = signatureStatement({
      kind: 'review',
      ...facts,
      verdict: 'flagged',
      procedure: { procedureReference: 'HT-PRO-7 rev C', witness: 'A. Inspector', testMedium: 'water' },
    });
    expect(s).toContain('written test procedure HT-PRO-7 rev C; test medium water; witnessed by A. Inspector.');
    expect(s).toContain('verdict: Flagged.');
  });

  it('takes the facts from the plan, with the temperature in the plan\u2019s unit', () => {
    const facts = procedureFacts({
      units: 'US',
      procedure: { reference: 'WP-12 rev 2', codeEdition: 'code X, 2025 edition', testTemperature: 61.5 },
    });
    expect(facts).toEqual({
      procedureReference: 'WP-12 rev 2',
      codeEdition: 'code X, 2025 edition',
      testMedium: undefined,
      testTemperature: '61.5 °F',
      witness: undefined,
    });
    expect(procedureFacts({ units: 'SI', procedure: { testTemperature: 12 } }).testTemperature).toBe('12 °C');
  });

  it('says so when the plan records none of the conduct facts', () => {
    const s = signatureStatement({ kind: 'release', ...facts, procedure: procedureFacts({ units: 'SI' }) });
    expect(s).toContain('The plan does not record the written test procedure');
    expect(signatureStatement({ kind: 'release', ...facts })).not.toContain('does not record');
  });

  it('keeps the signer\u2019s remark after the statement, and nothing when there is none', () => {
    expect(signedText('Statement.', '  checked on site  ')).toBe('Statement.\nRemark: checked on site');
    expect(signedText('Statement.', '   ')).toBe('Statement.');
    expect(signedText('Statement.', undefined)).toBe('Statement.');
  });
});
