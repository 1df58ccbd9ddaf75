import { planLengthUnit } from '../../lib/reduction/browser';
import { formatFixed } from '../../lib/ui-format';
import { PlanNumberField, PlanSelectField, PlanTextField } from './PlanField';
import PlanSection from './PlanSection';
import { usePlanEditor } from './plan-editor-context';

/** Shape, ends and the nominal geometry of the shell. */
export default function VesselSection() {
  const { plan, units, preview } = usePlanEditor();
  const len = planLengthUnit(units);
  const vessel = (plan.vessel ?? {}) as Record<string, unknown>;
  const sphere = vessel.shape === 'sphere';
  const d = vessel.insideDiameter,
    t = vessel.wallThickness;
  const ratio = typeof d === 'number' && typeof t === 'number' && t > 0 ? d / 2 / t : null;
  return (
    <PlanSection id="plan-vessel" title="Vessel" intro="Nominal dimensions from the vessel's drawing or data report.">
      <div className="grid gap-4 sm:grid-cols-2">
        <PlanTextField
          path={['vessel', 'name']}
          label="Vessel tag or name"
          optional
          hint="Matches or creates the vessel record."
        />
        <PlanSelectField
          path={['vessel', 'shape']}
          label="Shape"
          options={[
            { value: 'cylinder', label: 'Cylinder' },
            { value: 'sphere', label: 'Sphere' },
          ]}
        />
        {!sphere && (
          <PlanSelectField
            path={['vessel', 'ends']}
            label="Ends"
            defaultValue="closed"
            hint="Closed: heads carry the axial load. Open: no axial stress (e.g. a sleeve)."
            options={[
              { value: 'closed', label: 'Closed (heads)' },
              { value: 'open', label: 'Open' },
            ]}
          />
        )}
        <PlanNumberField path={['vessel', 'insideDiameter']} label="Inside diameter" unit={len} />
        <PlanNumberField
          path={['vessel', 'wallThickness']}
          label="Wall thickness"
          unit={len}
          hint="Nominal, less any allowance you do not expect on the vessel."
        />
        {!sphere && (
          <PlanNumberField
            path={['vessel', 'length']}
            label="Shell length (seam to seam)"
            unit={len}
            hint="Head-to-shell seams are at 0 and at this length."
          />
        )}
      </div>
      <dl className="mt-4 grid grid-cols-2 gap-x-4 gap-y-1 rounded-md bg-ink-50 px-3 py-2 text-sm">
        <dt className="text-ink-700">Inside radius / thickness</dt>
        <dd className="num font-medium">{ratio ? formatFixed(ratio, 1) : '—'}</dd>
        <dt className="text-ink-700">Edge zone 2.5·√(r t), r mean radius</dt>
        <dd className="num font-medium">
          {preview ? `${formatFixed(preview.predicted.edgeZoneDistance, units === 'US' ? 2 : 0)} ${len}` : '—'}
        </dd>
      </dl>
    </PlanSection>
  );
}
