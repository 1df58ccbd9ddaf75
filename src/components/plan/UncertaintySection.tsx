import { formatFixed, formatPercent } from '../../lib/ui-format';
import { planLengthUnit, UNCERTAINTY_DEFAULTS } from '../../lib/reduction/browser';
import { PlanNumberField, PlanSelectField } from './PlanField';
import PlanSection from './PlanSection';
import { getIn } from './plan-draft';
import { usePlanEditor } from './plan-editor-context';

const BAND_MODES = [
  { value: 'fixed', label: 'Fixed: ± slope band (default)' },
  { value: 'uncertainty', label: 'From the uncertainties: √(U_pred² + U_fit²)' },
];

/**
 * The standard uncertainties (k = 1) of the prediction's inputs (DESIGN 3.4). An empty field is
 * assumed at the default shown, and the reduction says it was assumed.
 */
export default function UncertaintySection() {
  const { plan, units } = usePlanEditor();
  const len = planLengthUnit(units);
  const t = getIn(plan, ['vessel', 'wallThickness']);
  const d = getIn(plan, ['vessel', 'insideDiameter']);
  const ofNominal = (v: unknown, share: number) =>
    typeof v === 'number'
      ? `${formatPercent(share, 1)} of nominal = ${formatFixed(v * share, units === 'US' ? 4 : 3)} ${len}`
      : `${formatPercent(share, 1)} of nominal`;
  const D = UNCERTAINTY_DEFAULTS;
  const fields: { key: string; label: string; unit: string; assumed: string; percent?: boolean }[] = [
    {
      key: 'wallThickness',
      label: 'Uncertainty of the wall thickness',
      unit: len,
      assumed: ofNominal(t, D.wallThicknessRelative),
    },
    {
      key: 'insideDiameter',
      label: 'Uncertainty of the inside diameter',
      unit: len,
      assumed: ofNominal(d, D.insideDiameterRelative),
    },
    {
      key: 'elasticModulus',
      label: 'Uncertainty of the elastic modulus',
      unit: '% of E',
      assumed: formatPercent(D.elasticModulus, 0),
      percent: true,
    },
    { key: 'poissonRatio', label: "Uncertainty of Poisson's ratio", unit: 'absolute', assumed: String(D.poissonRatio) },
    {
      key: 'gaugeFactor',
      label: 'Uncertainty of the gauge factor',
      unit: '% of the gauge factor',
      assumed: formatPercent(D.gaugeFactor, 1),
      percent: true,
    },
    {
      key: 'transverseSensitivity',
      label: 'Uncertainty of the transverse sensitivity Kt',
      unit: 'percentage points',
      assumed: `${formatPercent(D.transverseSensitivity, 1)} (points)`,
      percent: true,
    },
    { key: 'misalignmentDeg', label: 'Gauge misalignment', unit: 'degrees', assumed: `${D.misalignmentDeg}°` },
  ];
  return (
    <PlanSection
      id="plan-uncertainty"
      title="Uncertainty of the prediction"
      intro="Standard uncertainties (one standard deviation) of what the prediction rests on. Each gauge's predicted slope gets a 95 % uncertainty from them; the review shows which input dominates. An empty field is an assumption: the default shown is used and the result says so."
    >
      <div className="grid gap-4 sm:grid-cols-2 xl:grid-cols-3">
        {fields.map((f) => (
          <PlanNumberField
            key={f.key}
            path={['uncertainty', f.key]}
            label={f.label}
            unit={f.unit}
            placeholder="assumed"
            percent={f.percent}
            hint={<>Assumed when empty: {f.assumed}</>}
          />
        ))}
        <PlanSelectField
          path={['tolerances', 'bandMode']}
          label="Band used for “outside tolerance”"
          options={BAND_MODES}
          defaultValue="fixed"
          hint="From the uncertainties, a gauge is outside band when measured and predicted differ by more than both uncertainties together."
        />
      </div>
    </PlanSection>
  );
}
