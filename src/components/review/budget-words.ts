// Words and numbers for the uncertainty budget (DESIGN 3.4) in the review: which input dominates
// a gauge's band, and each input's uncertainty as the plan states it. Pure.
import { UNCERTAINTY_LABELS } from '../../lib/reduction/browser';
import type { BudgetEntry, GaugeResult, TransverseCorrection, YieldSurface } from '../../lib/reduction/types';
import { formatFixed, formatPercent } from '../../lib/ui-format';

/** The input with the largest contribution, or null when the result has no budget (an engine 1 result). */
export function dominantInput(g: Pick<GaugeResult, 'uncertaintyBudget'>): BudgetEntry | null {
  const [first] = g.uncertaintyBudget;
  return first && first.contribution > 0 ? first : null;
}

/** "wall thickness" */
export function inputLabel(e: Pick<BudgetEntry, 'input'>): string {
  return UNCERTAINTY_LABELS[e.input];
}

/** "± 0.32 mm", "± 3.0 %", "± 1°", "± 0.015" */
export function formatInputUncertainty(e: Pick<BudgetEntry, 'standardUncertainty' | 'unit'>): string {
  const u = e.standardUncertainty;
  if (e.unit === 'relative') return `± ${formatPercent(u, 1)}`;
  if (e.unit === '°') return `± ${formatFixed(u, 1)}°`;
  if (e.unit === '' || e.unit === 'absolute') return `± ${formatFixed(u, 3)}`;
  return `± ${formatFixed(u, 3)} ${e.unit}`;
}

export const BAND_BASIS_WORDS: Record<GaugeResult['bandBasis'], string> = {
  relative: '± band × the predicted slope',
  'near-zero': '± band × the largest principal strain (the prediction is near zero)',
  uncertainty: 'from the uncertainties, √(U_pred² + U_fit²)',
};

export const TRANSVERSE_WORDS: Record<TransverseCorrection, string> = {
  none: 'none (Kt 0)',
  'model-ratio': "with the model's predicted transverse strain",
  'measured-partner': 'with the strain of the perpendicular gauge',
  rosette: 'from the rosette’s three grids',
};

export const SURFACE_WORDS: Record<YieldSurface, string> = {
  inner: 'von Mises at the bore (inner surface)',
  outer: 'von Mises at the outer surface',
  'mid-wall': 'membrane von Mises (mid-wall)',
};
