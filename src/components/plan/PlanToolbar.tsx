import { useRef } from 'react';
import type { PlanUnits } from '../../lib/reduction/browser';
import UnitSystemToggle from '../vessels/UnitSystemToggle';
import type { EditorStatus } from './use-plan-editor-state';

interface Props {
  units: PlanUnits;
  readOnly: boolean;
  canSave: boolean;
  saving: boolean;
  dirty: boolean;
  status: EditorStatus;
  saveLabel: string;
  onUnits: (u: PlanUnits) => void;
  onImport: (file: File) => void;
  onExport: () => void;
  onSave: () => void;
}

/** Units, import, export and save, with the outcome of the last action. */
export default function PlanToolbar({
  units,
  readOnly,
  canSave,
  saving,
  dirty,
  status,
  saveLabel,
  onUnits,
  onImport,
  onExport,
  onSave,
}: Props) {
  const fileRef = useRef<HTMLInputElement>(null);
  const tone = status?.kind === 'error' ? 'text-flag-ink' : status?.kind === 'ok' ? 'text-ok' : 'text-ink-700';
  return (
    <div className="flex flex-wrap items-center gap-x-6 gap-y-3 card py-3!">
      <UnitSystemToggle
        name="plan-units"
        id="plan-units"
        value={units}
        onChange={onUnits}
        disabled={readOnly}
        hint="Switching converts every length, pressure and stress."
      />
      <div className="flex flex-wrap items-center gap-2">
        {!readOnly && (
          <label
            htmlFor="plan-import"
            className="btn-secondary cursor-pointer focus-within:outline-3 focus-within:outline-brass-500"
          >
            Import plan JSON…
            <input
              ref={fileRef}
              id="plan-import"
              type="file"
              accept="application/json,.json"
              className="sr-only"
              onChange={(e) => {
                const f = e.target.files?.[0];
                if (f) onImport(f);
                if (fileRef.current) fileRef.current.value = '';
              }}
            />
          </label>
        )}
        <button type="button" className="btn-secondary" onClick={onExport}>
          Export plan JSON
        </button>
        {canSave && !readOnly && (
          <button type="button" className="btn-primary" onClick={onSave} disabled={saving}>
            {saving ? 'Saving…' : saveLabel}
          </button>
        )}
      </div>
      <p role="status" aria-live="polite" className={`min-w-0 basis-full text-sm font-medium empty:hidden ${tone}`}>
        {status?.text ?? (dirty && !readOnly ? 'Unsaved changes.' : '')}
      </p>
    </div>
  );
}
