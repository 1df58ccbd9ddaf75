// What every field of the plan editor reads: the plan, its units, who may edit, and the problems
// to show beside each input. Fields find their value and their id from a plan path.
import { createContext, useContext } from 'react';
import type { PlanUnits } from '../../lib/reduction/browser';
import type { PlanPreview } from './plan-preview';
import { getIn, type PlanDraft, type PlanPath } from './plan-draft';
import { fieldIdForPath } from './plan-fields';

export interface PlanEditorContextValue {
  plan: PlanDraft;
  units: PlanUnits;
  readOnly: boolean;
  preview: PlanPreview | null;
  setField: (path: PlanPath, value: unknown) => void;
  update: (producer: (plan: PlanDraft) => PlanDraft) => void;
  /** problems shown at an id (only after the field was left, an import or a save attempt) */
  errorsFor: (fieldId: string) => string[];
  /** mark a field as visited so its problems show */
  touch: (fieldId: string) => void;
}

export const PlanEditorContext = createContext<PlanEditorContextValue | null>(null);

export function usePlanEditor(): PlanEditorContextValue {
  const ctx = useContext(PlanEditorContext);
  if (!ctx) throw new Error('plan fields must be inside <PlanEditorContext.Provider>');
  return ctx;
}

/** One field's id, value, problems and setter; `describedBy` ties the error text to the input. */
export function usePlanField(path: PlanPath) {
  const ctx = usePlanEditor();
  const id = fieldIdForPath(path);
  const errors = ctx.errorsFor(id);
  return {
    id,
    value: getIn(ctx.plan, path),
    errors,
    errorId: `${id}-error`,
    invalid: errors.length > 0,
    readOnly: ctx.readOnly,
    set: (value: unknown) => ctx.setField(path, value),
    touch: () => ctx.touch(id),
  };
}
