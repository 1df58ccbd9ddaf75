// The plan editor's state and actions: edits, unit switch, import, export, save, and which
// problems are shown where. Problems of a field show once it has been left, after an import and
// after a save attempt; the server's 422 issues are shown the same way until the next edit.
import { useCallback, useEffect, useMemo, useState } from 'react';
import { listPlanIssues, type PlanUnits } from '../../lib/reduction/browser';
import { api, ApiError } from '../api';
import { convertPlanUnits, setIn, type PlanDraft, type PlanPath } from './plan-draft';
import { placeIssues, type PlanIssue } from './plan-fields';
import { planFileName, readPlanText, serializePlan } from './plan-file';
import { buildPlanPreview } from './plan-preview';

export interface PlanEditorOptions {
  mode: 'create' | 'edit';
  testId?: number;
  initialPlan: PlanDraft;
  initialName?: string;
  readOnly: boolean;
  /** where to go after creating; `{id}` is replaced by the new test's id */
  afterCreateHref: string;
}
export type EditorStatus = { kind: 'ok' | 'error' | 'info'; text: string } | null;

const issuesOf = (err: ApiError): PlanIssue[] => {
  const d = err.details as { issues?: { path?: unknown; message?: unknown }[] } | null;
  return Array.isArray(d?.issues)
    ? d.issues.map((i) => ({ path: String(i.path ?? 'plan'), message: String(i.message ?? '') }))
    : [];
};

export function usePlanEditorState(o: PlanEditorOptions) {
  const [plan, setPlan] = useState<PlanDraft>(o.initialPlan);
  const [name, setName] = useState(o.initialName ?? '');
  const [nameError, setNameError] = useState<string | null>(null);
  const [revealed, setRevealed] = useState<Set<string> | 'all'>(() => (o.mode === 'edit' ? 'all' : new Set()));
  const [serverIssues, setServerIssues] = useState<PlanIssue[]>([]);
  const [status, setStatus] = useState<EditorStatus>(null);
  const [saving, setSaving] = useState(false);
  const [dirty, setDirty] = useState(false);

  const issues = useMemo(() => {
    const client = listPlanIssues(plan);
    const seen = new Set(client.map((i) => `${i.path}\u0000${i.message}`));
    return [...client, ...serverIssues.filter((i) => !seen.has(`${i.path}\u0000${i.message}`))];
  }, [plan, serverIssues]);
  const { placed, byField } = useMemo(() => placeIssues(issues, plan), [issues, plan]);
  const preview = useMemo(() => buildPlanPreview(plan), [plan]);
  const units: PlanUnits = plan.units === 'US' ? 'US' : 'SI';

  useEffect(() => {
    if (!dirty || o.readOnly) return;
    const warn = (e: BeforeUnloadEvent) => {
      e.preventDefault();
    };
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, [dirty, o.readOnly]);

  const edit = useCallback((producer: (p: PlanDraft) => PlanDraft) => {
    setPlan(producer);
    setServerIssues([]);
    setDirty(true);
    setStatus((st) => (st?.kind === 'error' || st?.kind === 'ok' ? null : st));
  }, []);
  const setField = useCallback((path: PlanPath, value: unknown) => edit((p) => setIn(p, path, value)), [edit]);
  const touch = useCallback(
    (id: string) => setRevealed((r) => (r === 'all' || r.has(id) ? r : new Set(r).add(id))),
    [],
  );
  const errorsFor = useCallback(
    (id: string) => (revealed === 'all' || revealed.has(id) ? (byField.get(id) ?? []) : []),
    [revealed, byField],
  );
  const switchUnits = (to: PlanUnits) => edit((p) => convertPlanUnits(p, to));
  const changeName = (v: string) => {
    setName(v);
    setNameError(null);
    setDirty(true);
  };

  async function importFile(file: File) {
    const read = readPlanText(await file.text(), file.name);
    if (!read.ok) {
      setStatus({ kind: 'error', text: `Not imported: ${read.message}` });
      return;
    }
    edit(() => read.plan);
    setRevealed('all');
    if (o.mode === 'create' && !name.trim() && typeof read.plan.name === 'string') setName(read.plan.name);
    const n = listPlanIssues(read.plan).length;
    setStatus(
      n
        ? { kind: 'error', text: `Imported ${file.name}: ${n} problem${n > 1 ? 's' : ''} to fix, listed above.` }
        : { kind: 'ok', text: `Imported ${file.name}; the plan is valid.` },
    );
  }

  function exportFile() {
    const url = URL.createObjectURL(new Blob([serializePlan(plan)], { type: 'application/json' }));
    const a = Object.assign(document.createElement('a'), {
      href: url,
      download: planFileName(name || (o.testId ? `test-${o.testId}` : 'new-test')),
    });
    document.body.append(a);
    a.click();
    a.remove();
    setTimeout(() => URL.revokeObjectURL(url), 1000);
    if (issues.length)
      setStatus({
        kind: 'info',
        text: `Exported with ${issues.length} unresolved problem${issues.length > 1 ? 's' : ''}: the file will not load until they are fixed.`,
      });
  }

  async function save(): Promise<boolean> {
    setRevealed('all');
    const nameProblem = o.mode === 'create' && !name.trim() ? 'Give the test a name.' : null;
    setNameError(nameProblem);
    const count = issues.length + (nameProblem ? 1 : 0);
    if (count) {
      setStatus({ kind: 'error', text: `Not saved: ${count} problem${count > 1 ? 's' : ''} to fix, listed above.` });
      return false;
    }
    setSaving(true);
    setStatus({ kind: 'info', text: 'Saving…' });
    try {
      if (o.mode === 'create') {
        const r = await api<{ id: number }>('/api/tests', { method: 'POST', jsonBody: { name: name.trim(), plan } });
        setDirty(false);
        window.location.assign(o.afterCreateHref.replace('{id}', String(r.id)));
      } else {
        await api(`/api/tests/${o.testId}/plan`, { method: 'PUT', jsonBody: plan });
        setDirty(false);
        setStatus({
          kind: 'ok',
          text: `Saved at ${new Date().toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit' })}. A changed plan needs a new reduction.`,
        });
      }
      return true;
    } catch (err) {
      const e = err as ApiError;
      const found = e instanceof ApiError ? issuesOf(e) : [];
      const nameIssue = found.find((i) => i.path === 'name');
      if (nameIssue) setNameError(nameIssue.message);
      setServerIssues(
        found.filter((i) => i.path !== 'name').map((i) => ({ ...i, path: i.path.replace(/^plan\.?/, '') || 'plan' })),
      );
      setStatus({ kind: 'error', text: `Not saved: ${e.message}` });
      return false;
    } finally {
      setSaving(false);
    }
  }

  return {
    plan,
    units,
    name,
    nameError,
    placed,
    preview,
    status,
    saving,
    dirty,
    errorsFor,
    setField,
    update: edit,
    touch,
    switchUnits,
    changeName,
    importFile,
    exportFile,
    save,
    showSummary: revealed === 'all',
  };
}
