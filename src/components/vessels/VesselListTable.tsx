import type { PlanUnits } from '../../lib/reduction/browser';
import { formatLength, type VesselRow } from './vessel-form';

interface Props {
  vessels: VesselRow[];
  testCounts: Record<string, number>;
  units: PlanUnits;
}

/** Every vessel with its geometry in the shown units, its material and how many tests it has. */
export default function VesselListTable({ vessels, testCounts, units }: Props) {
  return (
    <div className="overflow-x-auto">
      <table className="table-base">
        <caption className="sr-only">Vessels</caption>
        <thead>
          <tr>
            <th scope="col">Tag</th>
            <th scope="col">Name</th>
            <th scope="col">Shape</th>
            <th scope="col" className="text-right!">
              Inside diameter
            </th>
            <th scope="col" className="text-right!">
              Wall
            </th>
            <th scope="col" className="text-right!">
              Length
            </th>
            <th scope="col">Material</th>
            <th scope="col" className="text-right!">
              Tests
            </th>
          </tr>
        </thead>
        <tbody>
          {vessels.length === 0 && (
            <tr>
              <td colSpan={8} className="text-ink-700">
                No vessels yet.
              </td>
            </tr>
          )}
          {vessels.map((v) => (
            <tr key={v.id}>
              <th scope="row" className="bg-transparent!">
                <a className="font-semibold text-ink-700 underline" href={`/vessels/${v.id}`}>
                  {v.tag}
                </a>
              </th>
              <td>{v.name}</td>
              <td>{v.shape === 'sphere' ? 'Sphere' : `Cylinder, ${v.ends} ends`}</td>
              <td className="num text-right whitespace-nowrap">{formatLength(v.insideDiameterMm, units)}</td>
              <td className="num text-right whitespace-nowrap">{formatLength(v.wallThicknessMm, units)}</td>
              <td className="num text-right whitespace-nowrap">
                {v.shape === 'sphere' ? '—' : formatLength(v.lengthMm, units)}
              </td>
              <td>{v.material?.name ?? <span className="text-ink-700">none</span>}</td>
              <td className="num text-right">{testCounts[String(v.id)] ?? 0}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
