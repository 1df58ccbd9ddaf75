import { PlanNumberField, PlanSelectField, PlanTextField } from './PlanField';
import { getIn, setIn, withGaugeKind } from './plan-draft';
import { usePlanEditor } from './plan-editor-context';
import { describeDistance } from './plan-preview';

const KINDS = [
  { value: 'uniaxial', label: 'Uniaxial' },
  { value: 'rosette-rectangular', label: 'Rosette 0/45/90' },
  { value: 'rosette-delta', label: 'Rosette 0/60/120' },
];

interface Props {
  index: number;
  lengthUnit: string;
  onRemove: () => void;
}

/** One gauge of the installation: every field editable, and where it sits against the edge zone. */
export default function PlanGaugeRow({ index: i, lengthUnit, onRemove }: Props) {
  const { plan, units, readOnly, preview, update } = usePlanEditor();
  const gauge = (getIn(plan, ['gauges', i]) ?? {}) as Record<string, unknown>;
  const rosette = gauge.kind === 'rosette-rectangular' || gauge.kind === 'rosette-delta';
  const channels = rosette ? 3 : 1;
  const who = `Gauge ${i + 1}${typeof gauge.id === 'string' && gauge.id ? ` (${gauge.id})` : ''}`;
  const grid = preview?.grids.find((g) => g.gaugeId === gauge.id);
  const cell = 'px-1.5! py-1.5!';
  return (
    <tr>
      <td className={`${cell} w-20`}>
        <PlanTextField path={['gauges', i, 'id']} label={`${who} id`} hideLabel inputClassName="px-2!" />
      </td>
      <td className={`${cell} w-40`}>
        <PlanSelectField
          path={['gauges', i, 'kind']}
          label={`${who} kind`}
          hideLabel
          options={KINDS}
          inputClassName="px-2!"
          onPick={(kind) =>
            update((p) =>
              setIn(p, ['gauges', i], withGaugeKind((getIn(p, ['gauges', i]) ?? {}) as Record<string, unknown>, kind)),
            )
          }
        />
      </td>
      <td className={`${cell} w-28`}>
        <div className="space-y-1">
          {Array.from({ length: channels }, (_, k) => (
            <div key={k} className="flex items-start gap-1">
              {rosette && (
                <span aria-hidden="true" className="w-3 pt-2 text-xs font-semibold text-ink-700">
                  {'ABC'[k]}
                </span>
              )}
              <PlanTextField
                path={['gauges', i, 'channels', k]}
                label={rosette ? `${who} channel for grid ${'ABC'[k]}` : `${who} channel`}
                hideLabel
                className="flex-1"
                inputClassName="px-2!"
              />
            </div>
          ))}
        </div>
      </td>
      <td className={`${cell} w-20`}>
        <PlanNumberField
          path={['gauges', i, 'angleDeg']}
          label={rosette ? `${who} angle of grid A` : `${who} angle`}
          unit="degrees from the axis"
          hideLabel
          inputClassName="px-2!"
        />
      </td>
      <td className={`${cell} w-20`}>
        <PlanNumberField
          path={['gauges', i, 'gaugeFactor']}
          label={`${who} gauge factor`}
          hideLabel
          placeholder="2.0"
          inputClassName="px-2!"
        />
      </td>
      <td className={`${cell} w-20`}>
        <PlanNumberField
          path={['gauges', i, 'instrumentGaugeFactor']}
          label={`${who} instrument gauge factor`}
          hideLabel
          placeholder="same"
          inputClassName="px-2!"
        />
      </td>
      <td className={`${cell} w-20`}>
        <PlanNumberField
          path={['gauges', i, 'transverseSensitivity']}
          label={`${who} transverse sensitivity Kt`}
          unit="%"
          percent
          hideLabel
          placeholder="0"
          inputClassName="px-2!"
        />
      </td>
      <td className={`${cell} w-24`}>
        <PlanNumberField
          path={['gauges', i, 'distanceToDiscontinuity']}
          label={`${who} distance to the nearest discontinuity`}
          unit={lengthUnit}
          hideLabel
          placeholder="auto"
          inputClassName="px-2!"
        />
      </td>
      <td className={`${cell} w-24`}>
        <PlanNumberField
          path={['gauges', i, 'axialPosition']}
          label={`${who} axial position`}
          unit={lengthUnit}
          hideLabel
          inputClassName="px-2!"
        />
      </td>
      <td className={`${cell} w-20`}>
        <PlanNumberField
          path={['gauges', i, 'clockDeg']}
          label={`${who} clock position`}
          unit="degrees"
          hideLabel
          inputClassName="px-2!"
        />
      </td>
      <td className={`${cell} min-w-40 text-xs`}>
        {!preview ? (
          <span className="text-ink-700">Needs the vessel and test pressure.</span>
        ) : !grid ? (
          <span className="text-ink-700">Fix this row to see it.</span>
        ) : grid.distanceToDiscontinuity === null ? (
          <span>
            <span className="font-semibold">
              <span aria-hidden="true" className="text-brass-600">
                ⚠
              </span>{' '}
              Unknown
            </span>
            <br />
            No distance or position: treated as clear of the edge zone.
          </span>
        ) : grid.edgeZone ? (
          <span>
            <span className="font-semibold">
              <span aria-hidden="true" className="text-notcompared">
                ◆
              </span>{' '}
              Edge zone
            </span>{' '}
            — {describeDistance(grid, units)}; reported, not compared.
          </span>
        ) : (
          <span>
            <span className="font-semibold">
              <span aria-hidden="true" className="text-ok">
                ●
              </span>{' '}
              Clear
            </span>{' '}
            — {describeDistance(grid, units)}
          </span>
        )}
      </td>
      <td className={cell}>
        {!readOnly && (
          <button
            type="button"
            className="btn-secondary px-2.5!"
            onClick={onRemove}
            aria-label={`Remove ${who.toLowerCase()}`}
          >
            Remove
          </button>
        )}
      </td>
    </tr>
  );
}
