import { forwardRef } from 'react';
import type { PlacedIssue } from './plan-fields';

interface Props {
  issues: PlacedIssue[];
  nameError: string | null;
}

function focusField(e: React.MouseEvent<HTMLAnchorElement>, id: string) {
  const el = document.getElementById(id);
  if (!el) return;
  e.preventDefault();
  el.scrollIntoView({ block: 'center', behavior: 'smooth' });
  el.focus({ preventScroll: true });
}

/** Every problem of the plan, each a link that moves focus to the field that shows it. */
const PlanIssueSummary = forwardRef<HTMLDivElement, Props>(function PlanIssueSummary({ issues, nameError }, ref) {
  const count = issues.length + (nameError ? 1 : 0);
  if (count === 0) return null;
  return (
    <div
      ref={ref}
      tabIndex={-1}
      role="alert"
      aria-labelledby="plan-issues-h"
      className="rounded-md border-2 border-flag bg-white p-4"
    >
      <h2 id="plan-issues-h" className="font-semibold text-flag-ink">
        {count} problem{count > 1 ? 's' : ''} to fix before this plan can be saved
      </h2>
      <ul className="mt-2 list-disc space-y-0.5 pl-5 text-sm">
        {nameError && (
          <li>
            <a href="#test-name" className="font-medium underline" onClick={(e) => focusField(e, 'test-name')}>
              Test name
            </a>
            : {nameError}
          </li>
        )}
        {issues.map((i, k) => {
          // a message that names its gauge is a whole sentence; others follow the field's label
          const whole = /^Gauge /.test(i.message);
          const lead = whole ? i.message : i.label;
          return (
            <li key={k} title={`plan field ${i.path}`}>
              {i.fieldId ? (
                <a href={`#${i.fieldId}`} className="font-medium underline" onClick={(e) => focusField(e, i.fieldId!)}>
                  {lead}
                </a>
              ) : (
                <span className="font-medium">{lead}</span>
              )}
              {!whole && `: ${i.message}`}
            </li>
          );
        })}
      </ul>
    </div>
  );
});
export default PlanIssueSummary;
