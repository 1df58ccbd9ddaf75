import type { PlanUnits } from '../../lib/reduction/browser';
import { formatFixed } from '../../lib/ui-format';
import { formatStress, type MaterialRow } from './vessel-form';

/** Stored materials with E, ν and yield in the shown units. */
export default function MaterialListTable({ materials, units }: { materials: MaterialRow[]; units: PlanUnits }) {
  return (
    <div className="overflow-x-auto">
      <table className="table-base">
        <caption className="sr-only">Materials</caption>
        <thead>
          <tr>
            <th scope="col">Name</th>
            <th scope="col" className="text-right!">
              Elastic modulus E
            </th>
            <th scope="col" className="text-right!">
              Poisson's ratio ν
            </th>
            <th scope="col" className="text-right!">
              Yield strength
            </th>
          </tr>
        </thead>
        <tbody>
          {materials.length === 0 && (
            <tr>
              <td colSpan={4} className="text-ink-700">
                No materials yet.
              </td>
            </tr>
          )}
          {materials.map((m) => (
            <tr key={m.id}>
              <th scope="row" className="bg-transparent! font-medium">
                {m.name}
              </th>
              <td className="num text-right whitespace-nowrap">{formatStress(m.elasticModulusMPa, units)}</td>
              <td className="num text-right">{formatFixed(m.poissonRatio, 3)}</td>
              <td className="num text-right whitespace-nowrap">{formatStress(m.yieldStrengthMPa, units)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
