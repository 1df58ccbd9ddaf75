import { CONDUCT_FIELDS, procedureFacts } from '../../lib/signing';
import { formatUtc } from '../../lib/ui-format';
import type { RecordView } from './record-types';

interface Props {
  record: RecordView;
}

/** How the test was conducted, as the plan records it, and what each signer attested, word for word. */
export default function ConductAndSignatures({ record }: Props) {
  const facts = procedureFacts(record.plan);
  const rows = CONDUCT_FIELDS.map((c): [string, string | undefined] => [c.label, facts[c.key]]);
  const current = record.reduction?.id;
  return (
    <section className="card" aria-labelledby="conduct-h">
      <h2 id="conduct-h" className="mb-2 text-lg font-semibold">
        Test conduct
      </h2>
      <dl className="grid gap-x-6 gap-y-1 text-sm sm:grid-cols-2 lg:grid-cols-3">
        {rows.map(([label, value]) => (
          <div key={label}>
            <dt className="text-ink-700">{label}</dt>
            <dd className={value ? '' : 'text-ink-700 italic'}>{value ?? 'not recorded in the plan'}</dd>
          </div>
        ))}
      </dl>
      <h3 className="mt-4 mb-1 text-sm font-semibold">Signed statements</h3>
      {record.signatures.length === 0 ? (
        <p className="text-sm text-ink-700">Not signed yet: no engineering review and no release.</p>
      ) : (
        <ul className="space-y-2 text-sm">
          {record.signatures.map((s, i) => (
            <li key={i}>
              <strong>{s.kind === 'review' ? 'Engineering review' : 'Release of the strain record'}</strong> by {s.name}
              , {formatUtc(s.at)}
              {s.reductionId !== current && (
                <span className="font-semibold text-flag-ink"> (reduction {s.reductionId}, not the current one)</span>
              )}
              <p className="mt-0.5 text-ink-700">{s.statement}</p>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
