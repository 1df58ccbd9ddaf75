// One look per gauge outcome: colour (Okabe–Ito, as in global.css), a shape, a glyph and a word,
// so no outcome is told apart by colour alone. Shared by badges, plots, the map and legends.
import type { GaugeOutcome, TestVerdict } from '../../lib/reduction/types';

export type MarkerShape = 'circle' | 'triangle' | 'cross' | 'diamond';

export interface OutcomeLook {
  label: string;
  /** hex, for canvas and SVG; equals the --color-* token in global.css */
  color: string;
  shape: MarkerShape;
  /** the same shape as a text glyph */
  glyph: string;
  /** Tailwind text colour class for HTML */
  textClass: string;
}

export const OUTCOME_LOOK: Record<GaugeOutcome, OutcomeLook> = {
  'in-band': { label: 'In band', color: '#0072b2', shape: 'circle', glyph: '●', textClass: 'text-ok' },
  flagged: { label: 'Flagged', color: '#d55e00', shape: 'triangle', glyph: '▲', textClass: 'text-flag-ink' },
  excluded: { label: 'Excluded', color: '#6b6b6b', shape: 'cross', glyph: '✕', textClass: 'text-excluded' },
  'not-compared': {
    label: 'Not compared',
    color: '#cc79a7',
    shape: 'diamond',
    glyph: '◆',
    textClass: 'text-notcompared',
  },
};

export const OUTCOME_ORDER: GaugeOutcome[] = ['flagged', 'not-compared', 'excluded', 'in-band'];

export const VERDICT_LOOK: Record<TestVerdict, { label: string; glyph: string; color: string }> = {
  conforms: { label: 'Conforms', glyph: '✓', color: '#0072b2' },
  flagged: { label: 'Flagged', glyph: '▲', color: '#d55e00' },
  incomplete: { label: 'Incomplete', glyph: '◐', color: '#e69f00' },
};

/** Chart colours that are not outcomes: ink for measured, brass for predicted. */
export const CHART_COLORS = {
  ink: '#1d3557',
  inkLight: '#3f6189',
  brass: '#a86b12',
  bandFill: 'rgba(201, 138, 27, 0.16)',
  unloading: '#009e73',
  grid: 'rgba(29, 53, 87, 0.10)',
  axis: '#14273d',
} as const;

/** Colours for time-history channels, distinct from each other; labels carry the meaning. */
export const CHANNEL_COLORS = [
  '#0072b2',
  '#009e73',
  '#d55e00',
  '#cc79a7',
  '#56b4e9',
  '#e69f00',
  '#6a3d9a',
  '#999933',
  '#8c564b',
];

/** Worst outcome of a set (a rosette's grids): flagged, then in-band, then not-compared, then excluded. */
export function combineOutcomes(outcomes: readonly GaugeOutcome[]): GaugeOutcome {
  if (outcomes.length === 0) return 'not-compared';
  if (outcomes.includes('flagged')) return 'flagged';
  if (outcomes.includes('in-band')) return 'in-band';
  if (outcomes.includes('not-compared')) return 'not-compared';
  return 'excluded';
}
