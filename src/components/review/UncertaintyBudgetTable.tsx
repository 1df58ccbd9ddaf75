import type { GaugeResult } from '../../lib/reduction/types';
import { formatPercent, formatSignificant } from '../../lib/ui-format';
import { BAND_BASIS_WORDS, dominantInput, formatInputUncertainty, inputLabel } from './budget-words';

interface Props {
  gauge: Pick<GaugeResult, 'id' | 'predictedU95' | 'uncertaintyBudget' | 'bandBasis'>;
  pressureUnit: string;
}

/** One gauge's uncertainty budget (GUM): every input's contribution to U95 of the predicted slope, largest first. */
export default function UncertaintyBudgetTable({ gauge: g, pressureUnit }: Props) {
  const top = dominantInput(g);
  if (g.predictedU95 === null || !top)
    return <p className="text-sm text-ink-700">This reduction has no uncertainty budget (an older engine).</p>;
  const assumed = g.uncertaintyBudget.some((b) => b.assumed);
  return (
    <div className="space-y-1">
      <p className="text-sm">
        Prediction uncertainty U95 (k = 2):{' '}
        <strong className="num">
          ± {formatSignificant(g.predictedU95, 3)} µε/{pressureUnit}
        </strong>
        , mostly from <strong>{inputLabel(top)}</strong> ({formatPercent(top.share, 0)} of the variance). Band:{' '}
        {BAND_BASIS_WORDS[g.bandBasis]}.
      </p>
      <table className="table-base text-xs!">
        <caption className="sr-only">Uncertainty budget of gauge {g.id}</caption>
        <thead>
          <tr>
            <th scope="col">Input</th>
            <th scope="col" className="text-right!">
              Standard uncertainty
            </th>
            <th scope="col" className="text-right!">
              Contribution µε/{pressureUnit}
            </th>
            <th scope="col" className="text-right!">
              Share
            </th>
          </tr>
        </thead>
        <tbody>
          {g.uncertaintyBudget.map((b) => (
            <tr key={b.input} className={b === top ? 'font-semibold' : undefined}>
              <th scope="row" className="bg-transparent! font-normal!">
                {inputLabel(b)}
                {b.assumed && <span className="text-ink-700"> (assumed)</span>}
              </th>
              <td className="num text-right">{formatInputUncertainty(b)}</td>
              <td className="num text-right">{formatSignificant(b.contribution, 3)}</td>
              <td className="num text-right">{formatPercent(b.share, 0)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {assumed && (
        <p className="text-xs text-ink-700">
          “Assumed” inputs use the default of the design when the plan gives none; enter the real tolerances in the
          plan’s uncertainty section.
        </p>
      )}
    </div>
  );
}
