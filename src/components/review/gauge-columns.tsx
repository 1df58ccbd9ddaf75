import type { ReactNode } from 'react';
import type { GaugeResult } from '../../lib/reduction/types';
import {
  formatAngle,
  formatInterval,
  formatMicrostrain,
  formatPercent,
  formatRatio,
  formatRSquared,
  formatSignificant,
  type PressureUnit,
} from '../../lib/ui-format';
import { dominantInput, inputLabel } from './budget-words';
import FlagChip from './FlagChip';
import OutcomeBadge from './OutcomeBadge';
import type { GaugeSortKey } from './gauge-sort';

export interface GaugeColumn {
  key: GaugeSortKey;
  label: string;
  /** unit shown under the label */
  unit?: string;
  numeric?: boolean;
  cell: (g: GaugeResult) => ReactNode;
  /** extra classes for the cells */
  className?: string;
}

/** The gauge table's columns, in order; slopes in µε per plan pressure unit. */
export function buildGaugeColumns(pressureUnit: PressureUnit): GaugeColumn[] {
  const slopeUnit = `µε/${pressureUnit}`;
  return [
    { key: 'angleDeg', label: 'Angle', numeric: true, cell: (g) => formatAngle(g.angleDeg) },
    {
      key: 'predictedSlope',
      label: 'Predicted',
      unit: slopeUnit,
      numeric: true,
      cell: (g) => formatSignificant(g.predictedSlope),
    },
    {
      key: 'measuredSlope',
      label: 'Measured',
      unit: `${slopeUnit}, 95 % CI`,
      numeric: true,
      cell: (g) => (
        <>
          {formatSignificant(g.measuredSlope)}
          <span className="block text-xs whitespace-nowrap text-ink-700">
            {formatInterval(g.slopeCI95, (v) => formatSignificant(v))}
          </span>
        </>
      ),
    },
    {
      key: 'ratio',
      label: 'Ratio',
      unit: 'meas./pred.',
      numeric: true,
      cell: (g) => <strong>{formatRatio(g.ratio)}</strong>,
    },
    {
      key: 'predictedU95',
      label: 'Prediction U95',
      unit: `${slopeUnit}, largest input`,
      numeric: true,
      cell: (g) => {
        const top = dominantInput(g);
        return (
          <>
            {g.predictedU95 === null ? '—' : `±${formatSignificant(g.predictedU95, 3)}`}
            {top && <span className="block text-xs whitespace-nowrap text-ink-700">{inputLabel(top)}</span>}
          </>
        );
      },
    },
    { key: 'rSquared', label: 'R²', numeric: true, cell: (g) => formatRSquared(g.rSquared) },
    {
      key: 'hysteresis',
      label: 'Hysteresis',
      unit: 'of peak',
      numeric: true,
      cell: (g) => formatPercent(g.hysteresis),
    },
    {
      key: 'zeroShift',
      label: 'Zero shift',
      unit: 'µε',
      numeric: true,
      cell: (g) => formatMicrostrain(g.zeroShift).replace(' µε', ''),
    },
    {
      key: 'flags',
      label: 'Flags',
      className: 'min-w-48',
      cell: (g) => (
        <span className="flex flex-wrap gap-1">
          {g.flags.map((f) => (
            <FlagChip key={f} code={f} />
          ))}
        </span>
      ),
    },
    { key: 'outcome', label: 'Outcome', cell: (g) => <OutcomeBadge outcome={g.outcome} compact /> },
  ];
}
