import type { PlanUnits } from '../../lib/reduction/browser';
import { FormNumberField, FormSelectField } from './FormField';
import { lengthUnit, type FeatureForm, type FormIssues } from './vessel-form';

interface Props {
  idPrefix: string;
  units: PlanUnits;
  features: FeatureForm[];
  issues: FormIssues;
  onChange: (features: FeatureForm[]) => void;
}

const KINDS = [
  { value: 'nozzle', label: 'Nozzle' },
  { value: 'support', label: 'Support' },
  { value: 'head', label: 'Head seam' },
  { value: 'thickness-change', label: 'Thickness change' },
];

/** The vessel's discontinuities as editable rows. */
export default function VesselFeatureFields({ idPrefix, units, features, issues, onChange }: Props) {
  const len = lengthUnit(units);
  const set = (i: number, patch: Partial<FeatureForm>) =>
    onChange(features.map((f, k) => (k === i ? { ...f, ...patch } : f)));
  return (
    <fieldset className="space-y-2">
      <legend className="label">Discontinuities (nozzles, supports, seams)</legend>
      {features.length === 0 && (
        <p className="text-sm text-ink-700">None listed; the head seams at both ends are always counted.</p>
      )}
      {features.length > 0 && (
        <div
          aria-hidden="true"
          className="hidden gap-2 px-2 text-xs font-semibold text-ink-700 sm:grid sm:grid-cols-[10rem_8rem_7rem_7rem_auto]"
        >
          <span>Kind</span>
          <span>Axial position ({len})</span>
          <span>Clock (°, blank = all round)</span>
          <span>Size ({len})</span>
          <span />
        </div>
      )}
      {features.map((f, i) => {
        const id = `${idPrefix}-features-${i}`;
        const n = `Feature ${i + 1}`;
        return (
          <div
            key={i}
            className="grid grid-cols-2 items-start gap-2 rounded-md bg-ink-50 p-2 sm:grid-cols-[10rem_8rem_7rem_7rem_auto]"
          >
            <FormSelectField
              id={`${id}-kind`}
              label={`${n} kind`}
              hideLabel
              value={f.kind}
              onPick={(v) => set(i, { kind: v })}
              options={KINDS}
              error={issues[`features-${i}-kind`]}
            />
            <FormNumberField
              id={`${id}-axialPosition`}
              label={`${n} axial position`}
              unit={len}
              hideLabel
              value={f.axialPosition}
              onValue={(v) => set(i, { axialPosition: v })}
              error={issues[`features-${i}-axialPosition`]}
            />
            <FormNumberField
              id={`${id}-clockDeg`}
              label={`${n} clock position`}
              unit="degrees"
              hideLabel
              placeholder="all round"
              value={f.clockDeg}
              onValue={(v) => set(i, { clockDeg: v })}
              error={issues[`features-${i}-clockDeg`]}
            />
            <FormNumberField
              id={`${id}-size`}
              label={`${n} size`}
              unit={len}
              hideLabel
              value={f.size}
              onValue={(v) => set(i, { size: v })}
              error={issues[`features-${i}-size`]}
            />
            <button
              type="button"
              className="btn-secondary justify-self-start"
              onClick={() => onChange(features.filter((_, k) => k !== i))}
              aria-label={`Remove ${n.toLowerCase()}`}
            >
              Remove
            </button>
          </div>
        );
      })}
      <button
        type="button"
        className="btn-secondary"
        onClick={() =>
          onChange([...features, { kind: 'nozzle', axialPosition: undefined, clockDeg: undefined, size: undefined }])
        }
      >
        Add feature
      </button>
    </fieldset>
  );
}
