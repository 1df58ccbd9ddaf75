import StrainPressurePlot from '../review/StrainPressurePlot';
import FlagChip from '../review/FlagChip';
import OutcomeBadge from '../review/OutcomeBadge';
import { FLAG_GLOSSARY } from '../review/flag-glossary';
import { TRANSVERSE_WORDS } from '../review/budget-words';
import UncertaintyBudgetTable from '../review/UncertaintyBudgetTable';
import DispositionForm from './DispositionForm';
import type { RecordDisposition, RecordGauge } from './record-types';
import { DISPOSITION_LABEL } from '../../lib/verdict-words';
import {
  formatFixed,
  formatInterval,
  formatMicrostrain,
  formatPercent,
  formatRatio,
  formatRSquared,
  formatSignificant,
} from '../../lib/ui-format';

interface Props {
  gauge: RecordGauge;
  testId: number;
  testPressure: number;
  slopeBand: number;
  pressureUnit: 'MPa' | 'psi';
  lengthUnit: string;
  nominalThickness: number;
  disposition?: RecordDisposition;
  canDisposition: boolean;
  onChanged: () => void;
}
const fmt = formatFixed;

/** One gauge: its strain–pressure plot, numbers, flags explained, disposition. */
export default function GaugeDetail({
  gauge: g,
  testId,
  testPressure,
  slopeBand,
  pressureUnit,
  lengthUnit,
  nominalThickness,
  disposition,
  canDisposition,
  onChanged,
}: Props) {
  const slope = (v: number | null | undefined) => formatSignificant(v);
  return (
    <div className="space-y-4" id={`gauge-${g.id}`}>
      <div className="flex flex-wrap items-center gap-3">
        <h3 className="text-xl font-bold">{g.id}</h3>
        <span className="text-sm text-ink-700">
          channel {g.channel} · {g.angleDeg}° from the vessel axis
        </span>
        <OutcomeBadge outcome={g.outcome} />
      </div>
      <StrainPressurePlot gauge={g} testPressure={testPressure} slopeBand={slopeBand} pressureUnit={pressureUnit} />
      <dl className="grid grid-cols-2 gap-x-6 gap-y-1 text-sm sm:grid-cols-4">
        <div>
          <dt className="text-ink-700">Predicted µε/{pressureUnit}</dt>
          <dd className="num font-semibold">{slope(g.predictedSlope)}</dd>
        </div>
        <div>
          <dt className="text-ink-700">Measured µε/{pressureUnit}</dt>
          <dd className="num font-semibold">{slope(g.measuredSlope)}</dd>
        </div>
        <div>
          <dt className="text-ink-700">Ratio (band ±{Math.round(slopeBand * 100)} %)</dt>
          <dd className="num font-semibold">{formatRatio(g.ratio)}</dd>
        </div>
        <div>
          <dt className="text-ink-700">95 % interval</dt>
          <dd className="num">{formatInterval(g.slopeCI95, slope)}</dd>
        </div>
        <div>
          <dt className="text-ink-700">R² loading</dt>
          <dd className="num">{formatRSquared(g.rSquared)}</dd>
        </div>
        <div>
          <dt className="text-ink-700">Hysteresis</dt>
          <dd className="num">{formatPercent(g.hysteresis, 1)}</dd>
        </div>
        <div>
          <dt className="text-ink-700">Zero shift</dt>
          <dd className="num">{formatMicrostrain(g.zeroShift)}</dd>
        </div>
        <div>
          <dt className="text-ink-700">Effective wall</dt>
          <dd className="num">
            {g.effectiveThickness === null ? '—' : `${fmt(g.effectiveThickness, 2)} ${lengthUnit}`}{' '}
            <span className="text-ink-700">
              (nominal {nominalThickness} {lengthUnit})
            </span>
          </dd>
        </div>
        <div>
          <dt className="text-ink-700">Band (in band between)</dt>
          <dd className="num">{formatInterval(g.bandSlope, slope)}</dd>
        </div>
        <div>
          <dt className="text-ink-700">Creep in the top hold</dt>
          <dd className="num">{formatMicrostrain(g.holdCreep)}</dd>
        </div>
        <div className="col-span-2">
          <dt className="text-ink-700">Transverse sensitivity corrected</dt>
          <dd>
            {TRANSVERSE_WORDS[g.transverseCorrection]}
            {g.pairedWith ? ` ${g.pairedWith}` : ''}
          </dd>
        </div>
        {g.headPressure !== 0 && (
          <div>
            <dt className="text-ink-700">Water head at the gauge</dt>
            <dd className="num">
              {fmt(g.headPressure, 4)} {pressureUnit}
            </dd>
          </div>
        )}
      </dl>
      <div>
        <h4 className="mb-1 font-semibold">Uncertainty of the prediction</h4>
        <UncertaintyBudgetTable gauge={g} pressureUnit={pressureUnit} />
      </div>
      {g.flags.length > 0 && (
        <div className="space-y-2">
          <h4 className="font-semibold">Flags</h4>
          <ul className="space-y-2">
            {g.flags.map((f) => (
              <li key={f} className="text-sm">
                <FlagChip code={f} linkToGlossary /> <span className="ml-1">{FLAG_GLOSSARY[f].meaning}</span>{' '}
                <span className="text-ink-700">Usual causes: {FLAG_GLOSSARY[f].causes.join('; ')}.</span>
              </li>
            ))}
          </ul>
        </div>
      )}
      {g.notes.length > 0 && (
        <ul className="list-disc pl-5 text-xs text-ink-700">
          {g.notes.map((n, i) => (
            <li key={i}>{n}</li>
          ))}
        </ul>
      )}
      {disposition && (
        <p className="rounded-md bg-ink-50 p-2 text-sm">
          <strong title={`disposition code: ${disposition.outcome}`}>{DISPOSITION_LABEL[disposition.outcome]}</strong> —{' '}
          {disposition.reason}{' '}
          <span className="text-ink-700">
            ({disposition.by}, {new Date(disposition.at).toLocaleString('en-GB')})
          </span>
        </p>
      )}
      {canDisposition && (
        <DispositionForm
          key={g.id + (disposition?.at ?? '')}
          testId={testId}
          gaugeId={g.id}
          current={disposition}
          onSaved={onChanged}
        />
      )}
    </div>
  );
}
