import { formatPercent } from '../../lib/ui-format';
import { PlanNumberField } from './PlanField';
import PlanSection from './PlanSection';
import { TOLERANCE_DEFAULTS, getIn } from './plan-draft';
import { usePlanEditor } from './plan-editor-context';

type Key = keyof typeof TOLERANCE_DEFAULTS;
const FIELDS: { key: Key; label: string; unit?: string; flag: string; percent?: boolean }[] = [
  { key: 'slopeBand', label: 'Slope band ±', unit: 'fraction', flag: 'outside-band', percent: true },
  { key: 'minRSquared', label: 'Minimum loading R²', flag: 'nonlinear' },
  { key: 'hysteresis', label: 'Hysteresis limit', unit: 'fraction of peak', flag: 'hysteresis', percent: true },
  { key: 'zeroShiftMicrostrain', label: 'Zero shift, absolute', unit: 'µε', flag: 'zero-shift' },
  {
    key: 'zeroShiftFraction',
    label: 'Zero shift, relative',
    unit: 'fraction of peak',
    flag: 'zero-shift',
    percent: true,
  },
  { key: 'noResponseMicrostrain', label: 'No-response floor', unit: 'µε', flag: 'no-response' },
  { key: 'yieldFraction', label: 'Near-yield limit', unit: 'fraction of yield', flag: 'near-yield', percent: true },
  { key: 'holdCreepMicrostrain', label: 'Creep in the top hold, absolute', unit: 'µε', flag: 'hold-creep' },
  {
    key: 'holdCreepFraction',
    label: 'Creep in the top hold, relative',
    unit: 'fraction of peak',
    flag: 'hold-creep',
    percent: true,
  },
  { key: 'principalDirectionDeg', label: 'Rosette direction off by', unit: 'degrees', flag: 'principal-direction' },
];

/** The acceptance thresholds of DESIGN 3.3; an empty field uses the default shown. */
export default function ToleranceSection() {
  const { plan } = usePlanEditor();
  return (
    <PlanSection
      id="plan-tolerances"
      title="Tolerances"
      intro="Leave a field empty to use its default. Zero shift and creep are flagged when they exceed the larger of the absolute and relative limits."
    >
      <div className="grid gap-4 sm:grid-cols-2 xl:grid-cols-3">
        {FIELDS.map((f) => {
          const v = getIn(plan, ['tolerances', f.key]);
          const d = TOLERANCE_DEFAULTS[f.key];
          const now = typeof v === 'number' && f.percent ? ` · now ${formatPercent(v, 1)}` : '';
          return (
            <PlanNumberField
              key={f.key}
              path={['tolerances', f.key]}
              label={f.label}
              unit={f.unit}
              placeholder={String(d)}
              hint={
                <>
                  Default {d}
                  {f.percent ? ` (${formatPercent(d, 1)})` : ''}
                  {now} · flag <code className="font-mono">{f.flag}</code>
                </>
              }
            />
          );
        })}
      </div>
    </PlanSection>
  );
}
