import { useEffect, useRef, useState, type SubmitEvent } from 'react';
import type { PlanUnits } from '../../lib/reduction/browser';
import { api } from '../api';
import { FormNumberField, FormTextField } from './FormField';
import { serverIssues } from './VesselForm';
import {
  convertMaterialForm,
  materialFormToBody,
  stressUnit,
  type FormIssues,
  type MaterialForm as Values,
} from './vessel-form';

interface Props {
  idPrefix: string;
  units: PlanUnits;
  onSaved: (id: number) => void;
}

const blank: Values = { name: '', elasticModulus: undefined, poissonRatio: undefined, yieldStrength: undefined };

/** Create a material (values at test temperature) in the shown units. */
export default function MaterialForm({ idPrefix, units, onSaved }: Props) {
  const [form, setForm] = useState<Values>(blank);
  const [issues, setIssues] = useState<FormIssues>({});
  const [busy, setBusy] = useState(false);
  const shownUnits = useRef(units);
  useEffect(() => {
    const from = shownUnits.current;
    setForm((f) => convertMaterialForm(f, from, units));
    shownUnits.current = units;
  }, [units]);
  const s = stressUnit(units);
  const id = (k: string) => `${idPrefix}-${k}`;

  async function submit(e: SubmitEvent) {
    e.preventDefault();
    const r = materialFormToBody(form, units);
    if (!r.ok) {
      setIssues(r.issues);
      document.getElementById(id(Object.keys(r.issues)[0]!))?.focus();
      return;
    }
    setBusy(true);
    setIssues({});
    try {
      const saved = await api<{ id: number }>('/api/materials', { method: 'POST', jsonBody: r.body });
      setForm(blank);
      onSaved(saved.id);
    } catch (err) {
      setIssues(serverIssues(err));
    } finally {
      setBusy(false);
    }
  }

  return (
    <form onSubmit={submit} noValidate className="space-y-4" aria-label="New material">
      <div className="grid gap-4 sm:grid-cols-2">
        <FormTextField
          id={id('name')}
          label="Name"
          value={form.name}
          onText={(v) => setForm({ ...form, name: v })}
          error={issues.name}
          maxLength={160}
          className="sm:col-span-2"
        />
        <FormNumberField
          id={id('elasticModulus')}
          label="Elastic modulus E"
          unit={s}
          value={form.elasticModulus}
          onValue={(v) => setForm({ ...form, elasticModulus: v })}
          error={issues.elasticModulus}
          hint={units === 'US' ? 'Carbon steel about 29000000 psi (29 Msi)' : 'Carbon steel about 200000 MPa (200 GPa)'}
        />
        <FormNumberField
          id={id('poissonRatio')}
          label="Poisson's ratio ν"
          value={form.poissonRatio}
          onValue={(v) => setForm({ ...form, poissonRatio: v })}
          error={issues.poissonRatio}
        />
        <FormNumberField
          id={id('yieldStrength')}
          label="Yield strength"
          unit={s}
          value={form.yieldStrength}
          onValue={(v) => setForm({ ...form, yieldStrength: v })}
          error={issues.yieldStrength}
        />
      </div>
      {issues.form && (
        <p role="alert" className="error-text">
          {issues.form}
        </p>
      )}
      <button type="submit" className="btn-primary" disabled={busy}>
        {busy ? 'Saving…' : 'Create material'}
      </button>
    </form>
  );
}
