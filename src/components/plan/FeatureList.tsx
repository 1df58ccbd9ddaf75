import { planLengthUnit } from '../../lib/reduction/browser';
import { PlanNumberField, PlanSelectField, PlanTextField } from './PlanField';
import PlanSection from './PlanSection';
import { fieldIdForPath } from './plan-fields';
import { getIn, setIn } from './plan-draft';
import { usePlanEditor } from './plan-editor-context';

const KINDS = [
  { value: 'nozzle', label: 'Nozzle' },
  { value: 'support', label: 'Support' },
  { value: 'head', label: 'Head seam' },
  { value: 'thickness-change', label: 'Thickness change' },
];

/** Discontinuities on the shell; a gauge without a given distance is measured to the nearest one. */
export default function FeatureList() {
  const { plan, units, readOnly, update } = usePlanEditor();
  const len = planLengthUnit(units);
  const features = (getIn(plan, ['vessel', 'features']) as unknown[] | undefined) ?? [];
  const add = () => {
    update((p) => setIn(p, ['vessel', 'features'], [...features, { kind: 'nozzle', axialPosition: undefined }]));
    requestAnimationFrame(() =>
      document.getElementById(fieldIdForPath(['vessel', 'features', features.length, 'kind']))?.focus(),
    );
  };
  const remove = (i: number) =>
    update((p) =>
      setIn(
        p,
        ['vessel', 'features'],
        features.filter((_, k) => k !== i),
      ),
    );
  return (
    <PlanSection
      id="plan-vessel-features"
      title="Discontinuities"
      intro={
        <>
          Nozzles, supports, seams and thickness changes. Axial positions from the reference end, the end where the
          shell length is 0 ({len}); clock 0–360° around the shell, 0° at top dead centre and increasing clockwise as
          seen looking from the reference end; blank for a feature that runs all round. The head seams at both ends of
          the shell are included without listing them.
        </>
      }
      actions={
        !readOnly && (
          <button type="button" className="btn-secondary" onClick={add}>
            Add feature
          </button>
        )
      }
    >
      {features.length === 0 ? (
        <p className="text-sm text-ink-700">No features listed.</p>
      ) : (
        <div className="overflow-x-auto">
          <table className="table-base">
            <thead>
              <tr>
                <th scope="col">Kind</th>
                <th scope="col">Name</th>
                <th scope="col">Axial position ({len})</th>
                <th scope="col">Clock (°)</th>
                <th scope="col">Size ({len})</th>
                <th scope="col">
                  <span className="sr-only">Remove</span>
                </th>
              </tr>
            </thead>
            <tbody>
              {features.map((_, i) => {
                const n = `Feature ${i + 1}`;
                return (
                  <tr key={i}>
                    <td className="min-w-36">
                      <PlanSelectField
                        path={['vessel', 'features', i, 'kind']}
                        label={`${n} kind`}
                        hideLabel
                        options={KINDS}
                      />
                    </td>
                    <td className="min-w-28">
                      <PlanTextField path={['vessel', 'features', i, 'name']} label={`${n} name`} hideLabel optional />
                    </td>
                    <td>
                      <PlanNumberField
                        path={['vessel', 'features', i, 'axialPosition']}
                        label={`${n} axial position`}
                        unit={len}
                        hideLabel
                      />
                    </td>
                    <td>
                      <PlanNumberField
                        path={['vessel', 'features', i, 'clockDeg']}
                        label={`${n} clock position`}
                        unit="degrees"
                        hideLabel
                        placeholder="all round"
                      />
                    </td>
                    <td>
                      <PlanNumberField
                        path={['vessel', 'features', i, 'size']}
                        label={`${n} size`}
                        unit={len}
                        hideLabel
                      />
                    </td>
                    <td>
                      {!readOnly && (
                        <button
                          type="button"
                          className="btn-secondary"
                          onClick={() => remove(i)}
                          aria-label={`Remove ${n.toLowerCase()}`}
                        >
                          Remove
                        </button>
                      )}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      )}
    </PlanSection>
  );
}
