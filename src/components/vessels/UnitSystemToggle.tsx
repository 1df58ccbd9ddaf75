import type { PlanUnits } from '../../lib/reduction/browser';

interface Props {
  name: string;
  id?: string;
  value: PlanUnits;
  onChange: (u: PlanUnits) => void;
  disabled?: boolean;
  hint?: string;
}

const OPTIONS: { value: PlanUnits; label: string; detail: string }[] = [
  { value: 'SI', label: 'SI', detail: 'MPa, mm' },
  { value: 'US', label: 'US customary', detail: 'psi, in' },
];

/** SI / US customary as a pair of radio buttons; the first takes `id` so a problem link can focus it. */
export default function UnitSystemToggle({ name, id, value, onChange, disabled, hint }: Props) {
  return (
    <fieldset
      className="flex flex-wrap items-center gap-x-3 gap-y-1"
      disabled={disabled}
      aria-describedby={hint ? `${name}-hint` : undefined}
    >
      <legend className="sr-only">Units</legend>
      <span aria-hidden="true" className="text-sm font-semibold text-ink-900">
        Units
      </span>
      <div className="inline-flex overflow-hidden rounded-md border border-ink-800/25 bg-white">
        {OPTIONS.map((o, k) => (
          <label
            key={o.value}
            className={`flex cursor-pointer items-center gap-1.5 px-3 py-1.5 text-sm focus-within:outline-3 focus-within:-outline-offset-3 focus-within:outline-brass-500 ${value === o.value ? 'bg-ink-800 text-white' : 'text-ink-900 hover:bg-ink-50'} ${k ? 'border-l border-ink-800/25' : ''}`}
          >
            <input
              type="radio"
              className="sr-only"
              name={name}
              id={k === 0 ? id : undefined}
              value={o.value}
              checked={value === o.value}
              onChange={() => onChange(o.value)}
            />
            <span className="font-semibold">{o.label}</span>{' '}
            <span className={value === o.value ? 'text-ink-100' : 'text-ink-700'}>({o.detail})</span>
          </label>
        ))}
      </div>
      {hint && (
        <span id={`${name}-hint`} className="text-xs text-ink-700">
          {hint}
        </span>
      )}
    </fieldset>
  );
}
