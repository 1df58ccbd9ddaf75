// The inspector's view: summary, verdict, gauge table, exports. No control that writes.
interface Props {
  view: {
    test: { id: number; name: string; status: string; verdict: string | null };
    vessel: { tag: string; name: string };
    plan: { units: 'SI' | 'US'; testPressure: number } | null;
    result: { gauges: { id: string; channel: string; angleDeg: number; predictedSlope: number; measuredSlope: number | null; ratio: number | null; rSquared: number | null; flags: string[]; outcome: string; disposition?: { outcome: string; reason: string } }[]; pressureUnit: string } | null;
    signatures: { kind: string; name: string; at: string; reductionId: number }[];
  };
  apiBase: string;
}

const fmt = (v: number | null | undefined, d = 2) => (v === null || v === undefined || !Number.isFinite(v) ? '—' : v.toFixed(d));

export default function ShareRecordView({ view, apiBase }: Props) {
  const unit = view.result?.pressureUnit ?? (view.plan?.units === 'US' ? 'psi' : 'MPa');
  return (
    <div className="space-y-6">
      <div>
        <h1 className="text-2xl font-bold">{view.test.name}</h1>
        <p className="text-ink-700">{view.vessel.tag} — {view.vessel.name} · status {view.test.status}{view.test.status !== 'released' && ' (DRAFT: not released)'}</p>
      </div>
      <p className="rounded-md border-l-4 border-caution bg-brass-100 p-3 text-sm">A hydrotest stores energy. This record supports, and does not replace, the judgement of the responsible engineer and the authorised inspector; follow the test procedure and the governing code.</p>
      <section className="card">
        <h2 className="mb-2 text-lg font-semibold">Verdict: {view.test.verdict ?? 'not reduced yet'}</h2>
        <div className="flex gap-3">
          <a className="btn-secondary" href={`${apiBase}/export.csv`}>Download CSV summary</a>
          <a className="btn-secondary" href={`${apiBase}/export.pdf`}>Open PDF report</a>
        </div>
      </section>
      {view.result && (
        <section className="card overflow-x-auto">
          <h2 className="mb-3 text-lg font-semibold">Gauges</h2>
          <table className="table-base">
            <thead><tr><th scope="col">Gauge</th><th scope="col">Channel</th><th scope="col">Angle °</th><th scope="col">Predicted µε/{unit}</th><th scope="col">Measured µε/{unit}</th><th scope="col">Ratio</th><th scope="col">R²</th><th scope="col">Flags</th><th scope="col">Outcome</th><th scope="col">Disposition</th></tr></thead>
            <tbody>
              {view.result.gauges.map((g) => (
                <tr key={g.id}><td className="font-medium">{g.id}</td><td>{g.channel}</td><td className="num">{g.angleDeg}</td><td className="num">{fmt(g.predictedSlope)}</td><td className="num">{fmt(g.measuredSlope)}</td><td className="num">{fmt(g.ratio, 3)}</td><td className="num">{fmt(g.rSquared, 4)}</td><td>{g.flags.join(', ') || '—'}</td><td>{g.outcome}</td><td>{g.disposition ? `${g.disposition.outcome}: ${g.disposition.reason}` : '—'}</td></tr>
              ))}
            </tbody>
          </table>
        </section>
      )}
      <section className="card">
        <h2 className="mb-2 text-lg font-semibold">Signatures</h2>
        {view.signatures.length === 0 ? <p>None yet.</p> : <ul className="list-disc pl-5">{view.signatures.map((s, i) => <li key={i}>{s.kind === 'review' ? 'Engineering review' : 'Release'} by {s.name}, {new Date(s.at).toUTCString()} (reduction {s.reductionId})</li>)}</ul>}
      </section>
    </div>
  );
}
