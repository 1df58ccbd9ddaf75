// Page geometry and colours of the PDF report. Colours are chosen to survive greyscale printing:
// meaning is also carried by text (outcome words) and marker shape, never by colour alone.
import type { GaugeOutcome, TestVerdict } from '../../lib/reduction/types';

/** A4 portrait in points (1/72 in). */
export const PAGE = { width: 595.28, height: 841.89 } as const;
export const MARGIN = { top: 54, bottom: 70, left: 44, right: 44 } as const;
export const CONTENT_WIDTH = PAGE.width - MARGIN.left - MARGIN.right;
/** Lowest y that body content may reach; the footer lives below it. */
export const CONTENT_BOTTOM = PAGE.height - MARGIN.bottom;

export const COLOR = {
  ink: '#1a1f2b',
  muted: '#5b6575',
  faint: '#8a93a3',
  rule: '#c9ced6',
  grid: '#e6e9ee',
  zebra: '#f4f6f8',
  headerFill: '#e9eef4',
  accent: '#1f4e79',
  band: '#d9e5f2',
  unloading: '#b4531c',
  draft: '#b3261e',
} as const;

export const OUTCOME_COLOR: Record<GaugeOutcome, string> = {
  'in-band': '#2e6b34',
  flagged: '#b3261e',
  excluded: '#6b4c8a',
  'not-compared': '#5b6575',
};

export const VERDICT_COLOR: Record<TestVerdict, string> = {
  conforms: '#2e6b34',
  flagged: '#b3261e',
  incomplete: '#9a6700',
};
