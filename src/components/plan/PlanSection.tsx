import type { ReactNode } from 'react';
import { SectionErrors } from './PlanField';

interface Props {
  id: string;
  title: string;
  intro?: ReactNode;
  children: ReactNode;
  className?: string;
  actions?: ReactNode;
}

/** A card of the plan editor; its id receives problems that name the section as a whole. */
export default function PlanSection({ id, title, intro, children, className, actions }: Props) {
  return (
    <section id={id} tabIndex={-1} aria-labelledby={`${id}-h`} className={`card ${className ?? ''}`}>
      <div className="mb-3 flex flex-wrap items-baseline justify-between gap-2">
        <h2 id={`${id}-h`} className="text-lg font-semibold text-ink-900">
          {title}
        </h2>
        {actions}
      </div>
      {intro && <div className="-mt-1 mb-3 text-sm text-ink-700">{intro}</div>}
      <SectionErrors id={id} />
      {children}
    </section>
  );
}
