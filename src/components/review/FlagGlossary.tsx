import type { FlagCode } from '../../lib/reduction/types';
import { FLAG_CODES, FLAG_GLOSSARY } from './flag-glossary';

interface Props {
  /** only these codes (e.g. the flags present in this test); all by default */
  codes?: FlagCode[];
  heading?: string;
}

/** What each flag means, what usually causes it and the usual next step. */
export default function FlagGlossary({ codes, heading = 'What the flags mean' }: Props) {
  const shown = FLAG_CODES.filter((c) => !codes || codes.includes(c));
  return (
    <section className="card" aria-labelledby="flag-glossary-heading">
      <h2 id="flag-glossary-heading" className="text-lg font-semibold text-ink-900">
        {heading}
      </h2>
      <dl className="mt-3 divide-y divide-ink-800/10">
        {shown.map((code) => {
          const f = FLAG_GLOSSARY[code];
          return (
            <div key={code} id={`flag-${code}`} className="scroll-mt-20 py-3">
              <dt className="flex flex-wrap items-baseline gap-2">
                <span className="text-sm font-semibold text-ink-900">{f.title}</span>
                <span className="text-xs text-ink-700">
                  code <span className="font-mono">{code}</span> in the CSV and the API
                </span>
                {f.safety && <span className="rounded bg-flag px-1.5 text-xs font-bold text-white">⚠ safety</span>}
              </dt>
              <dd className="mt-1 text-sm text-ink-900">
                <p>{f.meaning}</p>
                <p className="mt-1">
                  <span className="font-medium">Usual causes:</span> {f.causes.join('; ')}.
                </p>
                <p className="mt-1">
                  <span className="font-medium">Next:</span> {f.next}
                </p>
              </dd>
            </div>
          );
        })}
      </dl>
    </section>
  );
}
