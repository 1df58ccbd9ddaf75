// Sorting the gauge table: numbers by value, text by natural order (H2 before H10), flags by
// count, outcomes by urgency (flagged first); empty values always last, whichever the direction.
import type { GaugeResult } from '../../lib/reduction/types';
import { OUTCOME_ORDER } from './outcome-style';

export type GaugeSortKey =
  | 'id'
  | 'channel'
  | 'angleDeg'
  | 'predictedSlope'
  | 'measuredSlope'
  | 'ratio'
  | 'predictedU95'
  | 'rSquared'
  | 'hysteresis'
  | 'zeroShift'
  | 'flags'
  | 'outcome';
export type SortDirection = 'ascending' | 'descending';

const collator = new Intl.Collator('en', { numeric: true, sensitivity: 'base' });

function sortValue(g: GaugeResult, key: GaugeSortKey): number | string | null {
  switch (key) {
    case 'id':
      return g.id;
    case 'channel':
      return g.channel;
    case 'flags':
      return g.flags.length;
    case 'outcome':
      return OUTCOME_ORDER.indexOf(g.outcome);
    default:
      return g[key];
  }
}

/** A sorted copy; ties keep the plan order. */
export function sortGauges(rows: readonly GaugeResult[], key: GaugeSortKey, dir: SortDirection): GaugeResult[] {
  const sign = dir === 'ascending' ? 1 : -1;
  return rows
    .map((g, i) => ({ g, i, v: sortValue(g, key) }))
    .sort((a, b) => {
      if (a.v === null || b.v === null) return a.v === b.v ? a.i - b.i : a.v === null ? 1 : -1;
      const c =
        typeof a.v === 'string' && typeof b.v === 'string'
          ? collator.compare(a.v, b.v)
          : (a.v as number) - (b.v as number);
      return c !== 0 ? sign * c : a.i - b.i;
    })
    .map((x) => x.g);
}
