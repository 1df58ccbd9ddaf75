import { planLengthUnit } from '../../lib/reduction/browser';
import { formatFixed } from '../../lib/ui-format';
import PlanGaugeRow from './PlanGaugeRow';
import PlanSection from './PlanSection';
import { fieldIdForPath } from './plan-fields';
import { nextGaugeId, setIn } from './plan-draft';
import { usePlanEditor } from './plan-editor-context';

/** The installation: one editable row per gauge or rosette, with its distance to the nearest discontinuity. */
export default function PlanGaugeTable() {
  const { plan, units, readOnly, preview, update } = usePlanEditor();
  const len = planLengthUnit(units);
  const gauges = Array.isArray(plan.gauges) ? (plan.gauges as unknown[]) : [];
  const add = () => {
    update((p) =>
      setIn(
        p,
        ['gauges'],
        [
          ...gauges,
          {
            id: nextGaugeId(p),
            kind: 'uniaxial',
            channels: [''],
            angleDeg: 90,
            gaugeFactor: 2,
            transverseSensitivity: 0,
          },
        ],
      ),
    );
    requestAnimationFrame(() =>
      document.getElementById(fieldIdForPath(['gauges', gauges.length, 'channels', 0]))?.focus(),
    );
  };
  const remove = (i: number) =>
    update((p) =>
      setIn(
        p,
        ['gauges'],
        gauges.filter((_, k) => k !== i),
      ),
    );
  const edge = preview ? `${formatFixed(preview.predicted.edgeZoneDistance, units === 'US' ? 2 : 0)} ${len}` : '—';
  return (
    <PlanSection
      id="plan-gauges"
      title="Gauges"
      intro={
        <>
          Angle from the vessel axis: 0° axial, 90° hoop; for a rosette, the direction of grid A. A gauge closer than
          the edge zone 2.5·√(r t) (r mean radius, t wall) = <strong className="num">{edge}</strong> to a discontinuity
          is reported but not compared. Give the distance, or the axial position from the reference end (length 0) and
          the clock (0° at top dead centre, clockwise looking from the reference end) to measure it from the features; a
          gauge with neither is not checked against the edge zone, and the result warns so.
        </>
      }
      actions={
        !readOnly && (
          <button type="button" className="btn-secondary" onClick={add}>
            Add gauge
          </button>
        )
      }
    >
      <div className="overflow-x-auto">
        <table className="table-base">
          <thead className="text-xs">
            <tr>
              <th scope="col">Id</th>
              <th scope="col">Kind</th>
              <th scope="col">Channel(s)</th>
              <th scope="col">Angle (°)</th>
              <th scope="col">Gauge factor</th>
              <th scope="col">Instrument GF</th>
              <th scope="col">Transverse sens. Kt</th>
              <th scope="col">Distance to discontinuity ({len})</th>
              <th scope="col">Axial position ({len})</th>
              <th scope="col">Clock (°)</th>
              <th scope="col">Edge zone</th>
              <th scope="col">
                <span className="sr-only">Remove</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {gauges.length === 0 && (
              <tr>
                <td colSpan={12} className="text-ink-700">
                  No gauges yet: add at least one.
                </td>
              </tr>
            )}
            {gauges.map((_, i) => (
              <PlanGaugeRow key={i} index={i} lengthUnit={len} onRemove={() => remove(i)} />
            ))}
          </tbody>
        </table>
      </div>
    </PlanSection>
  );
}
