import { useEffect, useState } from 'react';
import { api } from '../api';

const STEPS = ['draft', 'logging', 'reduced', 'reviewed', 'released'] as const;
type Status = (typeof STEPS)[number];
const EVENT = 'hoopline:test-changed';

/** Ask every status display on the page to re-read the test (after an upload, reduction or signature). */
export function announceTestChanged(testId: number): void {
  window.dispatchEvent(new CustomEvent(EVENT, { detail: { testId } }));
}

/** The test's status as steps; follows changes made by the islands on the same page. */
export default function TestStatusSteps({ testId, initial }: { testId: number; initial: Status }) {
  const [status, setStatus] = useState<Status>(initial);
  useEffect(() => {
    const onChange = (e: Event) => {
      if ((e as CustomEvent<{ testId: number }>).detail?.testId !== testId) return;
      void api<{ status: Status }>(`/api/tests/${testId}`)
        .then((t) => setStatus(t.status))
        .catch(() => undefined);
    };
    window.addEventListener(EVENT, onChange);
    return () => window.removeEventListener(EVENT, onChange);
  }, [testId]);
  const at = STEPS.indexOf(status);
  return (
    <ol
      className="mt-3 flex flex-wrap items-center gap-1 text-xs font-semibold tracking-wide uppercase"
      aria-label="Test status"
    >
      {STEPS.map((s, i) => (
        <li
          key={s}
          aria-current={i === at ? 'step' : undefined}
          className={`flex items-center gap-1 rounded px-2 py-1 ${i < at ? 'bg-ink-100 text-ink-800' : i === at ? 'bg-ink-800 text-white' : 'border border-dashed border-ink-800/30 text-ink-700'}`}
        >
          <span aria-hidden="true">{i < at ? '✓' : i === at ? '●' : '○'}</span>
          {s}
        </li>
      ))}
    </ol>
  );
}
