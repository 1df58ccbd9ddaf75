// The words a person signs (DESIGN 5): shown in the sign-off dialog before signing and stored
// with the signature, built by this one function on both sides so they are the same text. The
// signer is named, not e-mailed: the statement travels with the record to the inspector, and
// the signature row itself links the account.

export interface StatementFacts {
  kind: 'review' | 'release';
  signerName: string;
  testName: string;
  testId: number;
  reductionId: number;
  engineVersion: string | null;
  verdict: string;
  /** the reviewer, for a release */
  reviewerName?: string;
}

/** The statement the signer attests, in full. */
export function signatureStatement(f: StatementFacts): string {
  const who = `I, ${f.signerName},`;
  const what = `reduction ${f.reductionId}${f.engineVersion ? ` (engine ${f.engineVersion})` : ''} of test ${f.testId} "${f.testName}"`;
  if (f.kind === 'review')
    return `${who} have reviewed ${what}, its predicted-versus-measured comparison and every disposition, and sign the engineering review with the verdict ${f.verdict}.`;
  return `${who} release ${what}, reviewed by ${f.reviewerName ?? 'the integrity engineer'}, with the verdict ${f.verdict}. The record is locked from now on.`;
}

/** The stored text: the statement, and the signer's own remark when they added one. */
export function signedText(statement: string, remark: string | undefined): string {
  const r = remark?.trim();
  return r ? `${statement}\nRemark: ${r}` : statement;
}
