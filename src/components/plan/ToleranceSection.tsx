import { formatPercent } from '../../lib/ui-format';
import { PlanNumberField } from './PlanField';
import PlanSection from './PlanSection';
import { TOLERANCE_DEFAULTS, cleanFloat } from './plan-draft';
import { explainFlag } from '../review/flag-glossary';
import type { FlagCode } from '../../lib/reduction/types';

type Key = keyof typeof TOLERANCE_DEFAULTS;
const FIELDS: { key: Key; label: string; unit?: string; flag: FlagCode; percent?: boolean }[] = [
  { key: 'slopeBand', label: 'Slope band ±', unit: '%', flag: 'outside-band', percent: true },
  { key: 'minRSquared', label: 'Minimum loading R²', flag: 'nonlinear' },
  { key: 'hysteresis', label: 'Hysteresis limit', unit: '% of peak', flag: 'hysteresis', percent: true },
  { key: 'zeroShiftMicrostrain', label: 'Zero shift, absolute', unit: 'µε', flag: 'zero-shift' },
  {
    key: 'zeroShiftFraction',
    label: 'Zero shift, relative',
    unit: '% of peak',
    flag: 'zero-shift',
    percent: true,
  },
  { key: 'noResponseMicrostrain', label: 'No-response floor', unit: 'µε', flag: 'no-response' },
  { key: 'yieldFraction', label: 'Near-yield limit', unit: '% of yield', flag: 'near-yield', percent: true },
  { key: 'holdCreepMicrostrain', label: 'Creep in the top hold, absolute', unit: 'µε', flag: 'hold-creep' },
  {
    key: 'holdCreepFraction',
    label: 'Creep in the top hold, relative',
    unit: '% of peak',
    flag: 'hold-creep',
    percent: true,
  },
  { key: 'principalDirectionDeg', label: 'Rosette direction off by', unit: 'degrees', flag: 'principal-direction' },
];

/** The comparison tolerances of DESIGN 3.3 (not acceptance criteria); an empty field uses the default shown. */
export default function ToleranceSection() {
  return (
    <PlanSection
      id="plan-tolerances"
      title="Tolerances"
      intro="These are the tolerances of the strain comparison, not acceptance criteria of the hydrotest. Leave a field empty to use its default. Zero shift and creep are flagged when they exceed the larger of the absolute and relative limits."
    >
      <div className="grid gap-4 sm:grid-cols-2 xl:grid-cols-3">
        {FIELDS.map((f) => {
          const d = TOLERANCE_DEFAULTS[f.key];

          return (
            <PlanNumberField
              key={f.key}
              path={['tolerances', f.key]}
              label={f.label}
              unit={f.unit}
              placeholder={f.percent ? String(cleanFloat(d * 100)) : String(d)}
              percent={f.percent}
              hint={
                <>
                  Default {f.percent ? formatPercent(d, 1) : d} · raises “{explainFlag(f.flag).title}”{' '}
                  <span className="sr-only">(flag {f.flag})</span>
                </>
              }
            />
          );
        })}
      </div>
    </PlanSection>
  );
}
