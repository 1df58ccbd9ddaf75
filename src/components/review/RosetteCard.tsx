import type { RosetteResult } from '../../lib/reduction/types';
import {
  formatAngle,
  formatPressure,
  formatRatio,
  formatSignificant,
  formatSlope,
  formatStress,
  type PressureUnit,
} from '../../lib/ui-format';
import FlagChip from './FlagChip';
import RosetteDiagram from './RosetteDiagram';
import YieldBar from './YieldBar';

interface Props {
  rosette: RosetteResult;
  /** plan pressure unit; stresses are in the plan stress unit, which matches it */
  pressureUnit: PressureUnit;
  testPressure: number;
  /** near-yield threshold as a fraction of yield (plan tolerance, 0.9 by default) */
  nearYieldFraction?: number;
}

const KIND_LABEL: Record<RosetteResult['kind'], string> = {
  'rosette-rectangular': 'rectangular 0/45/90',
  'rosette-delta': 'delta 0/60/120',
};

/** One rosette: principal strains against prediction, direction, stresses against yield, flags. */
export default function RosetteCard({ rosette: r, pressureUnit, testPressure, nearYieldFraction = 0.9 }: Props) {
  const yieldStrength = r.yieldFraction > 0 ? r.vonMises / r.yieldFraction : null;
  const rows = [0, 1].map((i) => ({
    name: i === 0 ? 'ε1' : 'ε2',
    measured: r.principalStrains[i]!,
    predicted: r.predictedPrincipalStrains[i]!,
  }));
  return (
    <article className="card" aria-labelledby={`rosette-${r.id}`}>
      <header className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 id={`rosette-${r.id}`} className="text-lg font-semibold text-ink-900">
          Rosette {r.id}{' '}
          <span className="text-sm font-normal text-ink-700">
            {KIND_LABEL[r.kind]}, grid A at {formatAngle(r.angleDeg)}
          </span>
        </h3>
        <div className="flex flex-wrap gap-1">
          {r.flags.length === 0 ? (
            <span className="text-sm text-ink-700">No flags</span>
          ) : (
            r.flags.map((f) => <FlagChip key={f} code={f} />)
          )}
        </div>
      </header>
      <div className="mt-3 grid gap-4 sm:grid-cols-[1fr_auto]">
        <div className="min-w-0 space-y-4">
          <table className="table-base">
            <caption className="sr-only">Principal strains per unit pressure, measured and predicted</caption>
            <thead>
              <tr>
                <th scope="col">Strain</th>
                <th scope="col" className="text-right!">
                  Measured <span className="block text-xs font-normal">µε/{pressureUnit}</span>
                </th>
                <th scope="col" className="text-right!">
                  Predicted <span className="block text-xs font-normal">µε/{pressureUnit}</span>
                </th>
                <th scope="col" className="text-right!">
                  Ratio
                </th>
              </tr>
            </thead>
            <tbody>
              {rows.map((row) => (
                <tr key={row.name}>
                  <th scope="row" className="font-semibold">
                    {row.name}
                  </th>
                  <td className="num text-right">{formatSlope(row.measured, pressureUnit, false)}</td>
                  <td className="num text-right">{formatSlope(row.predicted, pressureUnit, false)}</td>
                  <td className="num text-right">
                    {row.predicted !== 0 ? formatRatio(row.measured / row.predicted) : '—'}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
          <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm [&>dd]:whitespace-nowrap">
            <dt className="text-ink-700">ε1 direction from vessel axis</dt>
            <dd className="num font-semibold">{formatAngle(r.principalAngleDeg, 1)}</dd>
            <dt className="text-ink-700">Expected direction of ε1</dt>
            <dd className="num">
              {r.expectedPrincipalAngleDeg === null
                ? 'none (equal-biaxial)'
                : `${formatAngle(r.expectedPrincipalAngleDeg)} (${r.expectedPrincipalAngleDeg === 90 ? 'hoop' : 'axial'})`}
            </dd>
            <dt className="text-ink-700">σ1 / σ2 per unit pressure</dt>
            <dd className="num">
              {formatSignificant(r.stressesPerUnitPressure[0], 4)} /{' '}
              {formatSignificant(r.stressesPerUnitPressure[1], 4)} {pressureUnit}/{pressureUnit}
            </dd>
            <dt className="text-ink-700">σ1 / σ2 at {formatPressure(testPressure, pressureUnit)}</dt>
            <dd className="num font-semibold">
              {formatStress(r.principalStresses[0], pressureUnit)} /{' '}
              {formatStress(r.principalStresses[1], pressureUnit)}
            </dd>
            <dt className="text-ink-700">von Mises at test pressure</dt>
            <dd className="num font-semibold">{formatStress(r.vonMises, pressureUnit)}</dd>
            {yieldStrength !== null && (
              <>
                <dt className="text-ink-700">Yield strength (plan)</dt>
                <dd className="num font-semibold">{formatStress(yieldStrength, pressureUnit)}</dd>
              </>
            )}
          </dl>
          <YieldBar fraction={r.yieldFraction} nearYieldFraction={nearYieldFraction} />
          {r.notes.length > 0 && (
            <ul className="list-disc pl-5 text-xs text-ink-700">
              {r.notes.map((n, i) => (
                <li key={i}>{n}</li>
              ))}
            </ul>
          )}
        </div>
        <RosetteDiagram kind={r.kind} gridAngleDeg={r.angleDeg} principalAngleDeg={r.principalAngleDeg} />
      </div>
    </article>
  );
}
