import { useEffect, useRef, useState, type SubmitEvent } from 'react';
import type { PlanUnits } from '../../lib/reduction/browser';
import { api, ApiError } from '../api';
import { FormNumberField, FormSelectField, FormTextField } from './FormField';
import VesselFeatureFields from './VesselFeatureFields';
import {
  convertVesselForm,
  formKeyForServerPath,
  lengthUnit,
  vesselFormToBody,
  vesselToForm,
  type FormIssues,
  type MaterialRow,
  type VesselRow,
} from './vessel-form';

interface Props {
  idPrefix: string;
  units: PlanUnits;
  materials: MaterialRow[];
  /** the vessel to edit (PATCH), or null to create one (POST) */
  vessel: VesselRow | null;
  onSaved: (id: number) => void;
  onCancel?: () => void;
}

/** Issues from an API error, keyed like the form's fields; 409 tag-taken lands on the tag. */
export function serverIssues(err: unknown): FormIssues {
  if (!(err instanceof ApiError)) return { form: (err as Error).message };
  if (err.code === 'tag-taken') return { tag: err.message };
  const list = (err.details as { issues?: { path: string; message: string }[] } | null)?.issues ?? [];
  const out: FormIssues = {};
  for (const i of list) out[formKeyForServerPath(i.path) || 'form'] = i.message;
  return Object.keys(out).length ? out : { form: err.message };
}

/** Create or edit a vessel in the shown units; checked with zod here and again by the server. */
export default function VesselForm({ idPrefix, units, materials, vessel, onSaved, onCancel }: Props) {
  const [form, setForm] = useState(() => vesselToForm(vessel, units));
  const [issues, setIssues] = useState<FormIssues>({});
  const [busy, setBusy] = useState(false);
  const shownUnits = useRef(units);
  useEffect(() => {
    const from = shownUnits.current;
    setForm((f) => convertVesselForm(f, from, units));
    shownUnits.current = units;
  }, [units]);
  const len = lengthUnit(units);
  const set = (patch: Partial<typeof form>) => setForm((f) => ({ ...f, ...patch }));
  const id = (k: string) => `${idPrefix}-${k}`;

  async function submit(e: SubmitEvent) {
    e.preventDefault();
    const r = vesselFormToBody(form, units);
    if (!r.ok) {
      setIssues(r.issues);
      document.getElementById(id(Object.keys(r.issues)[0]!))?.focus();
      return;
    }
    setBusy(true);
    setIssues({});
    try {
      const saved = vessel
        ? await api<{ id: number }>(`/api/vessels/${vessel.id}`, { method: 'PATCH', jsonBody: r.body })
        : await api<{ id: number }>('/api/vessels', { method: 'POST', jsonBody: r.body });
      onSaved(saved.id);
      if (!vessel) setForm(vesselToForm(null, units));
    } catch (err) {
      setIssues(serverIssues(err));
    } finally {
      setBusy(false);
    }
  }

  return (
    <form onSubmit={submit} noValidate className="space-y-4" aria-label={vessel ? 'Edit vessel' : 'New vessel'}>
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
        <FormTextField
          id={id('tag')}
          label="Tag"
          value={form.tag}
          onText={(v) => set({ tag: v })}
          error={issues.tag}
          maxLength={60}
          hint="Unique, as stamped on the nameplate."
        />
        <FormTextField
          id={id('name')}
          label="Name"
          value={form.name}
          onText={(v) => set({ name: v })}
          error={issues.name}
          maxLength={160}
          className="lg:col-span-3"
        />
        <FormSelectField
          id={id('shape')}
          label="Shape"
          value={form.shape}
          onPick={(v) => set({ shape: v })}
          error={issues.shape}
          options={[
            { value: 'cylinder', label: 'Cylinder' },
            { value: 'sphere', label: 'Sphere' },
          ]}
        />
        <FormSelectField
          id={id('ends')}
          label="Ends"
          value={form.ends}
          onPick={(v) => set({ ends: v })}
          error={issues.ends}
          options={[
            { value: 'closed', label: 'Closed (heads)' },
            { value: 'open', label: 'Open' },
          ]}
        />
        <FormSelectField
          id={id('materialId')}
          label="Material"
          value={form.materialId}
          onPick={(v) => set({ materialId: v })}
          error={issues.materialId}
          className="lg:col-span-2"
          options={[
            { value: '', label: '— none —' },
            ...materials.map((m) => ({ value: String(m.id), label: m.name })),
          ]}
        />
        <FormNumberField
          id={id('insideDiameter')}
          label="Inside diameter"
          unit={len}
          value={form.insideDiameter}
          onValue={(v) => set({ insideDiameter: v })}
          error={issues.insideDiameter}
        />
        <FormNumberField
          id={id('wallThickness')}
          label="Wall thickness"
          unit={len}
          value={form.wallThickness}
          onValue={(v) => set({ wallThickness: v })}
          error={issues.wallThickness}
        />
        {form.shape !== 'sphere' && (
          <FormNumberField
            id={id('length')}
            label="Shell length"
            unit={len}
            value={form.length}
            onValue={(v) => set({ length: v })}
            error={issues.length}
            hint="Seam to seam."
          />
        )}
      </div>
      <VesselFeatureFields
        idPrefix={idPrefix}
        units={units}
        features={form.features}
        issues={issues}
        onChange={(features) => set({ features })}
      />
      {issues.form && (
        <p role="alert" className="error-text">
          {issues.form}
        </p>
      )}
      {Object.keys(issues).length > 0 && !issues.form && (
        <p role="alert" className="error-text">
          Not saved: fix the fields marked above.
        </p>
      )}
      <div className="flex flex-wrap items-center gap-2">
        <button type="submit" className="btn-primary" disabled={busy}>
          {busy ? 'Saving…' : vessel ? 'Save vessel' : 'Create vessel'}
        </button>
        {onCancel && (
          <button type="button" className="btn-secondary" onClick={onCancel}>
            Cancel
          </button>
        )}
        <span className="text-xs text-ink-700">
          Stored in SI; saved with {units === 'US' ? 'US customary' : 'SI'} as the vessel's display preference.
        </span>
      </div>
    </form>
  );
}
