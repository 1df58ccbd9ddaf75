import { useState } from 'react';
import type { PlanUnits } from '../../lib/reduction/browser';
import { api } from '../api';
import MaterialForm from './MaterialForm';
import MaterialListTable from './MaterialListTable';
import UnitSystemToggle from './UnitSystemToggle';
import VesselForm from './VesselForm';
import VesselListTable from './VesselListTable';
import type { MaterialRow, VesselRow } from './vessel-form';

export interface VesselCatalogProps {
  vessels: VesselRow[];
  materials: MaterialRow[];
  /** tests per vessel id */
  testCounts: Record<string, number>;
  /** engineer or admin: show the create forms */
  canEdit: boolean;
}

/** The vessels and materials pages' lists, an SI / US toggle, and the create forms for engineers. */
export default function VesselCatalog({
  vessels,
  materials: initialMaterials,
  testCounts,
  canEdit,
}: VesselCatalogProps) {
  const [units, setUnits] = useState<PlanUnits>('SI');
  const [materials, setMaterials] = useState(initialMaterials);
  const [notice, setNotice] = useState<string | null>(null);
  async function materialSaved(id: number) {
    const r = await api<{ items: MaterialRow[] }>('/api/materials?limit=200');
    setMaterials(r.items);
    setNotice(`Material “${r.items.find((m) => m.id === id)?.name ?? id}” created.`);
  }
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <UnitSystemToggle
          name="catalog-units"
          value={units}
          onChange={setUnits}
          hint="Values are stored in SI and converted exactly for display."
        />
        {notice && (
          <p role="status" className="text-sm font-medium text-ok">
            {notice}
          </p>
        )}
      </div>
      <section aria-labelledby="vessels-h" className="card">
        <h2 id="vessels-h" className="mb-3 text-lg font-semibold">
          Vessels
        </h2>
        <VesselListTable vessels={vessels} testCounts={testCounts} units={units} />
      </section>
      <section aria-labelledby="materials-h" className="card">
        <h2 id="materials-h" className="mb-3 text-lg font-semibold">
          Materials
        </h2>
        <MaterialListTable materials={materials} units={units} />
      </section>
      {canEdit && (
        <div className="grid items-start gap-6 xl:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
          <section aria-labelledby="new-vessel-h" className="card">
            <h2 id="new-vessel-h" className="mb-3 text-lg font-semibold">
              New vessel
            </h2>
            <VesselForm
              idPrefix="new-vessel"
              units={units}
              materials={materials}
              vessel={null}
              onSaved={(id) => window.location.assign(`/vessels/${id}`)}
            />
          </section>
          <section aria-labelledby="new-material-h" className="card">
            <h2 id="new-material-h" className="mb-3 text-lg font-semibold">
              New material
            </h2>
            <MaterialForm idPrefix="new-material" units={units} onSaved={(id) => void materialSaved(id)} />
          </section>
        </div>
      )}
    </div>
  );
}
