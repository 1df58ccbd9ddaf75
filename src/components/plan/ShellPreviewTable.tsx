import { Fragment } from 'react';
import type { ModelPrediction } from '../../lib/reduction/browser';
import { formatFixed, formatPercent, formatSignificant, getUnitLabels } from '../../lib/ui-format';
import { usePlanEditor } from './plan-editor-context';

/** One row: a number of each model's prediction. */
interface Row {
  key: string;
  label: string;
  unit: string;
  get: (m: ModelPrediction) => number | null;
  show: (v: number) => string;
}
const SURFACE = { inner: 'bore', outer: 'outer surface', 'mid-wall': 'mid-wall' } as const;

/** Both models side by side at the outer surface: strain per unit pressure, and stresses, dimension changes and yield at test pressure. */
export default function ShellPreviewTable() {
  const { preview, units, plan } = usePlanEditor();
  const tolerances = plan.tolerances as { yieldFraction?: unknown } | undefined;
  const yieldLimit = typeof tolerances?.yieldFraction === 'number' ? tolerances.yieldFraction : 0.9;
  const u = getUnitLabels(units);
  if (!preview)
    return (
      <p className="text-sm text-ink-700">
        Enter the vessel's diameter, wall thickness and (for a cylinder) length, the material and the test pressure to
        see the prediction.
      </p>
    );
  const { lame, membrane } = preview.predicted;
  const usedFraction = preview.predicted[preview.model].yieldCheck.fraction;
  const lenDigits = units === 'US' ? 5 : 3;
  const sig = (v: number) => formatSignificant(v, 4);
  const stress = (v: number) => formatFixed(v, units === 'US' ? 0 : 1);
  const len = (v: number) => formatFixed(v, lenDigits);
  const dims = (k: keyof ModelPrediction['dimensionChanges']) => (m: ModelPrediction) => m.dimensionChanges[k];
  const rows: Row[] = [
    { key: 'hoop', label: 'Hoop strain', unit: u.slope, get: (m) => m.hoopStrainPerPressure, show: sig },
    { key: 'axial', label: 'Axial strain', unit: u.slope, get: (m) => m.axialStrainPerPressure, show: sig },
    { key: 'radial', label: 'Radial strain', unit: u.slope, get: (m) => m.radialStrainPerPressure, show: sig },
    { key: 'sh', label: 'Hoop stress', unit: u.stress, get: (m) => m.hoopStress, show: stress },
    { key: 'sa', label: 'Axial stress', unit: u.stress, get: (m) => m.axialStress, show: stress },
    { key: 'di', label: 'Inside diameter change', unit: u.length, get: dims('insideDiameter'), show: len },
    { key: 'dm', label: 'Mean diameter change', unit: u.length, get: dims('meanDiameter'), show: len },
    { key: 'do', label: 'Outside diameter change', unit: u.length, get: dims('outsideDiameter'), show: len },
    { key: 'dl', label: 'Length change', unit: u.length, get: dims('length'), show: len },
    {
      key: 'dt',
      label: 'Thickness change',
      unit: u.length,
      get: dims('thickness'),
      show: (v) => formatFixed(v, lenDigits + 1),
    },
    { key: 'vm', label: 'Largest stress (von Mises)', unit: u.stress, get: (m) => m.yieldCheck.stress, show: stress },
    {
      key: 'yf',
      label: 'Largest stress / yield',
      unit: '%',
      get: (m) => m.yieldCheck.fraction,
      show: (v) => formatFixed(v * 100, 1),
    },
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
                <Cells a={r.get(lame)} b={r.get(membrane)} show={r.show} diff={diff} />
              </tr>
            </Fragment>
          ))}
        </tbody>
      </table>
      {usedFraction >= yieldLimit && (
        <p
          role="alert"
          className="rounded-md border-2 border-flag bg-white px-3 py-2 text-sm font-semibold text-ink-950"
        >
          ⚠ Near yield at the planned test pressure: the largest stress in the wall is{' '}
          {formatFixed(usedFraction * 100, 1)} % of yield (limit {formatFixed(yieldLimit * 100, 0)} %). Review the test
          pressure, the wall and the material with the responsible engineer before the test; the code and the written
          procedure decide the pressure.
        </p>
      )}
      <p className="text-xs text-ink-700">
        The largest stress sits at the {SURFACE[lame.yieldCheck.surface]} under Lamé and at mid-wall in the membrane
        model; near yield is flagged from {preview.model === 'lame' ? 'Lamé' : 'the membrane value'}.
      </p>
      <p className="text-xs text-ink-700">
        ✓ the model the comparison uses. At the outer surface the membrane formula predicts{' '}
        {formatPercent(preview.predicted.membraneOverLame, 1, true)} on hoop strain; against a ±band that difference
        matters.
      </p>
    </div>
  );
}

function Cells({
  a,
  b,
  show,
  diff,
}: {
  a: number | null;
  b: number | null;
  show: (v: number) => string;
  diff: (l: number, m: number) => string;
}) {
  return (
    <>
      <td className="num text-right">{a === null ? '—' : show(a)}</td>
      <td className="num text-right">{b === null ? '—' : show(b)}</td>
      <td className="num text-right text-ink-700">{a === null || b === null ? '—' : diff(a, b)}</td>
    </>
  );
}
