// The words a person signs (DESIGN 5): shown in the sign-off dialog before signing and stored
// with the signature, built by this one function on both sides so they are the same text. The
// signer is named, not e-mailed: the statement travels with the record to the inspector, and
// the signature row itself links the account.

import type { Plan, PlanProcedure } from './reduction/plan';
import { RELEASE_SCOPE, VERDICT_SCOPE, verdictLabel } from './verdict-words';

/** How the test was conducted, from the plan (each optional). */
export interface ProcedureFacts {
  procedureReference?: string;
  codeEdition?: string;
  testMedium?: string;
  testTemperature?: string;
  witness?: string;
}

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
  procedure?: ProcedureFacts;
}

/**
 * The conduct facts in their fixed order, as every output names them: the pages' label, the PDF's
 * short one (a narrow column) and the CSV key.
 */
export const CONDUCT_FIELDS: readonly { key: keyof ProcedureFacts; label: string; short: string; csv: string }[] = [
  {
    key: 'procedureReference',
    label: 'Written test procedure',
    short: 'Written procedure',
    csv: 'procedure_reference',
  },
  { key: 'codeEdition', label: 'Governing code and edition', short: 'Governing code', csv: 'code_edition' },
  { key: 'testMedium', label: 'Test medium', short: 'Test medium', csv: 'test_medium' },
  {
    key: 'testTemperature',
    label: 'Metal temperature during the test',
    short: 'Metal temperature',
    csv: 'test_temperature',
  },
  { key: 'witness', label: 'Witness', short: 'Witness', csv: 'witness' },
];

/** A temperature as recorded: `15 °C`, `59 °F` (no float noise). */
export function formatTemperature(value: number, units: Plan['units']): string {
  return `${Number(value.toPrecision(6))} ${units === 'US' ? '°F' : '°C'}`;
}

/** The plan's test conduct (its `procedure` block) as the statements and the report name it. */
export function procedureFacts(
  plan: { units: Plan['units']; procedure?: Partial<PlanProcedure> } | null | undefined,
): ProcedureFacts {
  const p = plan?.procedure;
  if (!p) return {};
  return {
    procedureReference: p.reference,
    codeEdition: p.codeEdition,
    testMedium: p.testMedium,
    testTemperature: p.testTemperature === undefined ? undefined : formatTemperature(p.testTemperature, plan.units),
    witness: p.witness,
  };
}

/** The test's conduct facts the signer relies on, when the plan gives them. */
function procedureSentence(p: ProcedureFacts | undefined): string {
  if (!p) return '';
  const parts = [
    p.procedureReference && `written test procedure ${p.procedureReference}`,
    p.codeEdition && `governing code ${p.codeEdition}`,
    p.testMedium && `test medium ${p.testMedium}`,
    p.testTemperature && `metal temperature ${p.testTemperature}`,
    p.witness && `witnessed by ${p.witness}`,
  ].filter(Boolean);
  return parts.length
    ? ` The test is recorded as conducted under: ${parts.join('; ')}.`
    : ' The plan does not record the written test procedure, the governing code, the test medium, the temperature or the witness.';
}

/** The statement the signer attests, in full: what was checked, the verdict in words, and what it is not. */
export function signatureStatement(f: StatementFacts): string {
  const who = `I, ${f.signerName},`;
  const what = `reduction ${f.reductionId}${f.engineVersion ? ` (engine ${f.engineVersion})` : ''} of test ${f.testId} "${f.testName}"`;
  const verdict = `strain comparison verdict: ${verdictLabel(f.verdict)}`;
  const procedure = procedureSentence(f.procedure);
  if (f.kind === 'review')
    return (
      `${who} have reviewed ${what}: the plan's vessel, material and gauge installation as recorded, the comparison ` +
      `of measured strain with the elastic prediction, and the disposition and reason of every flagged gauge. ` +
      `I sign the engineering review with the ${verdict}.${procedure} ${VERDICT_SCOPE}`
    );
  return (
    `${who} release the strain record of ${what}, reviewed by ${f.reviewerName ?? 'the integrity engineer'}, ` +
    `with the ${verdict}. The record is locked from now on.${procedure} ${RELEASE_SCOPE}`
  );
}

/** The stored text: the statement, and the signer's own remark when they added one. */
export function signedText(statement: string, remark: string | undefined): string {
  const r = remark?.trim();
  return r ? `${statement}\nRemark: ${r}` : statement;
}
