// Labelled inputs bound to a plan path: number, text and choice. Each ties its problems to the
// input with aria-invalid and aria-describedby.
import type { ReactNode } from 'react';
import NumberInput from './NumberInput';
import { cleanFloat, type NumberValue, type PlanPath } from './plan-draft';
import { usePlanEditor, usePlanField } from './plan-editor-context';

interface BaseProps {
  path: PlanPath;
  label: ReactNode;
  unit?: string;
  hint?: ReactNode;
  /** label for screen readers only (table cells, where the column header is the visible label) */
  hideLabel?: boolean;
  className?: string;
  inputClassName?: string;
}

/** The problems of one field, announced with the input. */
export function FieldErrors({ id, errors }: { id: string; errors: string[] }) {
  if (errors.length === 0) return null;
  return (
    <p id={id} className="error-text text-xs!">
      {errors.join('; ')}
    </p>
  );
}

function describedBy(errorId: string, invalid: boolean, hintId?: string) {
  return [invalid ? errorId : null, hintId ?? null].filter(Boolean).join(' ') || undefined;
}

function FieldLabel({
  id,
  label,
  unit,
  hideLabel,
}: {
  id: string;
  label: ReactNode;
  unit?: string;
  hideLabel?: boolean;
}) {
  return (
    <label htmlFor={id} className={hideLabel ? 'sr-only' : 'label'}>
      {label}
      {unit && <span className="font-normal text-ink-700"> ({unit})</span>}
    </label>
  );
}

/** A number at a plan path; empty removes the key (optional fields fall back to their default). */
export function PlanNumberField({
  path,
  label,
  unit,
  hint,
  hideLabel,
  className,
  inputClassName,
  placeholder,
  percent = false,
}: BaseProps & {
  placeholder?: string;
  /** the plan stores a fraction (0.05); the person types and reads percent (5) */
  percent?: boolean;
}) {
  const f = usePlanField(path);
  const hintId = hint ? `${f.id}-hint` : undefined;
  const shown = percent && typeof f.value === 'number' ? cleanFloat(f.value * 100) : f.value;
  const store = (v: NumberValue) => f.set(percent && typeof v === 'number' ? cleanFloat(v / 100) : v);
  return (
    <div className={className}>
      <FieldLabel id={f.id} label={label} unit={unit} hideLabel={hideLabel} />
      <NumberInput
        id={f.id}
        value={shown}
        onValue={store}
        onBlur={f.touch}
        disabled={f.readOnly}
        placeholder={placeholder}
        aria-invalid={f.invalid || undefined}
        aria-describedby={describedBy(f.errorId, f.invalid, hintId)}
        className={`${f.invalid ? 'border-flag!' : ''} ${inputClassName ?? ''}`}
      />
      {hint && (
        <p id={hintId} className="mt-1 text-xs text-ink-700">
          {hint}
        </p>
      )}
      <FieldErrors id={f.errorId} errors={f.errors} />
    </div>
  );
}

/** Text at a plan path; with `optional`, empty text removes the key. */
export function PlanTextField({
  path,
  label,
  hint,
  hideLabel,
  className,
  inputClassName,
  optional = false,
  placeholder,
}: BaseProps & { optional?: boolean; placeholder?: string }) {
  const f = usePlanField(path);
  const hintId = hint ? `${f.id}-hint` : undefined;
  return (
    <div className={className}>
      <FieldLabel id={f.id} label={label} hideLabel={hideLabel} />
      <input
        id={f.id}
        type="text"
        className={`field ${f.invalid ? 'border-flag!' : ''} ${inputClassName ?? ''}`}
        value={typeof f.value === 'string' ? f.value : f.value === undefined ? '' : String(f.value)}
        onChange={(e) => f.set(optional && e.target.value === '' ? undefined : e.target.value)}
        onBlur={f.touch}
        disabled={f.readOnly}
        placeholder={placeholder}
        aria-invalid={f.invalid || undefined}
        aria-describedby={describedBy(f.errorId, f.invalid, hintId)}
        autoComplete="off"
        spellCheck={false}
      />
      {hint && (
        <p id={hintId} className="mt-1 text-xs text-ink-700">
          {hint}
        </p>
      )}
      <FieldErrors id={f.errorId} errors={f.errors} />
    </div>
  );
}

/** A choice at a plan path. `onPick` replaces the plain set (e.g. a gauge kind resizes its channels). */
/** `defaultValue` is what the schema assumes when the key is absent (shown selected, not written). */
export function PlanSelectField({
  path,
  label,
  hint,
  hideLabel,
  className,
  inputClassName,
  options,
  onPick,
  defaultValue,
}: BaseProps & {
  options: { value: string; label: string }[];
  onPick?: (value: string) => void;
  defaultValue?: string;
}) {
  const f = usePlanField(path);
  const hintId = hint ? `${f.id}-hint` : undefined;
  const value = typeof f.value === 'string' ? f.value : f.value === undefined && defaultValue ? defaultValue : '';
  const known = options.some((o) => o.value === value);
  return (
    <div className={className}>
      <FieldLabel id={f.id} label={label} hideLabel={hideLabel} />
      <select
        id={f.id}
        className={`field ${f.invalid ? 'border-flag!' : ''} ${inputClassName ?? ''}`}
        value={value}
        disabled={f.readOnly}
        onChange={(e) => (onPick ? onPick(e.target.value) : f.set(e.target.value))}
        onBlur={f.touch}
        aria-invalid={f.invalid || undefined}
        aria-describedby={describedBy(f.errorId, f.invalid, hintId)}
      >
        {!known && <option value={value}>{value === '' ? '— choose —' : `${value} (not valid)`}</option>}
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
      {hint && (
        <p id={hintId} className="mt-1 text-xs text-ink-700">
          {hint}
        </p>
      )}
      <FieldErrors id={f.errorId} errors={f.errors} />
    </div>
  );
}

/** Problems that belong to a whole section (e.g. "must list at least one gauge"). */
export function SectionErrors({ id }: { id: string }) {
  const { errorsFor } = usePlanEditor();
  const errors = errorsFor(id);
  if (errors.length === 0) return null;
  return (
    <p role="alert" className="error-text">
      {errors.join('; ')}
    </p>
  );
}
