// Push-style log reader: byte chunks of one segment at a time (cut anywhere), the segment's header
// found and its columns mapped, every data row handed to a callback as numbers. Holds only one
// partial line and a sniffing window of 4 KB. Data lines go through the byte number scanner
// (number-scan.ts); lines with quotes go through papaparse. No node imports: any bytes or text in.
import { InputError } from './errors';
import { LineSplitter } from './line-splitter';
import { latin1, scanNumber, scanned, scanPlainDecimal, skipCell } from './number-scan';
import type { Plan } from './plan';
import type { PressureConversion } from './types';
import { planPressureUnit, pressureFactor, standardAtmosphere } from './units';
import {
  assertTextBytes,
  cleanCell,
  findHeaderLine,
  mapColumns,
  parseIsoMillis,
  parseNumberText,
  resolvePressureUnit,
  sniffBytes,
  splitCells,
  type Delimiter,
  type Encoding,
  type HeaderFound,
} from './text';

export type ChunkSource = AsyncIterable<Uint8Array | string>;

/**
 * Called for each data row with a pressure value: time (s from the log's start, or row index),
 * gauge pressure in plan units, channel values (NaN = missing; the array is reused for every row).
 */
export type RowCallback = (t: number, p: number, channels: Float64Array) => void;

const MAX_PREAMBLE_LINES = 1000;
const MAX_PREAMBLE_BYTES = 1 << 20;
const MAX_LINE_BYTES = 1 << 20;
const SNIFF_BYTES = 4096;

export interface SegmentInfo {
  headerLine: number;
  delimiter: Delimiter;
  encoding: Encoding;
  /** canonical unit from the header, or null */
  pressureUnit: string | null;
  /** how the pressure column becomes gauge pressure in the plan's unit; null: no unit, taken as the plan's */
  conversion: PressureConversion | null;
  rows: number;
}

export interface ReadSummary {
  rows: number;
  missingSamples: number;
  firstMissing: { line: number; column: string; source: number } | null;
  timeMode: 'seconds' | 'iso' | 'index';
  timeSpan: [number, number] | null;
  startTime: string | null;
  decimalComma: boolean;
  segments: SegmentInfo[];
  warnings: string[];
  /** per mapped column (time, pressure, channels…) the count of numeric cells */
  validCounts: Map<string, number>;
  /** the highest value of a pressure column without a unit, where it is, and its header text */
  unitlessPeak: { value: number; line: number; source: number; column: string } | null;
}

const fmt = (x: number, digits = 6) => Number(x.toPrecision(digits)).toString();

export class LogReader {
  private readonly plan: Plan;
  private readonly onRow: RowCallback;
  /** one value per mapped column: time, pressure, then the channels; colNames and missingCounts run parallel */
  private readonly vals: Float64Array;
  private readonly chView: Float64Array;
  private readonly colNames: string[];
  /** per mapped column the rows without a number in it (valid = rows − missing) */
  private readonly missingCounts: Float64Array;
  private readonly warnings: string[] = [];
  private readonly segments: SegmentInfo[] = [];
  onProgress?: (bytes: number) => void;
  private bytesRead = 0;

  // whole-log state
  private rows = 0;
  private missing = 0;
  private firstMissing: ReadSummary['firstMissing'] = null;
  private timeMode: 'seconds' | 'iso' | 'index' | null = null;
  private origin = NaN;
  private lastT = NaN;
  private prevT = NaN;
  private firstT = NaN;
  private startIso: string | null = null;
  private decimalComma = false;
  private backwardsWarned = false;
  private repeatedHeaders = 0;
  private unitlessPeak: ReadSummary['unitlessPeak'] = null;

  // per-segment state
  private src = -1;
  private open = false;
  private lineNo = 0;
  private splitter: LineSplitter | null = null;
  private sniffed = false;
  private sniffBuf: Uint8Array | null = null;
  private transcoder: TextDecoder | null = null;
  private headDecoder = new TextDecoder('utf-8');
  private encoding: Encoding = 'utf-8';
  private readonly encoder = new TextEncoder();
  private segment: SegmentInfo | null = null;
  private preambleBytes = 0;
  private weak: { found: HeaderFound; line: number } | null = null;
  private delim = 44;
  private allowComma = false;
  /** per header field up to maxField (its last index): the slot in vals, or −1 for an unmapped field */
  private fieldSlot: Int32Array = new Int32Array(0);
  private maxField = -1;
  private hasTime = false;
  private factor = 1;
  private atmosphere = 0;
  private unitless = false;
  private pressureHeader = '';
  private segOffset = 0;
  private segFirst = true;
  private headerText = '';

  constructor(plan: Plan, onRow: RowCallback) {
    this.plan = plan;
    this.onRow = onRow;
    const chans = plan.gauges.flatMap((g) => g.channels);
    this.vals = new Float64Array(2 + chans.length);
    this.chView = this.vals.subarray(2);
    this.colNames = [plan.columns.time ?? '(time)', plan.columns.pressure, ...chans];
    this.missingCounts = new Float64Array(2 + chans.length);
  }

  /** The physical line last read (1-based, counting preamble and header). */
  get line(): number {
    return this.lineNo;
  }

  /** The segment being read (0-based). */
  get source(): number {
    return this.src;
  }

  private where(line: number, column?: string) {
    const seg = this.segments.length > 1 || this.src > 0 ? `log ${this.src + 1}, ` : '';
    return `${seg}line ${line}${column !== undefined ? `, column '${column}'` : ''}`;
  }

  /** Start the next segment (a file with its own preamble and header). */
  beginSegment(): void {
    if (this.open) this.endSegment();
    this.src++;
    this.open = true;
    this.lineNo = 0;
    this.segFirst = true;
    this.sniffed = false;
    this.sniffBuf = null;
    this.transcoder = null;
    this.headDecoder = new TextDecoder('utf-8');
    this.encoding = 'utf-8';
    this.segment = null;
    this.preambleBytes = 0;
    this.weak = null;
    this.splitter = new LineSplitter(
      (buf, a, b) => this.line_(buf, a, b),
      MAX_LINE_BYTES,
      () => {
        throw new InputError(
          'not-delimited-text',
          `${this.where(this.lineNo + 1)}: a line longer than 1 MB (not a delimited log?)`,
          { line: this.lineNo + 1, source: this.src },
        );
      },
    );
  }

  /** Bytes (or text) of the current segment, in order; a chunk may end anywhere. */
  push(chunk: Uint8Array | string): void {
    if (!this.open) this.beginSegment();
    const raw = typeof chunk === 'string' ? this.encoder.encode(chunk) : chunk;
    if (raw.length === 0) return;
    this.bytesRead += raw.length;
    this.handle(raw, false);
    this.onProgress?.(this.bytesRead);
  }

  /** The end of the current segment: its last line, and an error when it had no header. */
  endSegment(): void {
    if (!this.open) this.beginSegment();
    this.handle(new Uint8Array(0), true);
    this.splitter?.finish();
    this.open = false;
    if (!this.segment) {
      if (this.lineNo === 0)
        throw new InputError('no-data', this.src > 0 ? `log ${this.src + 1} is empty` : 'the log is empty', {
          line: 1,
          source: this.src,
        });
      this.failNoHeader(this.weak);
    }
    if (this.repeatedHeaders > 0) {
      this.warnings.push(
        `${this.repeatedHeaders} repeated header line${this.repeatedHeaders > 1 ? 's' : ''} in the data skipped`,
      );
      this.repeatedHeaders = 0;
    }
  }

  /** Read one whole segment from an async source (a stream, an S3 body). */
  async readSource(source: ChunkSource): Promise<void> {
    this.beginSegment();
    for await (const chunk of source)
      this.push(chunk instanceof Uint8Array || typeof chunk === 'string' ? chunk : new Uint8Array(chunk));
    this.endSegment();
  }

  private handle(raw: Uint8Array, final: boolean) {
    let bytes = raw;
    if (!this.sniffed) {
      const acc: Uint8Array = this.sniffBuf ? concat(this.sniffBuf, raw) : raw;
      if (acc.length < SNIFF_BYTES && !final) {
        this.sniffBuf = acc;
        return;
      }
      this.sniffBuf = null;
      const s = sniffBytes(acc);
      this.encoding = s.encoding;
      if (s.encoding === 'utf-16le' || s.encoding === 'utf-16be') this.transcoder = new TextDecoder(s.encoding);
      if (s.encoding === 'windows-1252') this.headDecoder = new TextDecoder('windows-1252');
      this.sniffed = true;
      bytes = acc.subarray(s.bomLength);
    }
    if (this.transcoder) bytes = this.encoder.encode(this.transcoder.decode(bytes, { stream: !final }));
    if (bytes.length === 0) return;
    if (this.segment) {
      const z = bytes.indexOf(0);
      if (z >= 0) assertTextBytes(bytes, 0, z + 1, this.lineNo + 1);
    }
    this.splitter!.push(bytes);
  }

  private line_(buf: Uint8Array, a: number, b: number) {
    this.lineNo++;
    if (!this.segment) this.preambleLine(buf, a, b);
    else if (b > a) this.dataLine(this.segment, buf, a, b);
  }

  private preambleLine(buf: Uint8Array, a: number, b: number) {
    this.preambleBytes += b - a + 1;
    let text = this.headDecoder.decode(buf.subarray(a, b));
    if (this.lineNo === 1) text = text.replace(/^\uFEFF/, '');
    const { strong, weak } = findHeaderLine(this.plan, [text]);
    if (strong) {
      this.segment = this.setupSegment(strong, this.lineNo);
      return;
    }
    if (weak && !this.weak) this.weak = { found: weak, line: this.lineNo };
    if (this.lineNo >= MAX_PREAMBLE_LINES || this.preambleBytes > MAX_PREAMBLE_BYTES) this.failNoHeader(this.weak);
  }

  /** The header at `line` lacks the `missing` columns (the pressure column when the list is empty). */
  private missingColumnError(line: number, missing: readonly string[]): InputError {
    const [name = this.plan.columns.pressure, ...others] = missing;
    const nor = others.length ? ` (nor ${others.map((x) => `'${x}'`).join(', ')})` : '';
    return new InputError('missing-column', `${this.where(line, name)}: the header has no column '${name}'${nor}`, {
      line,
      column: name,
      source: this.src,
    });
  }

  private failNoHeader(weak: { found: HeaderFound; line: number } | null): never {
    if (weak) throw this.missingColumnError(weak.line, mapColumns(this.plan, weak.found.cells).missing);
    throw new InputError(
      'pressure-column-not-found',
      `${this.src > 0 ? `log ${this.src + 1}: ` : ''}No line in the first ${this.lineNo} has the pressure column '${this.plan.columns.pressure}': check the log's header, or change the plan's pressure column`,
      { line: this.lineNo, column: this.plan.columns.pressure, source: this.src },
    );
  }

  private setupSegment(found: HeaderFound, line: number): SegmentInfo {
    const m = mapColumns(this.plan, found.cells);
    const [duplicate] = m.duplicate;
    if (duplicate !== undefined)
      throw new InputError(
        'duplicate-column',
        `${this.where(line, duplicate)}: the header names column '${duplicate}' more than once`,
        { line, column: duplicate, source: this.src },
      );
    const pressureHeader = found.cells[m.pressure]; // undefined when the pressure column is missing (-1)
    if (m.missing.length > 0 || pressureHeader === undefined) throw this.missingColumnError(line, m.missing);
    const conversion = this.pressureConversion(resolvePressureUnit(m.pressureUnit, pressureHeader, line));
    this.factor = conversion?.factor ?? 1;
    this.atmosphere = conversion?.atmosphere ?? 0;
    this.unitless = conversion === null;
    this.pressureHeader = pressureHeader;
    if (conversion && (conversion.fromUnit !== conversion.toUnit || conversion.absolute))
      this.warnings.push(
        `${this.segments.length ? `log ${this.src + 1}: ` : ''}pressure column '${pressureHeader}' is ${describeConversion(conversion)}`,
      );
    this.delim = found.delimiter.charCodeAt(0);
    this.allowComma = found.delimiter !== ',';
    const maxIndex = Math.max(m.time, m.pressure, ...m.channels);
    this.fieldSlot = new Int32Array(maxIndex + 1).fill(-1);
    if (m.time >= 0) this.fieldSlot[m.time] = 0;
    this.fieldSlot[m.pressure] = 1;
    m.channels.forEach((ci, k) => (this.fieldSlot[ci] = 2 + k));
    this.maxField = maxIndex;
    this.hasTime = m.time >= 0;
    this.headerText = found.cells.join('\u0001');
    const segment: SegmentInfo = {
      headerLine: line,
      delimiter: found.delimiter,
      encoding: this.encoding,
      pressureUnit: conversion?.fromUnit ?? null,
      conversion,
      rows: 0,
    };
    this.segments.push(segment);
    return segment;
  }

  /** Scale and offset that turn the header's unit into gauge pressure in the plan's unit. */
  private pressureConversion(spec: { unit: string; absolute: boolean } | null): PressureConversion | null {
    if (!spec) return null;
    const toUnit = planPressureUnit(this.plan.units);
    const given = this.plan.columns.atmosphericPressure;
    const atmosphere = spec.absolute ? (given ?? standardAtmosphere(toUnit)) : 0;
    return {
      fromUnit: spec.unit,
      toUnit,
      absolute: spec.absolute,
      factor: pressureFactor(spec.unit, toUnit),
      atmosphere,
      atmosphereSource: spec.absolute ? (given !== undefined ? 'plan' : 'standard') : 'none',
    };
  }

  /**
   * Fast path: false when the line needs the general (quote-aware) path. Every mapped slot is
   * written: a value, or NaN for a cell the line does not reach.
   */
  private scanLine(buf: Uint8Array, s: number, e: number): boolean {
    const vals = this.vals;
    const map = this.fieldSlot;
    const maxField = this.maxField;
    const delim = this.delim;
    let i = s;
    let field = 0;
    for (; field <= maxField; field++) {
      const slot = map[field]!; // field ≤ maxField, the last index of map
      if (slot >= 0) {
        let v = scanPlainDecimal(buf, i, e, delim);
        if (scanned.end < 0) {
          v = scanNumber(buf, i, e, delim, this.allowComma);
          if (scanned.quoted) return false;
          if (scanned.comma) this.decimalComma = true;
          if (slot === 0 && v !== v && this.timeMode !== 'seconds') v = this.isoField(buf, i, scanned.end);
        }
        vals[slot] = v;
        i = scanned.end;
      } else {
        i = skipCell(buf, i, e, delim);
        if (i < 0) return false;
      }
      if (i >= e) break;
      i++; // the delimiter
    }
    // a short line: the cells it does not reach are missing
    for (field++; field <= maxField; field++) {
      const slot = map[field]!;
      if (slot >= 0) vals[slot] = NaN;
    }
    return true;
  }

  private isoField(buf: Uint8Array, a: number, b: number): number {
    if (a >= b) return NaN;
    const ms = parseIsoMillis(latin1(buf, a, b));
    if (ms === ms && this.timeMode === null) this.timeMode = 'iso';
    return ms === ms ? ms / 1000 : NaN;
  }

  /** General path for a line with quotes: papaparse splits, the same number rules apply. */
  private slowLine(text: string) {
    const cells = splitCells(text, String.fromCharCode(this.delim) as Delimiter);
    const vals = this.vals;
    for (let f = 0; f <= this.maxField; f++) {
      const slot = this.fieldSlot[f]!; // f ≤ maxField, the last index of fieldSlot
      if (slot < 0) continue;
      const cell = cells[f] ?? ''; // a short line: the missing cells are empty
      let v = parseNumberText(cell, this.allowComma);
      if (slot === 0 && v !== v && this.timeMode !== 'seconds') {
        const ms = parseIsoMillis(cell);
        if (ms === ms && this.timeMode === null) this.timeMode = 'iso';
        v = ms === ms ? ms / 1000 : NaN;
      }
      vals[slot] = v;
    }
    if (this.allowComma && /\d,\d/.test(text)) this.decimalComma = true;
  }

  private dataLine(segment: SegmentInfo, buf: Uint8Array, s: number, e: number) {
    const vals = this.vals;
    if (!this.scanLine(buf, s, e)) {
      vals.fill(NaN);
      this.slowLine(new TextDecoder().decode(buf.subarray(s, e)));
    }
    // a blank line (only spaces and delimiters) is skipped
    let any = false;
    for (let k = this.hasTime ? 0 : 1; k < vals.length; k++)
      if (vals[k] === vals[k]) {
        any = true;
        break;
      }
    if (!any) {
      let blank = true;
      for (let i = s; i < e; i++) {
        const c = buf[i];
        if (c !== 32 && c !== this.delim && c !== 9 && c !== 13) {
          blank = false;
          break;
        }
      }
      if (blank) return;
      const text = new TextDecoder().decode(buf.subarray(s, e));
      const cells = splitCells(text, String.fromCharCode(this.delim) as Delimiter).map(cleanCell);
      if (cells.join('\u0001') === this.headerText) {
        this.repeatedHeaders++;
        return;
      }
    }
    this.finishRow(segment);
  }

  /** k: a slot of vals, which colNames parallels */
  private noteMissing(k: number) {
    this.missing++;
    this.missingCounts[k]!++;
    if (!this.firstMissing) this.firstMissing = { line: this.lineNo, column: this.colNames[k]!, source: this.src };
  }

  private finishRow(segment: SegmentInfo) {
    const vals = this.vals;
    segment.rows++;
    const rowIndex = this.rows++;
    // vals has a fixed length (time, pressure, channels)
    for (let k = 1; k < vals.length; k++) if (vals[k] !== vals[k]) this.noteMissing(k);
    let t: number;
    if (!this.hasTime) {
      t = rowIndex;
      this.timeMode = 'index';
    } else {
      const raw = vals[0]!;
      if (raw !== raw) {
        this.noteMissing(0);
        t = this.lastT === this.lastT ? this.lastT + (this.lastT - this.prevT || 0) : rowIndex;
      } else {
        if (this.timeMode === null) this.timeMode = 'seconds';
        if (this.origin !== this.origin) {
          this.origin = raw;
          if (this.timeMode === 'iso') this.startIso = new Date(raw * 1000).toISOString();
        }
        if (this.segFirst && this.src > 0 && this.lastT === this.lastT) {
          // a later segment: continue the clock; restart it if the segment's own clock starts over
          const sameClock = raw - this.origin;
          const dt = this.lastT - this.prevT > 0 ? this.lastT - this.prevT : 1;
          this.segOffset = sameClock > this.lastT ? -this.origin : this.lastT + dt - raw;
        } else if (this.segFirst && this.src === 0) this.segOffset = -this.origin;
        this.segFirst = false;
        t = raw + this.segOffset;
      }
      if (t < this.lastT && !this.backwardsWarned) {
        this.backwardsWarned = true;
        this.warnings.push(
          `${this.where(this.lineNo, this.plan.columns.time)}: time goes backwards (holds use the time column as given)`,
        );
      }
    }
    if (this.firstT !== this.firstT) this.firstT = t;
    this.prevT = this.lastT;
    this.lastT = t;
    const p = vals[1]!;
    if (p !== p) return;
    if (this.unitless && (this.unitlessPeak === null || p > this.unitlessPeak.value))
      this.unitlessPeak = { value: p, line: this.lineNo, source: this.src, column: this.pressureHeader };
    this.onRow(t, p * this.factor - this.atmosphere, this.chView);
  }

  summary(): ReadSummary {
    const validCounts = new Map<string, number>();
    this.colNames.forEach((name, k) => {
      if (k === 0 && !this.plan.columns.time) return;
      validCounts.set(name, this.rows - this.missingCounts[k]!); // parallel to colNames from the constructor on
    });
    return {
      rows: this.rows,
      missingSamples: this.missing,
      firstMissing: this.firstMissing,
      timeMode: this.timeMode ?? (this.hasTime ? 'seconds' : 'index'),
      timeSpan: this.rows > 0 && this.firstT === this.firstT ? [this.firstT, this.lastT] : null,
      startTime: this.startIso,
      decimalComma: this.decimalComma,
      segments: this.segments,
      warnings: this.warnings,
      validCounts,
      unitlessPeak: this.unitlessPeak,
    };
  }
}

/**
 * How a pressure column was converted, in words: "in bar; converted to MPa (the plan's pressure
 * unit)", or for absolute pressure "absolute pressure in bar(a); converted to MPa (× 0.1) and to
 * gauge pressure by subtracting the standard atmosphere 0.101325 MPa".
 */
export function describeConversion(c: PressureConversion): string {
  if (!c.absolute) return `in ${c.fromUnit}; converted to ${c.toUnit} (the plan's pressure unit)`;
  const scale = c.fromUnit !== c.toUnit ? ` (× ${fmt(c.factor)})` : '';
  const atm = c.atmosphereSource === 'plan' ? "the plan's atmospheric pressure" : 'the standard atmosphere';
  return `absolute pressure in ${c.fromUnit}; converted to ${c.toUnit}${scale} and to gauge pressure by subtracting ${atm} ${fmt(c.atmosphere)} ${c.toUnit}`;
}

function concat(a: Uint8Array, b: Uint8Array): Uint8Array {
  const out = new Uint8Array(a.length + b.length);
  out.set(a, 0);
  out.set(b, a.length);
  return out;
}
