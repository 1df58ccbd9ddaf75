import { useMemo, useState } from 'react';
import { api } from '../api';
import DeviationOverview from '../review/DeviationOverview';
import DevelopedShellMap from '../review/DevelopedShellMap';
import FlagGlossary from '../review/FlagGlossary';
import GaugeTable from '../review/GaugeTable';
import RosetteCard from '../review/RosetteCard';
import SafetyCaution from '../review/SafetyCaution';
import TimeHistoryPlot from '../review/TimeHistoryPlot';
import VerdictBanner from '../review/VerdictBanner';
import { countVerdictGauges } from '../../lib/verdict-words';
import YieldCheckCard from '../review/YieldCheckCard';
import type { FlagCode } from '../../lib/reduction/types';
import GaugeDetail from './GaugeDetail';
import SignOffBar from './SignOffBar';
import ConductAndSignatures from './ConductAndSignatures';
import { normalizeRecordResult, type RecordView } from './record-types';
import { can } from '../../lib/roles';
import { DISPOSITION_LABEL } from '../../lib/verdict-words';

interface Props {
  initial: RecordView;
  role: string;
  userEmail: string;
  /** the signer's name, shown in the statement they sign */
  userName?: string;
  seriesUrl: string;
  readOnly?: boolean;
}

/** The review screen: verdict, deviation overview, shell map, gauge table, one gauge in detail, rosettes, time history. */
export default function ReviewWorkspace({
  initial,
  role,
  userEmail,
  userName = '',
  seriesUrl,
  readOnly = false,
}: Props) {
  const [record, setRecord] = useState(initial);
  const plan = record.plan;
  // a result stored by an older engine is read in the current shape
  const result = useMemo(
    () => (record.result && plan ? normalizeRecordResult(record.result, plan) : null),
    [record.result, plan],
  );
  const firstFlagged = result?.gauges.find((g) => g.outcome === 'flagged')?.id ?? result?.gauges[0]?.id ?? null;
  const [selected, setSelected] = useState<string | null>(firstFlagged);
  const reload = () => api<RecordView>(`/api/tests/${record.test.id}/record`).then(setRecord);

  const presentFlags = useMemo(
    () => [...new Set(result?.gauges.flatMap((g) => g.flags) ?? [])] as FlagCode[],
    [result],
  );
  if (!result || !plan)
    return <p className="card">No finished reduction yet. Upload a log and run a reduction on the Logs page.</p>;
  const gauge = result.gauges.find((g) => g.id === selected) ?? null;
  const dispositionOf = (id: string) =>
    record.dispositions.find((d) => d.gaugeId === id) ??
    record.dispositions.find((d) => id.startsWith(`${d.gaugeId}/`));
  const canDisposition = !readOnly && can(role, 'disposition') && record.test.status !== 'released';
  const lengthUnit = plan.units === 'US' ? 'in' : 'mm';
  const select = (id: string) => {
    setSelected(id);
    document.getElementById('gauge-detail')?.scrollIntoView({ behavior: 'smooth', block: 'start' });
  };

  return (
    <div className="space-y-6">
      <VerdictBanner verdict={result.verdict} counts={countVerdictGauges(result.gauges)} />
      <SafetyCaution />
      <YieldCheckCard yieldCheck={result.yieldCheck} pressureUnit={result.pressureUnit} />
      {!readOnly && (
        <SignOffBar
          record={record}
          role={role}
          userEmail={userEmail}
          userName={userName}
          onChanged={() => void reload()}
        />
      )}
      <div className="grid gap-6 2xl:grid-cols-[minmax(0,3fr)_minmax(26rem,2fr)]">
        <div className="min-w-0 space-y-6">
          <section className="card" aria-labelledby="dev-h">
            <h2 id="dev-h" className="mb-3 text-lg font-semibold">
              Measured over predicted slope
            </h2>
            <DeviationOverview
              gauges={result.gauges}
              slopeBand={plan.tolerances.slopeBand}
              selectedId={selected}
              onSelect={select}
            />
          </section>
          <section className="card" aria-labelledby="map-h">
            <h2 id="map-h" className="mb-3 text-lg font-semibold">
              Developed shell
            </h2>
            <DevelopedShellMap
              plan={plan}
              results={Object.fromEntries(result.gauges.map((g) => [g.id, { outcome: g.outcome }]))}
              edgeZoneDistance={result.predicted.edgeZoneDistance}
              lengthUnit={lengthUnit}
              selectedId={selected}
              onSelect={select}
            />
          </section>
          <section className="overflow-x-auto card" aria-labelledby="tab-h">
            <h2 id="tab-h" className="mb-3 text-lg font-semibold">
              Gauges
            </h2>
            <GaugeTable
              gauges={result.gauges}
              pressureUnit={result.pressureUnit}
              selectedId={selected}
              onSelect={select}
              actionsLabel="Disposition"
              renderActions={(g) => {
                const d = dispositionOf(g.id);
                return d ? (
                  <span className="text-sm" title={`disposition code: ${d.outcome}`}>
                    {DISPOSITION_LABEL[d.outcome]}
                  </span>
                ) : g.outcome === 'flagged' ? (
                  <button type="button" className="btn-secondary" onClick={() => select(g.id)}>
                    {canDisposition ? 'Disposition…' : 'Open'}
                  </button>
                ) : (
                  <span className="text-ink-700">—</span>
                );
              }}
            />
          </section>
        </div>
        <aside id="gauge-detail" className="h-fit card 2xl:sticky 2xl:top-4" aria-label="Selected gauge">
          {gauge ? (
            <GaugeDetail
              gauge={gauge}
              testId={record.test.id}
              testPressure={plan.testPressure}
              slopeBand={plan.tolerances.slopeBand}
              pressureUnit={result.pressureUnit}
              lengthUnit={lengthUnit}
              nominalThickness={plan.vessel.wallThickness}
              disposition={dispositionOf(gauge.id)}
              canDisposition={canDisposition}
              onChanged={() => void reload()}
            />
          ) : (
            <p>Select a gauge.</p>
          )}
        </aside>
      </div>
      {result.rosettes.length > 0 && (
        <section aria-labelledby="ros-h">
          <h2 id="ros-h" className="mb-3 text-lg font-semibold">
            Rosettes
          </h2>
          <div className="grid gap-4 lg:grid-cols-2">
            {result.rosettes.map((r) => (
              <RosetteCard
                key={r.id}
                rosette={r}
                pressureUnit={result.pressureUnit}
                testPressure={plan.testPressure}
                nearYieldFraction={plan.tolerances.yieldFraction}
              />
            ))}
          </div>
        </section>
      )}
      <section className="card" aria-labelledby="th-h">
        <h2 id="th-h" className="mb-3 text-lg font-semibold">
          Time history
        </h2>
        <TimeHistoryPlot
          seriesUrl={seriesUrl}
          reductionId={record.reduction?.status === 'done' ? record.reduction.id : null}
          channels={plan.gauges.flatMap((g) => g.channels)}
          channelLabels={Object.fromEntries(
            plan.gauges.flatMap((g) =>
              g.channels.map((c, k) => [c, `${g.kind === 'uniaxial' ? g.id : `${g.id}/${'ABC'[k]}`} (${c})`]),
            ),
          )}
          pressureUnit={result.pressureUnit}
        />
      </section>
      <ConductAndSignatures record={record} />
      {result.warnings.length > 0 && (
        <section className="card" aria-labelledby="warn-h">
          <h2 id="warn-h" className="mb-2 text-lg font-semibold">
            Warnings from the reduction
          </h2>
          <ul className="list-disc pl-5 text-sm">
            {result.warnings.map((w, i) => (
              <li key={i}>{w}</li>
            ))}
          </ul>
        </section>
      )}
      {presentFlags.length > 0 && (
        <section className="card">
          <FlagGlossary codes={presentFlags} heading="What the flags in this test mean" />
        </section>
      )}
    </div>
  );
}
