// Text-level rules for logs: encodings, cell splitting, numbers, timestamps, the header line and
// column mapping. Shared by inspectLogHead (the upload endpoint's quick check) and the streaming reader.
import Papa from 'papaparse';
import { InputError } from './errors';
import { parsePressureUnit, type PressureUnitSpec } from './units';
import type { Plan } from './plan';

export type Delimiter = ',' | ';' | '\t';
export const DELIMITERS: readonly Delimiter[] = [',', ';', '\t'];

export type Encoding = 'utf-8' | 'utf-16le' | 'utf-16be' | 'windows-1252';

/** Look at the first bytes: BOM, encoding, and whether this is text at all (throws InputError if not). */
export function sniffBytes(head: Uint8Array): { encoding: Encoding; bomLength: number } {
  if (head.length >= 3 && head[0] === 0xef && head[1] === 0xbb && head[2] === 0xbf)
    return { encoding: 'utf-8', bomLength: 3 };
  if (head.length >= 2 && head[0] === 0xff && head[1] === 0xfe) return { encoding: 'utf-16le', bomLength: 2 };
  if (head.length >= 2 && head[0] === 0xfe && head[1] === 0xff) return { encoding: 'utf-16be', bomLength: 2 };
  const sig = (...b: number[]) => b.every((v, i) => head[i] === v);
  if (sig(0x50, 0x4b, 0x03, 0x04))
    throw new InputError(
      'not-delimited-text',
      'the log is a ZIP archive (an .xlsx workbook?), not delimited text: export it as CSV',
      { line: 1 },
    );
  if (sig(0xd0, 0xcf, 0x11, 0xe0))
    throw new InputError(
      'not-delimited-text',
      'the log is an old Excel (.xls) workbook, not delimited text: export it as CSV',
      { line: 1 },
    );
  if (sig(0x25, 0x50, 0x44, 0x46))
    throw new InputError('not-delimited-text', 'the log is a PDF, not delimited text: upload the data file (CSV)', {
      line: 1,
    });
  assertTextBytes(head, 0, Math.min(head.length, 8192), 1);
  let utf8 = true;
  try {
    new TextDecoder('utf-8', { fatal: true }).decode(
      head.subarray(0, trimIncompleteUtf8(head, Math.min(head.length, 65536))),
    );
  } catch {
    utf8 = false;
  }
  return { encoding: utf8 ? 'utf-8' : 'windows-1252', bomLength: 0 };
}

/** Length of buf[0..len) without a UTF-8 sequence cut at the end. */
function trimIncompleteUtf8(buf: Uint8Array, len: number): number {
  let i = len;
  let back = 0;
  // step back over continuation bytes (10xxxxxx) at the end
  while (back < 4) {
    const c = buf[i - 1]; // undefined before the start of buf
    if (c === undefined || (c & 0xc0) !== 0x80) break;
    i--;
    back++;
  }
  const lead = buf[i - 1];
  return lead !== undefined && lead >= 0xc0 ? i - 1 : len;
}

/** Throw not-delimited-text when a byte range holds NUL or many control characters. */
export function assertTextBytes(buf: Uint8Array, from: number, to: number, firstLine: number): void {
  let ctrl = 0;
  let line = firstLine;
  for (const c of buf.subarray(from, to)) {
    if (c === 10) line++;
    else if (c === 0)
      throw new InputError('not-delimited-text', `the log is not delimited text (binary data at line ${line})`, {
        line,
      });
    else if (c < 32 && c !== 9 && c !== 13 && c !== 12) ctrl++;
  }
  const n = to - from;
  if (n > 0 && ctrl > Math.max(2, n * 0.01))
    throw new InputError(
      'not-delimited-text',
      `the log is not delimited text (${ctrl} control characters in its first ${n} bytes)`,
      { line: firstLine },
    );
}

/** Throw not-delimited-text for decoded text that holds NUL or many control characters. */
export function assertTextString(text: string): void {
  let ctrl = 0;
  let line = 1;
  const n = Math.min(text.length, 65536);
  for (let i = 0; i < n; i++) {
    const c = text.charCodeAt(i);
    if (c === 10) line++;
    else if (c === 0)
      throw new InputError('not-delimited-text', `the log is not delimited text (binary data at line ${line})`, {
        line,
      });
    else if ((c < 32 && c !== 9 && c !== 13 && c !== 12) || c === 0xfffd) ctrl++;
  }
  if (n > 0 && ctrl > Math.max(2, n * 0.01))
    throw new InputError(
      'not-delimited-text',
      `the log is not delimited text (${ctrl} control characters in its first ${n} characters)`,
      { line: 1 },
    );
}

/** Cells of one line. Lines with quotes go through papaparse; others are split directly. */
export function splitCells(line: string, delimiter: Delimiter): string[] {
  if (line.indexOf('"') < 0) return line.split(delimiter);
  const r = Papa.parse<string[]>(line, { delimiter, header: false, skipEmptyLines: false });
  return r.data[0] ?? [''];
}

const BRACKET_SUFFIX = /^(.*?)\s*\[([^\]]*)\]\s*$/;
/** a parenthesised suffix with at most one nested pair: `P (bar)`, `P (bar(a))` */
const PAREN_SUFFIX = /^(.*?)\s*\(((?:[^()]|\([^()]*\))*)\)\s*$/;

/**
 * `P [MPa]` → { base: 'P', unit: 'MPa' }; `P (bar)` → { base: 'P', unit: 'bar' }; `SG1` → { base: 'SG1', unit: null }.
 * Brackets always hold a unit (an unknown one is refused later); parentheses count as a unit only
 * when they hold a pressure unit, so `Pressure (PT-101)` stays one name.
 */
export function splitUnit(name: string): { base: string; unit: string | null } {
  const s = cleanCell(name);
  const [, base, unit] = BRACKET_SUFFIX.exec(s) ?? [];
  if (base !== undefined && unit !== undefined) return { base: base.trim(), unit: unit.trim() };
  const [, pBase, pUnit] = PAREN_SUFFIX.exec(s) ?? [];
  if (pBase !== undefined && pUnit !== undefined && pBase.trim() && parsePressureUnit(pUnit))
    return { base: pBase.trim(), unit: pUnit.trim() };
  return { base: s, unit: null };
}

export function cleanCell(cell: string): string {
  let s = cell.trim();
  if (s.length >= 2 && s.startsWith('"') && s.endsWith('"')) s = s.slice(1, -1).replace(/""/g, '"').trim();
  return s.replace(/^\uFEFF/, '');
}

/** Indices of header cells that name `wanted`: exact matches first, else the same name without a bracketed unit. */
export function findColumn(cells: readonly string[], wanted: string): number[] {
  const w = cleanCell(wanted);
  const exact: number[] = [];
  const loose: number[] = [];
  const wBase = splitUnit(w).base;
  cells.forEach((c, i) => {
    const cc = cleanCell(c);
    if (cc === w) exact.push(i);
    else if (cc && splitUnit(cc).base === wBase) loose.push(i);
  });
  return exact.length === 1 ? exact : [...exact, ...loose];
}

export interface MappedColumns {
  /** header cell index of the time column, or -1 */
  time: number;
  pressure: number;
  /** per plan channel (in plan order: gauges, then their channels), header cell index */
  channels: number[];
  channelNames: string[];
  missing: string[];
  duplicate: string[];
  pressureUnit: string | null;
}

/** Every channel of the plan in order (gauge by gauge, A B C for rosettes). */
export function planChannels(plan: Plan): string[] {
  return plan.gauges.flatMap((g) => g.channels);
}

export function mapColumns(plan: Plan, cells: readonly string[]): MappedColumns {
  const missing: string[] = [];
  const duplicate: string[] = [];
  const one = (name: string): number => {
    const hits = findColumn(cells, name);
    if (hits.length === 0) missing.push(name);
    else if (hits.length > 1) duplicate.push(name);
    return hits[0] ?? -1;
  };
  const pressure = one(plan.columns.pressure);
  const time = plan.columns.time ? one(plan.columns.time) : -1;
  const channelNames = planChannels(plan);
  const channels = channelNames.map(one);
  const pressureCell = cells[pressure]; // undefined when the pressure column is missing (-1)
  const pressureUnit = pressureCell !== undefined ? splitUnit(pressureCell).unit : null;
  return { time, pressure, channels, channelNames, missing, duplicate, pressureUnit };
}

export interface HeaderFound {
  /** 0-based index into the lines given */
  index: number;
  delimiter: Delimiter;
  cells: string[];
}

/**
 * The header is the first line that holds the plan's pressure column together with at least one
 * other mapped column (so a preamble line that merely mentions the pressure channel is skipped).
 * Returns the first line that holds the pressure column alone as `weak` when no better line is seen.
 */
export function findHeaderLine(
  plan: Plan,
  lines: readonly string[],
): { strong: HeaderFound | null; weak: HeaderFound | null } {
  const others = [plan.columns.time, ...planChannels(plan)].filter((x): x is string => !!x);
  let weak: HeaderFound | null = null;
  for (const [i, line] of lines.entries()) {
    if (!line.trim()) continue;
    let best: { d: Delimiter; cells: string[]; score: number } | null = null;
    for (const d of DELIMITERS) {
      if (d !== ',' && line.indexOf(d) < 0 && best) continue;
      const cells = splitCells(line, d);
      if (findColumn(cells, plan.columns.pressure).length === 0) continue;
      const score = others.reduce((s, o) => s + (findColumn(cells, o).length > 0 ? 1 : 0), 0);
      if (!best || score > best.score || (score === best.score && cells.length > best.cells.length))
        best = { d, cells, score };
    }
    if (!best) continue;
    const found = { index: i, delimiter: best.d, cells: best.cells.map(cleanCell) };
    if (best.score > 0 || others.length === 0) return { strong: found, weak };
    weak ??= found;
  }
  return { strong: null, weak };
}

/** The pressure unit written in the header (canonical, with absolute or gauge), or throw unknown-pressure-unit. */
export function resolvePressureUnit(unit: string | null, column: string, line: number): PressureUnitSpec | null {
  if (unit === null) return null;
  const u = parsePressureUnit(unit);
  if (!u)
    throw new InputError(
      'unknown-pressure-unit',
      `line ${line}, column '${column}': unknown pressure unit [${unit}] (use MPa, kPa, bar or psi; bar(a), psia or kPa abs for absolute pressure)`,
      { line, column },
    );
  return u;
}

const NUM_RE = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** A cell as a number; NaN for empty or non-numeric cells. Decimal comma accepted when allowed. */
export function parseNumberText(cell: string, allowDecimalComma: boolean): number {
  let s = cell.trim();
  if (s.length >= 2 && s.charCodeAt(0) === 34 && s.charCodeAt(s.length - 1) === 34) s = s.slice(1, -1).trim();
  if (allowDecimalComma && s.indexOf(',') >= 0) {
    if (s.indexOf('.') >= 0) return NaN;
    s = s.replace(',', '.');
  }
  return NUM_RE.test(s) ? Number(s) : NaN;
}

const ISO_RE = /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2})(?::(\d{2})(?:[.,](\d+))?)?\s*(Z|[+-]\d{2}:?\d{2})?$/;

/** ISO 8601 date-time as milliseconds since the epoch (no zone = UTC); NaN when it is not one. */
export function parseIsoMillis(cell: string): number {
  const m = ISO_RE.exec(cell.trim().replace(/^"|"$/g, ''));
  if (!m) return NaN;
  const [, y, mo, d, h, mi, s, frac, zone] = m;
  // year to minute are required groups: set whenever the pattern matched
  if (y === undefined || mo === undefined || d === undefined || h === undefined || mi === undefined) return NaN;
  let ms = Date.UTC(+y, +mo - 1, +d, +h, +mi, s ? +s : 0);
  if (frac) ms += Number('0.' + frac) * 1000;
  if (zone && zone !== 'Z') {
    const sign = zone[0] === '-' ? -1 : 1;
    const digits = zone.slice(1).replace(':', '');
    ms -= sign * (+digits.slice(0, 2) * 60 + +digits.slice(2, 4)) * 60000;
  }
  return Number.isFinite(ms) ? ms : NaN;
}
