// The version of a test's record as the report shows it: a digest of everything in the report —
// test, status, plan, vessel, material, reduction and result, dispositions, signatures — but not
// the time of rendering. A new reduction, a disposition, a signature or a release gives a new
// version; reading the record again does not. Reports are rendered once per version.
import { createHash } from 'node:crypto';
import type { ReportInput } from './report-input';

/** Bump when the PDF's layout changes, so stored reports of the old layout are not served. */
export const REPORT_LAYOUT = 'pdf-2';

export function recordVersion(input: ReportInput): string {
  const { generatedAt: _generatedAt, ...content } = input;
  return createHash('sha256').update(REPORT_LAYOUT).update(JSON.stringify(content)).digest('base64url').slice(0, 22);
}
