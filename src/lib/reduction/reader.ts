// Streaming log reader: finds each segment's header, maps the plan's columns, and hands every data
// row to a callback as numbers. Holds only the current chunk and one partial line. Data lines go
// through a hand-written byte scanner (numbers converted directly from bytes); lines with quotes
// or odd content go through papaparse. No node imports: input is any AsyncIterable of bytes or text.
import { InputError } from './errors';
import type { Plan } from './plan';
import { pressureFactor, planPressureUnit } from './units';
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

/** Called for each data row with a finite pressure: time (s from the log's start, or row index), pressure in plan units, channel values (NaN = missing). */
export type RowCallback = (t: number, p: number, channels: Float64Array) => void;

const MAX_PREAMBLE_LINES = 1000;
const MAX_PREAMBLE_BYTES = 1 << 20;
const MAX_LINE_BYTES = 1 << 20;
const POW10 = Array.from({ length: 23 }, (_, i) => 10 ** i);

export interface SegmentInfo {
  headerLine: number;
  delimiter: Delimiter;
  encoding: Encoding;
  pressureUnit: string | null;
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
}

/** Bytes [a, b) of buf (b ≤ buf.length) as Latin-1 text. */
const latin1 = (buf: Uint8Array, a: number, b: number) => {
  let s = '';
  for (let i = a; i < b; i++) s += String.fromCharCode(buf[i]!);
  return s;
};

export class LogReader {
  private readonly plan: Plan;
  private readonly onRow: RowCallback;
  private readonly nCh: number;
  /** one value per mapped column: time, pressure, then the channels; colNames and validCounts run parallel */
  private readonly vals: Float64Array;
  private readonly chView: Float64Array;
  private readonly colNames: string[];
  private readonly validCounts: Float64Array;
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

  // per-segment state
  private src = 0;
  private lineNo = 0;
  private delim = 44;
  private allowComma = false;
  /** per header field up to maxField (its last index): the slot in vals, or −1 for an unmapped field */
  private fieldSlot: Int32Array = new Int32Array(0);
  private maxField = -1;
  private hasTime = false;
  private factor = 1;
  private segOffset = 0;
  private segFirst = true;
  private headerText = '';
  private fieldEnd = 0;

  constructor(plan: Plan, onRow: RowCallback) {
    this.plan = plan;
    this.onRow = onRow;
    const chans = plan.gauges.flatMap((g) => g.channels);
    this.nCh = chans.length;
    this.vals = new Float64Array(2 + this.nCh);
    this.chView = this.vals.subarray(2);
    this.colNames = [plan.columns.time ?? '(time)', plan.columns.pressure, ...chans];
    this.validCounts = new Float64Array(2 + this.nCh);
  }

  private where(line: number, column?: string) {
    const seg = this.segments.length > 1 || this.src > 0 ? `log ${this.src + 1}, ` : '';
    return `${seg}line ${line}${column !== undefined ? `, column '${column}'` : ''}`;
  }

  /** Read one segment (a file with its own preamble and header). */
  async readSource(source: ChunkSource, index: number): Promise<void> {
    this.src = index;
    this.lineNo = 0;
    this.segFirst = true;
    let carry: Uint8Array | null = null;
    let sniffed = false;
    let sniffBuf: Uint8Array | null = null;
    let transcoder: TextDecoder | null = null;
    let headDecoder = new TextDecoder('utf-8');
    let encoding: Encoding = 'utf-8';
    const encoder = new TextEncoder();
    /** this segment once its header line is found; null while still in the preamble */
    let segment: SegmentInfo | null = null;
    let preambleBytes = 0;
    let weak: { found: HeaderFound; line: number } | null = null;

    const preambleLine = (buf: Uint8Array, a: number, b: number) => {
      preambleBytes += b - a + 1;
      let text = headDecoder.decode(buf.subarray(a, b));
      if (this.lineNo === 1) text = text.replace(/^\uFEFF/, '');
      const { strong, weak: w } = findHeaderLine(this.plan, [text]);
      if (strong) {
        segment = this.setupSegment(strong, this.lineNo, encoding);
        return;
      }
      if (w && !weak) weak = { found: w, line: this.lineNo };
      if (this.lineNo >= MAX_PREAMBLE_LINES || preambleBytes > MAX_PREAMBLE_BYTES) this.failNoHeader(weak);
    };

    const processBytes = (buf: Uint8Array, final: boolean) => {
      let pos = 0;
      const n = buf.length;
      if (segment) {
        const z = buf.indexOf(0);
        if (z >= 0) assertTextBytes(buf, 0, z + 1, this.lineNo + 1);
      }
      while (pos < n) {
        let nl = buf.indexOf(10, pos);
        if (nl < 0) {
          if (!final) break;
          nl = n;
        }
        this.lineNo++;
        let end = nl;
        if (end > pos && buf[end - 1] === 13) end--;
        if (!segment) preambleLine(buf, pos, end);
        else if (end > pos) this.dataLine(segment, buf, pos, end);
        pos = nl + 1;
      }
      if (pos < n) {
        if (n - pos > MAX_LINE_BYTES)
          throw new InputError(
            'not-delimited-text',
            `${this.where(this.lineNo + 1)}: a line longer than 1 MB (not a delimited log?)`,
            { line: this.lineNo + 1, source: index },
          );
        carry = buf.slice(pos);
      } else carry = null;
    };

    const feed = (bytes: Uint8Array, final: boolean) => {
      let buf = bytes;
      if (carry && carry.length) {
        const joined = new Uint8Array(carry.length + bytes.length);
        joined.set(carry, 0);
        joined.set(bytes, carry.length);
        buf = joined;
      }
      carry = null;
      processBytes(buf, final);
    };

    const start = (head: Uint8Array) => {
      const s = sniffBytes(head);
      encoding = s.encoding;
      if (encoding === 'utf-16le' || encoding === 'utf-16be') transcoder = new TextDecoder(encoding);
      if (encoding === 'windows-1252') headDecoder = new TextDecoder('windows-1252');
      sniffed = true;
      return head.subarray(s.bomLength);
    };

    const handle = (raw: Uint8Array, final: boolean) => {
      let bytes = raw;
      if (!sniffed) {
        const acc: Uint8Array = sniffBuf ? concat(sniffBuf, raw) : raw;
        if (acc.length < 4096 && !final) {
          sniffBuf = acc;
          return;
        }
        sniffBuf = null;
        bytes = start(acc);
      }
      if (transcoder) bytes = encoder.encode(transcoder.decode(bytes, { stream: !final }));
      feed(bytes, final);
    };

    for await (const chunk of source) {
      const raw =
        typeof chunk === 'string' ? encoder.encode(chunk) : chunk instanceof Uint8Array ? chunk : new Uint8Array(chunk);
      if (raw.length === 0) continue;
      this.bytesRead += raw.length;
      handle(raw, false);
      this.onProgress?.(this.bytesRead);
    }
    handle(new Uint8Array(0), true);
    const leftover = carry as Uint8Array | null;
    if (leftover && leftover.length) processBytes(leftover, true);
    if (!segment) {
      if (this.lineNo === 0)
        throw new InputError('no-data', index > 0 ? `log ${index + 1} is empty` : 'the log is empty', {
          line: 1,
          source: index,
        });
      this.failNoHeader(weak);
    }
    if (this.repeatedHeaders > 0) {
      this.warnings.push(
        `${this.repeatedHeaders} repeated header line${this.repeatedHeaders > 1 ? 's' : ''} in the data skipped`,
      );
      this.repeatedHeaders = 0;
    }
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
      `${this.src > 0 ? `log ${this.src + 1}: ` : ''}no header line holds the pressure column '${this.plan.columns.pressure}' (plan.columns.pressure) in the first ${this.lineNo} lines`,
      { line: this.lineNo, column: this.plan.columns.pressure, source: this.src },
    );
  }

  private setupSegment(found: HeaderFound, line: number, encoding: Encoding): SegmentInfo {
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
    const unit = resolvePressureUnit(m.pressureUnit, pressureHeader, line);
    const planUnit = planPressureUnit(this.plan.units);
    this.factor = unit ? pressureFactor(unit, planUnit) : 1;
    if (unit && unit !== planUnit)
      this.warnings.push(
        `${this.segments.length ? `log ${this.src + 1}: ` : ''}pressure column '${pressureHeader}' is in ${unit}; converted to ${planUnit} (the plan's pressure unit)`,
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
      encoding,
      pressureUnit: unit,
      rows: 0,
    };
    this.segments.push(segment);
    return segment;
  }

  /** Fast path: false when the line needs the general (quote-aware) path. */
  private scanLine(buf: Uint8Array, s: number, e: number): boolean {
    const vals = this.vals;
    const map = this.fieldSlot;
    const maxField = this.maxField;
    const delim = this.delim;
    let i = s;
    for (let field = 0; field <= maxField; field++) {
      const slot = map[field]!; // field ≤ maxField, the last index of map
      if (slot >= 0) {
        const v = this.parseField(buf, i, e);
        if (v === -Infinity) return false; // quote
        if (slot === 0 && v !== v && this.timeMode !== 'seconds') vals[0] = this.isoField(buf, i, this.fieldEnd);
        else vals[slot] = v;
        i = this.fieldEnd;
      } else {
        while (i < e) {
          const c = buf[i];
          if (c === delim) break;
          if (c === 34) return false;
          i++;
        }
      }
      if (i >= e) break;
      i++; // the delimiter
    }
    return true;
  }

  /**
   * A number from bytes [i, …) up to the delimiter; NaN for empty or not a number; −Infinity when quoted. Sets
   * fieldEnd. Hot: every byte read is at j < e ≤ buf.length, and POW10 covers the exponents |e10| ≤ 22 it is used for.
   */
  private parseField(buf: Uint8Array, i: number, e: number): number {
    const delim = this.delim;
    let j = i;
    while (j < e && buf[j] === 32) j++;
    if (j < e && buf[j] === 34) return -Infinity;
    const start = j;
    let neg = false;
    let c = j < e ? buf[j]! : 0;
    if (c === 45) {
      neg = true;
      j++;
    } else if (c === 43) j++;
    let mant = 0,
      digits = 0,
      frac = 0,
      sep = false,
      comma = false;
    for (; j < e; j++) {
      c = buf[j]!;
      if (c >= 48 && c <= 57) {
        mant = mant * 10 + (c - 48);
        digits++;
        if (sep) frac++;
      } else if (c === 46 && !sep) sep = true;
      else if (c === 44 && !sep && this.allowComma) {
        sep = true;
        comma = true;
      } else break;
    }
    let exp = 0;
    let ok = digits > 0;
    if (ok && j < e && (c === 101 || c === 69)) {
      j++;
      let eneg = false;
      c = j < e ? buf[j]! : 0;
      if (c === 45 || c === 43) {
        eneg = c === 45;
        j++;
      }
      let ed = 0;
      while (j < e && (c = buf[j]!) >= 48 && c <= 57) {
        exp = exp * 10 + (c - 48);
        ed++;
        j++;
      }
      if (ed === 0) ok = false;
      if (eneg) exp = -exp;
    }
    while (j < e && buf[j] === 32) j++;
    if (j < e && buf[j] !== delim) {
      ok = false;
      while (j < e && buf[j] !== delim) {
        if (buf[j] === 34) return -Infinity;
        j++;
      }
    }
    this.fieldEnd = j;
    if (!ok) return NaN;
    if (comma) this.decimalComma = true;
    let v: number;
    const e10 = exp - frac;
    if (digits > 15 || e10 > 22 || e10 < -22) v = parseNumberText(latin1(buf, start, j), this.allowComma);
    else {
      v = e10 === 0 ? mant : e10 > 0 ? mant * POW10[e10]! : mant / POW10[-e10]!;
      if (neg) v = -v;
    }
    return Number.isFinite(v) ? v : NaN;
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
    vals.fill(NaN);
    if (!this.scanLine(buf, s, e)) this.slowLine(new TextDecoder().decode(buf.subarray(s, e)));
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
    if (!this.firstMissing) this.firstMissing = { line: this.lineNo, column: this.colNames[k]!, source: this.src };
  }

  private finishRow(segment: SegmentInfo) {
    const vals = this.vals;
    segment.rows++;
    const rowIndex = this.rows++;
    const counts = this.validCounts;
    // vals and counts have the same fixed length (time, pressure, channels)
    for (let k = 1; k < vals.length; k++) {
      if (vals[k] === vals[k]) counts[k]!++;
      else this.noteMissing(k);
    }
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
        counts[0]!++;
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
    if (p === p) this.onRow(t, p * this.factor, this.chView);
  }

  summary(): ReadSummary {
    const validCounts = new Map<string, number>();
    this.colNames.forEach((name, k) => {
      if (k === 0 && !this.plan.columns.time) return;
      validCounts.set(name, this.validCounts[k]!); // parallel to colNames from the constructor on
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
    };
  }
}

function concat(a: Uint8Array, b: Uint8Array): Uint8Array {
  const out = new Uint8Array(a.length + b.length);
  out.set(a, 0);
  out.set(b, a.length);
  return out;
}
