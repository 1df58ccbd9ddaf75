// Labelled inputs for the vessel and material forms (not bound to a plan): the label, the input,
// and the problem tied to it with aria-invalid and aria-describedby.
import type { ReactNode } from 'react';
import NumberInput from '../plan/NumberInput';
import type { NumberValue } from '../plan/plan-draft';

interface Base {
  id: string;
  label: ReactNode;
  unit?: string;
  error?: string;
  hint?: string;
  className?: string;
  hideLabel?: boolean;
}

function Label({ id, label, unit, hideLabel }: Base) {
  return (
    <label htmlFor={id} className={hideLabel ? 'sr-only' : 'label'}>
      {label}
      {unit && <span className="font-normal text-ink-700"> ({unit})</span>}
    </label>
  );
}
const aria = (id: string, error?: string, hint?: string) => ({
  'aria-invalid': error ? true : undefined,
  'aria-describedby': [error ? `${id}-error` : null, hint ? `${id}-hint` : null].filter(Boolean).join(' ') || undefined,
});
function Below({ id, error, hint }: Base) {
  return (
    <>
      {hint && (
        <p id={`${id}-hint`} className="mt-1 text-xs text-ink-700">
          {hint}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} className="error-text text-xs!">
          {error}
        </p>
      )}
    </>
  );
}

export function FormNumberField(
  p: Base & { value: NumberValue; onValue: (v: NumberValue) => void; placeholder?: string },
) {
  return (
    <div className={p.className}>
      <Label {...p} />
      <NumberInput
        id={p.id}
        value={p.value}
        onValue={p.onValue}
        placeholder={p.placeholder}
        className={p.error ? 'border-flag!' : ''}
        {...aria(p.id, p.error, p.hint)}
      />
      <Below {...p} />
    </div>
  );
}

export function FormTextField(p: Base & { value: string; onText: (v: string) => void; maxLength?: number }) {
  return (
    <div className={p.className}>
      <Label {...p} />
      <input
        id={p.id}
        className={`field ${p.error ? 'border-flag!' : ''}`}
        value={p.value}
        maxLength={p.maxLength}
        onChange={(e) => p.onText(e.target.value)}
        autoComplete="off"
        {...aria(p.id, p.error, p.hint)}
      />
      <Below {...p} />
    </div>
  );
}

export function FormSelectField(
  p: Base & { value: string; onPick: (v: string) => void; options: { value: string; label: string }[] },
) {
  return (
    <div className={p.className}>
      <Label {...p} />
      <select
        id={p.id}
        className={`field ${p.error ? 'border-flag!' : ''}`}
        value={p.value}
        onChange={(e) => p.onPick(e.target.value)}
        {...aria(p.id, p.error, p.hint)}
      >
        {p.options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
      <Below {...p} />
    </div>
  );
}
