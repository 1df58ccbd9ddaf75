import { useMemo, useRef } from 'react';
import SafetyCaution from '../review/SafetyCaution';
import FeatureList from './FeatureList';
import GaugePreviewTable from './GaugePreviewTable';
import MaterialSection from './MaterialSection';
import PlanGaugeTable from './PlanGaugeTable';
import PlanIssueSummary from './PlanIssueSummary';
import PlanToolbar from './PlanToolbar';
import ShellPreviewTable from './ShellPreviewTable';
import TestConditionsSection from './TestConditionsSection';
import TestConductSection from './TestConductSection';
import ToleranceSection from './ToleranceSection';
import UncertaintySection from './UncertaintySection';
import VesselSection from './VesselSection';
import { PlanEditorContext, type PlanEditorContextValue } from './plan-editor-context';
import { createBlankPlan, type PlanDraft } from './plan-draft';
import { usePlanEditorState } from './use-plan-editor-state';

export interface PlanEditorProps {
  /** `create`: a test name field and POST /api/tests; `edit`: PUT /api/tests/{testId}/plan */
  mode: 'create' | 'edit';
  testId?: number;
  /** the stored plan (edit) or a starting plan; defaults to a blank plan */
  initialPlan?: PlanDraft;
  initialName?: string;
  /** when set, every input is disabled and there is no save; the text says why */
  readOnlyReason?: string | null;
  /** after a create, go here; `{id}` is the new test's id */
  afterCreateHref?: string;
}

/** The whole test plan of DESIGN 4.1: form, validation beside each field, import/export and a live prediction. */
export default function PlanEditor({
  mode,
  testId,
  initialPlan,
  initialName,
  readOnlyReason = null,
  afterCreateHref = '/tests/{id}/plan',
}: PlanEditorProps) {
  const readOnly = readOnlyReason !== null;
  const s = usePlanEditorState({
    mode,
    testId,
    initialPlan: initialPlan ?? createBlankPlan(),
    initialName,
    readOnly,
    afterCreateHref,
  });
  const summaryRef = useRef<HTMLDivElement>(null);
  const ctx = useMemo<PlanEditorContextValue>(
    () => ({
      plan: s.plan,
      units: s.units,
      readOnly,
      preview: s.preview,
      setField: s.setField,
      update: s.update,
      errorsFor: s.errorsFor,
      touch: s.touch,
    }),
    [s.plan, s.units, readOnly, s.preview, s.setField, s.update, s.errorsFor, s.touch],
  );
  async function save() {
    const ok = await s.save();
    if (!ok) requestAnimationFrame(() => summaryRef.current?.focus());
  }

  return (
    <PlanEditorContext.Provider value={ctx}>
      <div className="space-y-5">
        {readOnly && (
          <p role="note" className="rounded-md border border-ink-800/20 bg-ink-50 px-4 py-3 text-sm">
            <strong>Read only.</strong> {readOnlyReason} Export is still available.
          </p>
        )}
        {mode === 'create' && (
          <div className="card py-4!">
            <label htmlFor="test-name" className="label">
              Test name
            </label>
            <input
              id="test-name"
              className={`field max-w-xl ${s.nameError ? 'border-flag!' : ''}`}
              value={s.name}
              maxLength={200}
              onChange={(e) => s.changeName(e.target.value)}
              placeholder="e.g. AR-102 hydrotest at 1.95 MPa"
              aria-invalid={!!s.nameError || undefined}
              aria-describedby={s.nameError ? 'test-name-error' : undefined}
            />
            {s.nameError && (
              <p id="test-name-error" className="error-text">
                {s.nameError}
              </p>
            )}
          </div>
        )}
        <div className="sticky top-0 z-20 -mx-1 bg-paper/95 px-1 py-1 backdrop-blur-sm">
          <PlanToolbar
            units={s.units}
            readOnly={readOnly}
            canSave={!readOnly}
            saving={s.saving}
            dirty={s.dirty}
            status={s.status}
            saveLabel={mode === 'create' ? 'Create test' : 'Save plan'}
            onUnits={s.switchUnits}
            onImport={(f) => void s.importFile(f)}
            onExport={s.exportFile}
            onSave={() => void save()}
          />
        </div>
        {s.showSummary && <PlanIssueSummary ref={summaryRef} issues={s.placed} nameError={s.nameError} />}
        <SafetyCaution />
        <div className="grid items-start gap-5 xl:grid-cols-[minmax(0,1fr)_minmax(0,26rem)] 2xl:grid-cols-[minmax(0,1fr)_minmax(0,30rem)]">
          <div className="grid min-w-0 gap-5">
            <div className="grid gap-5 lg:grid-cols-2">
              <VesselSection />
              <MaterialSection />
            </div>
            <TestConditionsSection />
            <TestConductSection />
            <FeatureList />
            <ToleranceSection />
            <UncertaintySection />
          </div>
          <aside aria-labelledby="plan-preview-h" className="card xl:sticky xl:top-20">
            <h2 id="plan-preview-h" className="text-lg font-semibold text-ink-900">
              Live prediction
            </h2>
            <p className="mb-3 text-xs text-ink-700">Linear elastic, outer surface, updating as you type.</p>
            <ShellPreviewTable />
          </aside>
        </div>
        <PlanGaugeTable />
        <section aria-labelledby="plan-grid-preview-h" className="card">
          <h2 id="plan-grid-preview-h" className="mb-1 text-lg font-semibold text-ink-900">
            Predicted strain per unit pressure, per gauge
          </h2>
          <p className="mb-3 text-sm text-ink-700">
            ε(θ) = εa cos²θ + εh sin²θ for each gauge and rosette grid; the measured slopes are compared with the model
            marked ✓.
          </p>
          <GaugePreviewTable />
        </section>
      </div>
    </PlanEditorContext.Provider>
  );
}
