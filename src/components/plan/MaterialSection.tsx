import { useEffect, useId, useState } from 'react';
import { mpaToPsi, planPressureUnit } from '../../lib/reduction/browser';
import { api } from '../api';
import { PlanNumberField, PlanTextField } from './PlanField';
import PlanSection from './PlanSection';
import { cleanFloat, setIn } from './plan-draft';
import { usePlanEditor } from './plan-editor-context';

export interface MaterialRow {
  id: number;
  name: string;
  elasticModulusMPa: number;
  poissonRatio: number;
  yieldStrengthMPa: number;
}

/** Elastic constants and yield: typed, or filled in from a stored material (converted to the plan's units). */
export default function MaterialSection() {
  const { units, readOnly, update } = usePlanEditor();
  const pickId = useId();
  const stress = planPressureUnit(units);
  const [materials, setMaterials] = useState<MaterialRow[]>([]);
  const [loadError, setLoadError] = useState<string | null>(null);
  useEffect(() => {
    if (readOnly) return;
    api<{ items: MaterialRow[] }>('/api/materials?limit=200')
      .then((r) => setMaterials(r.items))
      .catch((e: Error) => setLoadError(e.message));
  }, [readOnly]);

  function fill(id: string) {
    const m = materials.find((x) => String(x.id) === id);
    if (!m) return;
    const s = (mpa: number) => (units === 'US' ? cleanFloat(mpaToPsi(mpa)) : mpa);
    update((p) =>
      setIn(p, ['material'], {
        ...((p.material as object) ?? {}),
        name: m.name,
        elasticModulus: s(m.elasticModulusMPa),
        poissonRatio: m.poissonRatio,
        yieldStrength: s(m.yieldStrengthMPa),
      }),
    );
  }

  return (
    <PlanSection
      id="plan-material"
      title="Material"
      intro="Values at the test temperature. Code tables vary by edition and temperature; confirm them."
    >
      {!readOnly && (
        <div className="mb-4">
          <label htmlFor={pickId} className="label">
            Fill in from a stored material
          </label>
          <select
            id={pickId}
            className="field"
            value=""
            onChange={(e) => fill(e.target.value)}
            aria-describedby={loadError ? `${pickId}-err` : undefined}
          >
            <option value="">{materials.length ? '— choose a material —' : 'No stored materials'}</option>
            {materials.map((m) => (
              <option key={m.id} value={m.id}>
                {m.name} (E{' '}
                {units === 'US' ? `${Math.round(mpaToPsi(m.elasticModulusMPa))} psi` : `${m.elasticModulusMPa} MPa`})
              </option>
            ))}
          </select>
          {loadError && (
            <p id={`${pickId}-err`} className="error-text">
              Stored materials could not be loaded: {loadError}
            </p>
          )}
        </div>
      )}
      <div className="grid gap-4 sm:grid-cols-2">
        <PlanTextField path={['material', 'name']} label="Name" optional className="sm:col-span-2" />
        <PlanNumberField
          path={['material', 'elasticModulus']}
          label="Elastic modulus E"
          unit={stress}
          hint={
            units === 'US'
              ? 'In psi: carbon steel about 29 Msi = 29000000'
              : 'In MPa: carbon steel about 200 GPa = 200000'
          }
        />
        <PlanNumberField path={['material', 'poissonRatio']} label="Poisson's ratio ν" hint="Steel about 0.30" />
        <PlanNumberField
          path={['material', 'yieldStrength']}
          label="Yield strength"
          unit={stress}
          hint="Minimum specified, for the fraction of yield."
        />
      </div>
    </PlanSection>
  );
}
