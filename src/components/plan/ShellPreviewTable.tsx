import { Fragment } from 'react';
import type { ModelPrediction } from '../../lib/reduction/browser';
import { formatFixed, formatPercent, formatSignificant, getUnitLabels } from '../../lib/ui-format';
import { usePlanEditor } from './plan-editor-context';

type Key = keyof Omit<ModelPrediction, 'model'>;

/** Both models side by side at the outer surface: strain per unit pressure, and stresses, dimension changes and yield at test pressure. */
export default function ShellPreviewTable() {
  const { preview, units } = usePlanEditor();
  const u = getUnitLabels(units);
  if (!preview)
    return (
      <p className="text-sm text-ink-700">
        Enter the vessel's diameter, wall thickness and (for a cylinder) length, the material and the test pressure to
        see the prediction.
      </p>
    );
  const { lame, membrane } = preview.predicted;
  const lenDigits = units === 'US' ? 5 : 3;
  const rows: { key: Key; label: string; unit: string; show: (v: number) => string }[] = [
    { key: 'hoopStrainPerPressure', label: 'Hoop strain', unit: u.slope, show: (v) => formatSignificant(v, 4) },
    { key: 'axialStrainPerPressure', label: 'Axial strain', unit: u.slope, show: (v) => formatSignificant(v, 4) },
    { key: 'radialStrainPerPressure', label: 'Radial strain', unit: u.slope, show: (v) => formatSignificant(v, 4) },
    { key: 'hoopStress', label: 'Hoop stress', unit: u.stress, show: (v) => formatFixed(v, units === 'US' ? 0 : 1) },
    { key: 'axialStress', label: 'Axial stress', unit: u.stress, show: (v) => formatFixed(v, units === 'US' ? 0 : 1) },
    { key: 'diameterChange', label: 'Diameter change', unit: u.length, show: (v) => formatFixed(v, lenDigits) },
    { key: 'lengthChange', label: 'Length change', unit: u.length, show: (v) => formatFixed(v, lenDigits) },
    { key: 'thicknessChange', label: 'Thickness change', unit: u.length, show: (v) => formatFixed(v, lenDigits + 1) },
    { key: 'yieldFraction', label: 'Fraction of yield', unit: '%', show: (v) => formatFixed(v * 100, 1) },
  ];
  const diff = (l: number, m: number) => (Math.abs(l) < 1e-12 ? '—' : formatPercent(m / l - 1, 1, true));
  return (
    <div className="space-y-2">
      <table className="table-base text-xs!">
        <caption className="sr-only">Predicted shell response, both models</caption>
        <thead>
          <tr>
            <th scope="col">Quantity</th>
            <th scope="col" className="text-right!">
              Lamé{preview.model === 'lame' && ' ✓'}
            </th>
            <th scope="col" className="text-right!">
              Membrane{preview.model === 'membrane' && ' ✓'}
            </th>
            <th scope="col" className="text-right!">
              Membrane vs Lamé
            </th>
          </tr>
        </thead>
        <tbody>
          <tr>
            <th scope="rowgroup" colSpan={4} className="bg-white! text-ink-700">
              Per unit pressure (outer surface)
            </th>
          </tr>
          {rows.map((r, k) => (
            <Fragment key={r.key}>
              {k === 3 && (
                <tr>
                  <th scope="rowgroup" colSpan={4} className="bg-white! text-ink-700">
                    At test pressure {formatSignificant(preview.testPressure, 4)} {u.pressure}
                  </th>
                </tr>
              )}
              <tr>
                <th scope="row" className="bg-transparent! font-normal!">
                  {r.label} <span className="text-ink-700">({r.unit})</span>
                </th>
                <td className="num text-right">{r.show(lame[r.key])}</td>
                <td className="num text-right">{r.show(membrane[r.key])}</td>
                <td className="num text-right text-ink-700">{diff(lame[r.key], membrane[r.key])}</td>
              </tr>
            </Fragment>
          ))}
        </tbody>
      </table>
      <p className="text-xs text-ink-700">
        ✓ the model the comparison uses. At the outer surface the membrane formula predicts{' '}
        {formatPercent(preview.predicted.membraneOverLame, 1, true)} on hoop strain; against a ±band that difference
        matters.
      </p>
    </div>
  );
}
