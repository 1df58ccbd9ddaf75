// The e-mail a live warning sends to the test's engineer (DESIGN 8): plain words, the test, the
// gauge, the pressure, what to check, a link, and the caution that the test director decides.
import type { Test } from '../db/schema';
import { getConfig } from '../config.server';

/** What each warning code means and what to look at first. */
const ADVICE: Record<string, { what: string; check: string }> = {
  'trend-outside-band': {
    what: 'the loading holds so far give a strain-per-pressure slope outside the tolerance band',
    check:
      'check the gauge factor and channel mapping of this gauge, its bond and wiring, and whether it sits nearer a nozzle, support or thickness change than planned.',
  },
  'hold-creep': {
    what: 'the strain kept changing during a hold while the pressure stayed in its band',
    check:
      'check for a leak or temperature change, for a gauge or bond that is creeping, and whether the wall is yielding locally.',
  },
  'zero-drift': {
    what: 'the channel moved before pressure was applied',
    check: 'check the bridge completion, lead wires and temperature of this gauge before loading further.',
  },
  'near-yield': {
    what: 'the measured trend, projected to test pressure, comes near the yield strength of the material',
    check:
      'compare the measured strain with the prediction and the material certificate before the pressure is raised further.',
  },
};

const fmt = (x: unknown) => (typeof x === 'number' && Number.isFinite(x) ? Number(x.toPrecision(4)).toString() : '—');

export function liveWarningMail(
  test: Test,
  engineerName: string,
  data: Record<string, unknown>,
): { subject: string; text: string } {
  const code = String(data.code ?? 'warning');
  const gauge = String(data.gaugeId ?? '?');
  const advice = ADVICE[code] ?? { what: 'the live reduction raised a warning', check: 'check this gauge.' };
  const plan = test.plan as { units?: string } | null;
  const unit = plan?.units === 'US' ? 'psi' : 'MPa';
  const link = new URL(`/tests/${test.id}/logs`, getConfig().PUBLIC_BASE_URL).toString();
  return {
    subject: `Live warning on "${test.name}": gauge ${gauge} (${code})`,
    text: [
      `Hello ${engineerName},`,
      '',
      `During the live hydrostatic test "${test.name}", gauge ${gauge} raised the warning "${code}" at ${fmt(data.pressure)} ${unit}: ${advice.what}.`,
      data.message ? `The reduction says: ${String(data.message)}` : '',
      '',
      `What to check: ${advice.check}`,
      '',
      `Watch the test live: ${link}`,
      '',
      'This warning is sent once per gauge and kind for this live session. It comes from a provisional reduction of the data so far and may change as the test goes on.',
      'The test director decides whether to hold or depressurise, following the written test procedure; a pressurised vessel stores energy, so keep clear of it while you check. The governing code, the jurisdiction and the responsible licensed professionals decide on acceptance.',
    ]
      .filter((l, i, all) => l !== '' || all[i - 1] !== '')
      .join('\n'),
  };
}
