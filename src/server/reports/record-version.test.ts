import { describe, expect, it } from 'vitest';
import { recordVersion } from './record-version';
import { buildReleasedReportInput, buildSiReportInput } from './testing/report-fixture';

describe('recordVersion', () => {
  const base = recordVersion(buildSiReportInput());

  it('is the same for the same record, whenever it is rendered', () => {
    const later = buildSiReportInput();
    later.generatedAt = new Date(later.generatedAt.getTime() + 86_400_000);
    expect(recordVersion(later)).toBe(base);
    expect(base).toMatch(/^[A-Za-z0-9_-]{22}$/);
  });

  it.each([
    [
      'a new reduction',
      (i: ReturnType<typeof buildSiReportInput>) => {
        i.reductionId += 1;
      },
    ],
    [
      'a disposition',
      (i: ReturnType<typeof buildSiReportInput>) => {
        i.dispositions.A1 = { outcome: 'retest', reason: 'lead wire re-soldered', by: 'Ines Okafor', at: new Date(0) };
      },
    ],
    [
      'a signature',
      (i: ReturnType<typeof buildSiReportInput>) => {
        i.signatures.push({ ...i.signatures[0]!, kind: 'release', name: 'Tomas Lindqvist' });
      },
    ],
    [
      'a changed verdict',
      (i: ReturnType<typeof buildSiReportInput>) => {
        i.verdict = 'flagged';
      },
    ],
  ])('changes with %s', (_what, change) => {
    const input = buildSiReportInput();
    change(input);
    expect(recordVersion(input)).not.toBe(base);
  });

  it('changes with the release (status, signatures, DRAFT off)', () => {
    expect(recordVersion(buildReleasedReportInput())).not.toBe(base);
  });
});
