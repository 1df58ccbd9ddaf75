import { formatFixed, formatPercent, formatSignificant, getUnitLabels } from '../../lib/ui-format';
import { usePlanEditor } from './plan-editor-context';
import { describeDistance } from './plan-preview';
import { UNCERTAINTY_LABELS } from '../../lib/reduction/browser';

/** Predicted strain per unit pressure for every gauge and rosette grid, both models, as the plan stands. */
export default function GaugePreviewTable() {
  const { preview, units } = usePlanEditor();
  const u = getUnitLabels(units);
  if (!preview)
    return (
      <p className="text-sm text-ink-700">
        The gauge predictions appear once the vessel, material and test pressure are complete.
      </p>
    );
  return (
    <div className="space-y-2">
      {preview.omittedGauges.length > 0 && (
        <p className="text-sm font-medium text-ink-900">
          <span aria-hidden="true" className="text-brass-600">
            ⚠
          </span>{' '}
          Not shown until their rows are fixed: {preview.omittedGauges.join(', ')}.
        </p>
      )}
      <div className="overflow-x-auto">
        <table className="table-base">
          <caption className="sr-only">Predicted strain per unit pressure per gauge grid</caption>
          <thead>
            <tr>
              <th scope="col">Gauge / grid</th>
              <th scope="col">Channel</th>
              <th scope="col" className="text-right!">
                Angle (°)
              </th>
              <th scope="col" className="text-right!">
                Lamé ({u.slope}){preview.model === 'lame' && ' ✓'}
              </th>
              <th scope="col" className="text-right!">
                Membrane ({u.slope}){preview.model === 'membrane' && ' ✓'}
              </th>
              <th scope="col" className="text-right!">
                Membrane vs Lamé
              </th>
              <th scope="col" className="text-right!">
                At test pressure (µε)
              </th>
              <th scope="col" className="text-right!">
                U95 ({u.slope}), largest input
              </th>
              <th scope="col">Nearest discontinuity</th>
            </tr>
          </thead>
          <tbody>
            {preview.grids.length === 0 && (
              <tr>
                <td colSpan={9} className="text-ink-700">
                  No complete gauge rows yet.
                </td>
              </tr>
            )}
            {preview.grids.map((g) => (
              <tr key={g.id} className={g.edgeZone ? 'bg-ink-50' : undefined}>
                <th scope="row" className="bg-transparent! font-semibold">
                  {g.id}
                </th>
                <td className="font-mono text-xs">{g.channel}</td>
                <td className="num text-right">{formatFixed(g.angleDeg, 0)}</td>
                <td className="num text-right">{formatSignificant(g.lamePredictedSlope, 4)}</td>
                <td className="num text-right">{formatSignificant(g.membranePredictedSlope, 4)}</td>
                <td className="num text-right text-ink-700">
                  {Math.abs(g.lamePredictedSlope) < 1e-9
                    ? '—'
                    : formatPercent(g.membranePredictedSlope / g.lamePredictedSlope - 1, 1, true)}
                </td>
                <td className="num text-right">{formatFixed(g.predictedSlope * preview.testPressure, 0)}</td>
                <td className="num text-right">
                  ±{formatSignificant(preview.uncertainty[g.id]?.predictedU95, 3)}
                  {preview.uncertainty[g.id]?.dominant && (
                    <span className="block text-xs text-ink-700">
                      {UNCERTAINTY_LABELS[preview.uncertainty[g.id]!.dominant!.input]}
                    </span>
                  )}
                </td>
                <td className="text-xs">
                  {g.distanceToDiscontinuity === null ? (
                    'not given'
                  ) : (
                    <>
                      {describeDistance(g, units)}
                      {g.edgeZone && (
                        <strong className="ml-1">
                          <span aria-hidden="true" className="text-notcompared">
                            ◆
                          </span>{' '}
                          edge zone: not compared
                        </strong>
                      )}
                    </>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
