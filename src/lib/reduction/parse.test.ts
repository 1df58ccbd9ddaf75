// Log parsing rules (DESIGN 3.2 and 5): header detection, formats, units, errors with line and column.
import { describe, expect, it } from 'vitest';
import { inspectLogHead } from './inspect';
import { reduceLog } from './reduce';
import { InputError } from './errors';
import { parsePlan } from './plan';
import { demoPlan, demoPlanInput } from './testing/fixtures';
import { chunked, syntheticLog } from './testing/synthetic-log';
import { parseIsoMillis, parseNumberText } from './text';

const small = parsePlan({
  ...demoPlanInput,
  gauges: [
    { id: 'H1', kind: 'uniaxial', channels: ['SG1'], angleDeg: 90 },
    { id: 'A1', kind: 'uniaxial', channels: ['SG2'], angleDeg: 0 },
  ],
});

describe('inspectLogHead', () => {
  it('preamble, semicolon, decimal comma, bracketed unit', () => {
    const head = 'Device;DAQ\nStart;2025-01-01\n\ntime_s;P [bar];SG1;SG2\n0;0,1;1,5;2\n1;0,2;1,6;2,1\n2;0,3';
    const info = inspectLogHead(small, head);
    expect(info).toMatchObject({
      delimiter: ';',
      decimalComma: true,
      headerLine: 4,
      pressureUnit: 'bar',
      missingColumns: [],
      duplicateColumns: [],
    });
    expect(info.columns).toEqual(['time_s', 'P [bar]', 'SG1', 'SG2']);
    expect(info.previewRows.length).toBe(2); // the cut-off last line is dropped
  });
  it('tab, missing and duplicated columns reported', () => {
    const info = inspectLogHead(small, 'time_s\tP\tSG1\tSG1\n0\t0\t1\t1\n');
    expect(info.delimiter).toBe('\t');
    expect(info.missingColumns).toEqual(['SG2']);
    expect(info.duplicateColumns).toEqual(['SG1']);
  });
  it.each([
    ['binary', 'PK\u0003\u0004garbage', 'not-delimited-text'],
    ['NUL bytes', 'time,P\u0000\u0000', 'not-delimited-text'],
    ['no pressure column', 'time_s,Q,SG1\n0,1,2\n', 'pressure-column-not-found'],
    ['unknown unit', 'time_s,P [V],SG1,SG2\n', 'unknown-pressure-unit'],
    ['unit spelled like an Object key', 'time_s,P [constructor],SG1,SG2\n', 'unknown-pressure-unit'],
  ])('%s → InputError %s', (_n, head, code) => {
    expect(() => inspectLogHead(small, head)).toThrow(InputError);
    try {
      inspectLogHead(small, head);
    } catch (e) {
      expect((e as InputError).code).toBe(code);
    }
  });
});

async function reduceText(text: string, plan = small) {
  return reduceLog(plan, chunked(text, 17));
}
async function inputError(text: string | Uint8Array, plan = small): Promise<InputError> {
  try {
    await reduceLog(
      plan,
      typeof text === 'string'
        ? chunked(text, 64)
        : (async function* () {
            yield text;
          })(),
    );
  } catch (e) {
    if (e instanceof InputError) return e;
    throw e;
  }
  throw new Error('no error');
}

describe('log errors name the line and the column (DESIGN 5)', () => {
  const good = syntheticLog(small, { rateHz: 1 });
  it.each([
    [
      'a missing mapped column',
      'x\ntime_s,P [MPa],SG1\n0,0,1\n',
      'missing-column',
      2,
      'SG2',
      /line 2, column 'SG2': the header has no column 'SG2'/,
    ],
    [
      'a duplicated mapped column',
      'time_s,P [MPa],SG1,SG2,SG2\n0,0,1,2,3\n',
      'duplicate-column',
      1,
      'SG2',
      /line 1, column 'SG2': the header names column 'SG2' more than once/,
    ],
    [
      'a column with no number at all',
      good
        .split('\n')
        .map((l, i) => (i === 0 || !l ? l : l.replace(/[^,]*$/, 'n/a')))
        .join('\n'),
      'empty-column',
      1,
      'SG2',
      /line 1, column 'SG2': the column has no numeric value/,
    ],
    [
      'not delimited text',
      '\u0001\u0002\u0003\u0004\u0005\u0006\u0007\u0008 binary',
      'not-delimited-text',
      1,
      undefined,
      /not delimited text/,
    ],
    [
      'no pressure column anywhere',
      'a,b\n1,2\n',
      'pressure-column-not-found',
      undefined,
      'P [MPa]',
      /^No line in the first \d+ has the pressure column 'P \[MPa\]': check the log's header, or change the plan's pressure column$/,
    ],
    ['an empty file', '', 'no-data', undefined, undefined, /empty/],
    ['header only', 'time_s,P [MPa],SG1,SG2\n', 'no-data', 1, undefined, /no data rows/],
    [
      'fewer than three pressure levels',
      'time_s,P [MPa],SG1,SG2\n' + Array.from({ length: 100 }, (_, i) => `${i},${i < 50 ? 0 : 1.7},${i},1`).join('\n'),
      'too-few-levels',
      undefined,
      'P [MPa]',
      /2 distinct pressure levels/,
    ],
  ])('%s', async (_n, text, code, line, column, message) => {
    const e = await inputError(text);
    expect(e.code).toBe(code);
    if (line !== undefined) expect(e.details?.line).toBe(line);
    if (column !== undefined) expect(e.details?.column).toBe(column);
    expect(e.message).toMatch(message);
  });
  it('a ZIP (xlsx) says to export CSV', async () => {
    const e = await inputError(new Uint8Array([0x50, 0x4b, 0x03, 0x04, 1, 2, 3]));
    expect(e.message).toMatch(/export it as CSV/);
  });
  it('the header is found after a preamble even when a preamble line names the pressure channel', async () => {
    const { result } = await reduceText('Channel 1;P [MPa]\n' + syntheticLog(small, { format: { delimiter: ';' } }));
    expect(result.gauges[0]!.measuredSlope).toBeGreaterThan(0);
  });
});

describe('cells', () => {
  it.each([
    ['1.5', false, 1.5],
    ['1,5', true, 1.5],
    ['1,5', false, NaN],
    [' -2.5e3 ', false, -2500],
    ['"3.25"', false, 3.25],
    ['', false, NaN],
    ['ERR', false, NaN],
    ['1.2.3', false, NaN],
    ['1.234,5', true, NaN],
  ])('%j (decimal comma %s) → %f', (cell, dc, want) => expect(parseNumberText(cell, dc)).toEqual(want));
  it.each([
    ['2025-03-14T09:00:00Z', Date.UTC(2025, 2, 14, 9)],
    ['2025-03-14 09:00:01.250', Date.UTC(2025, 2, 14, 9, 0, 1, 250)],
    ['2025-03-14T10:00:00+01:00', Date.UTC(2025, 2, 14, 9)],
    ['yesterday', NaN],
  ])('ISO %s', (cell, ms) => expect(parseIsoMillis(cell)).toEqual(ms));
  it('quoted cells go through the general path and give the same numbers', async () => {
    const csv = syntheticLog(small, { seed: 5 });
    const quoted = csv
      .split('\n')
      .map((l, i) =>
        i === 0 || !l
          ? l
          : l
              .split(',')
              .map((c) => `"${c}"`)
              .join(','),
      )
      .join('\n');
    const a = (await reduceText(csv)).result.gauges.map((g) => g.measuredSlope);
    const b = (await reduceText(quoted)).result.gauges.map((g) => g.measuredSlope);
    b.forEach((s, i) => expect(s).toBeCloseTo(a[i]!, 10));
  });
  it('blank lines, trailing delimiters-only lines and a repeated header are skipped', async () => {
    const csv = syntheticLog(small, { seed: 5 });
    const lines = csv.split('\n');
    const noisy = [lines[0], ...lines.slice(1, 300), '', ',,,', lines[0], ...lines.slice(300)].join('\n');
    const { result } = await reduceText(noisy);
    expect(result.log.missingSamples).toBe(0);
    expect(result.warnings.join(' ')).toMatch(/1 repeated header line in the data skipped/);
  });
  it('demo plan reduces a UTF-16 log', async () => {
    const plan = demoPlan();
    const csv = syntheticLog(plan, { seed: 2 });
    const u16 = new Uint8Array(2 + csv.length * 2);
    u16[0] = 0xff;
    u16[1] = 0xfe;
    for (let i = 0; i < csv.length; i++) {
      u16[2 + 2 * i] = csv.charCodeAt(i) & 0xff;
      u16[3 + 2 * i] = csv.charCodeAt(i) >> 8;
    }
    const a = (await reduceLog(plan, chunked(csv))).result;
    const b = (
      await reduceLog(
        plan,
        (async function* () {
          for (let i = 0; i < u16.length; i += 1001) yield u16.subarray(i, i + 1001);
        })(),
      )
    ).result;
    b.gauges.forEach((g, i) => expect(g.measuredSlope).toBeCloseTo(a.gauges[i]!.measuredSlope!, 10));
  });
});
