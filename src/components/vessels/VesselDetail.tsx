import { useState } from 'react';
import type { PlanUnits } from '../../lib/reduction/browser';
import { formatFixed } from '../../lib/ui-format';
import { api } from '../api';
import UnitSystemToggle from './UnitSystemToggle';
import VesselForm from './VesselForm';
import { formatLength, formatStress, type MaterialRow, type VesselFeature, type VesselRow } from './vessel-form';

export interface VesselDetailProps {
  vessel: VesselRow;
  materials: MaterialRow[];
  canEdit: boolean;
}

const KIND: Record<string, string> = {
  nozzle: 'Nozzle',
  support: 'Support',
  head: 'Head seam',
  'thickness-change': 'Thickness change',
};

/** One vessel: geometry, material and features in the chosen units, and (for engineers) the edit form. */
export default function VesselDetail({ vessel: initial, materials, canEdit }: VesselDetailProps) {
  const [vessel, setVessel] = useState(initial);
  const [units, setUnits] = useState<PlanUnits>(initial.units);
  const [editing, setEditing] = useState(false);
  const [notice, setNotice] = useState<string | null>(null);
  const m = vessel.material;
  const features = vessel.features as VesselFeature[];
  async function saved() {
    setVessel(await api<VesselRow>(`/api/vessels/${vessel.id}`));
    setEditing(false);
    setNotice('Vessel saved.');
  }
  const rows: [string, string][] = [
    ['Shape', vessel.shape === 'sphere' ? 'Sphere' : `Cylinder, ${vessel.ends} ends`],
    ['Inside diameter', formatLength(vessel.insideDiameterMm, units)],
    ['Wall thickness', formatLength(vessel.wallThicknessMm, units)],
    ['Shell length', vessel.shape === 'sphere' ? '—' : formatLength(vessel.lengthMm, units)],
    ['Inside radius / thickness', formatFixed(vessel.insideDiameterMm / 2 / vessel.wallThicknessMm, 1)],
    [
      'Material',
      m
        ? `${m.name}: E ${formatStress(m.elasticModulusMPa, units)}, ν ${m.poissonRatio}, yield ${formatStress(m.yieldStrengthMPa, units)}`
        : 'none',
    ],
    ['Display preference', vessel.units === 'US' ? 'US customary' : 'SI'],
  ];
  return (
    <div className="space-y-5">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <UnitSystemToggle
          name="vessel-units"
          value={units}
          onChange={setUnits}
          hint="Stored in SI; converted exactly."
        />
        {notice && (
          <p role="status" className="text-sm font-medium text-ok">
            {notice}
          </p>
        )}
        {canEdit && !editing && (
          <button
            type="button"
            className="btn-primary"
            onClick={() => {
              setEditing(true);
              setNotice(null);
            }}
          >
            Edit vessel
          </button>
        )}
      </div>
      {editing ? (
        <section aria-labelledby="edit-vessel-h" className="card">
          <h2 id="edit-vessel-h" className="mb-3 text-lg font-semibold">
            Edit {vessel.tag}
          </h2>
          <VesselForm
            idPrefix="edit-vessel"
            units={units}
            materials={materials}
            vessel={vessel}
            onSaved={() => void saved()}
            onCancel={() => setEditing(false)}
          />
        </section>
      ) : (
        <div className="grid items-start gap-5 lg:grid-cols-2">
          <section aria-labelledby="vessel-details-h" className="card">
            <h2 id="vessel-details-h" className="mb-3 text-lg font-semibold">
              Details
            </h2>
            <dl className="grid grid-cols-[12rem_minmax(0,1fr)] gap-x-4 gap-y-2 text-sm">
              {rows.map(([k, v]) => (
                <div key={k} className="contents">
                  <dt className="text-ink-700">{k}</dt>
                  <dd className="num font-medium">{v}</dd>
                </div>
              ))}
            </dl>
          </section>
          <section aria-labelledby="vessel-features-h" className="card">
            <h2 id="vessel-features-h" className="mb-3 text-lg font-semibold">
              Discontinuities
            </h2>
            {features.length === 0 ? (
              <p className="text-sm text-ink-700">None listed; the head seams at both ends are always counted.</p>
            ) : (
              <table className="table-base">
                <thead>
                  <tr>
                    <th scope="col">Kind</th>
                    <th scope="col" className="text-right!">
                      Axial position
                    </th>
                    <th scope="col" className="text-right!">
                      Clock
                    </th>
                    <th scope="col" className="text-right!">
                      Size
                    </th>
                  </tr>
                </thead>
                <tbody>
                  {features.map((f, i) => (
                    <tr key={i}>
                      <td>{KIND[f.kind] ?? f.kind}</td>
                      <td className="num text-right">{formatLength(f.axialPosition, units)}</td>
                      <td className="num text-right">
                        {f.clockDeg === undefined ? 'all round' : `${formatFixed(f.clockDeg, 0)}°`}
                      </td>
                      <td className="num text-right">{f.size === undefined ? '—' : formatLength(f.size, units)}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            )}
          </section>
        </div>
      )}
    </div>
  );
}
