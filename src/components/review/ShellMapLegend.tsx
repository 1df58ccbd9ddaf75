import type { ReactNode } from 'react';
import { OutcomeLegend } from './OutcomeLegend';

/** Key to the developed shell map: features, edge zones and outcome markers. */
export default function ShellMapLegend({ hatchId }: { hatchId: string }) {
  const item = (swatch: ReactNode, text: string) => (
    <li className="inline-flex items-center gap-1.5">
      <svg width="26" height="16" viewBox="0 0 26 16" aria-hidden="true">
        {swatch}
      </svg>
      {text}
    </li>
  );
  return (
    <div className="space-y-1">
      <ul className="flex flex-wrap gap-x-5 gap-y-1 text-sm text-ink-900" aria-label="Map key">
        {item(
          <rect x="1" y="1" width="24" height="14" fill={`url(#${hatchId})`} stroke="#e69f00" />,
          'Edge zone (reported, not compared)',
        )}
        {item(<line x1="13" y1="0" x2="13" y2="16" stroke="#0d1b2a" strokeWidth="4" />, 'Head seam')}
        {item(<circle cx="13" cy="8" r="6" fill="#fff" stroke="#0d1b2a" strokeWidth="2" />, 'Nozzle')}
        {item(<rect x="7" y="0" width="12" height="16" fill="rgba(29,53,87,0.22)" stroke="#1d3557" />, 'Support')}
        {item(
          <line x1="13" y1="0" x2="13" y2="16" stroke="#1d3557" strokeWidth="2" strokeDasharray="4 3" />,
          'Thickness change',
        )}
        {item(
          <>
            <line x1="3" y1="8" x2="23" y2="8" stroke="#0d1b2a" strokeWidth="2" />
            <line x1="13" y1="1" x2="13" y2="15" stroke="#0d1b2a" strokeWidth="2" />
          </>,
          'Gauge direction (─ axial, │ hoop)',
        )}
      </ul>
      <OutcomeLegend />
    </div>
  );
}
