// inspectLogHead: a quick look at the first ~64 KB of a log, for the upload endpoint to answer
// 422 before storing the file.
import { InputError } from './errors';
import type { Plan } from './plan';
import {
  assertTextString,
  findHeaderLine,
  mapColumns,
  parseNumberText,
  resolvePressureUnit,
  splitCells,
  type Delimiter,
} from './text';

export interface LogHeadInfo {
  delimiter: Delimiter;
  decimalComma: boolean;
  /** 1-based line of the header */
  headerLine: number;
  columns: string[];
  /** canonical unit in brackets or parentheses after the pressure column, or null */
  pressureUnit: string | null;
  /** the unit is absolute pressure (`bar(a)`, `psia`): the engine subtracts the atmosphere */
  pressureAbsolute: boolean;
  missingColumns: string[];
  duplicateColumns: string[];
  /** up to 5 data rows as cells */
  previewRows: string[][];
}

/** Throws InputError when the head is not delimited text or no line holds the pressure column. */
export function inspectLogHead(plan: Plan, headText: string): LogHeadInfo {
  const text = headText.replace(/^\uFEFF/, '');
  if (text.startsWith('PK\u0003\u0004'))
    throw new InputError(
      'not-delimited-text',
      'the log is a ZIP archive (an .xlsx workbook?), not delimited text: export it as CSV',
      { line: 1 },
    );
  assertTextString(text);
  const lines = text.split('\n').map((l) => (l.endsWith('\r') ? l.slice(0, -1) : l));
  // the last line may be cut off by the 64 KB window
  if (!text.endsWith('\n') && lines.length > 1) lines.pop();
  const { strong, weak } = findHeaderLine(plan, lines);
  const found = strong ?? weak;
  if (!found)
    throw new InputError(
      'pressure-column-not-found',
      `No line in the first ${lines.length} has the pressure column '${plan.columns.pressure}': check the log's header, or change the plan's pressure column`,
      {
        column: plan.columns.pressure,
        line: lines.length,
      },
    );
  const headerLine = found.index + 1;
  const m = mapColumns(plan, found.cells);
  const pressureCell = found.cells[m.pressure]; // undefined when the pressure column is missing (-1)
  const unit = pressureCell !== undefined ? resolvePressureUnit(m.pressureUnit, pressureCell, headerLine) : null;
  const previewRows: string[][] = [];
  let decimalComma = false;
  for (const line of lines.slice(found.index + 1)) {
    if (previewRows.length >= 5) break;
    if (!line.trim()) continue;
    const cells = splitCells(line, found.delimiter);
    previewRows.push(cells);
    if (
      found.delimiter !== ',' &&
      cells.some((c) => /^\s*[+-]?\d*,\d+\s*$/.test(c) && !Number.isNaN(parseNumberText(c, true)))
    )
      decimalComma = true;
  }
  return {
    delimiter: found.delimiter,
    decimalComma,
    headerLine,
    columns: found.cells,
    pressureUnit: unit?.unit ?? null,
    pressureAbsolute: unit?.absolute ?? false,
    missingColumns: m.missing,
    duplicateColumns: m.duplicate,
    previewRows,
  };
}
