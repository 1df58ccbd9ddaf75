import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { scanNumber, scanned } from './number-scan';

const scan = (s: string, delim = ',', comma = false) => {
  const b = new TextEncoder().encode(s);
  return {
    v: scanNumber(b, 0, b.length, delim.charCodeAt(0), comma),
    end: scanned.end,
    comma: scanned.comma,
    quoted: scanned.quoted,
  };
};

describe('scanNumber', () => {
  it.each([
    ['1.5', 1.5],
    ['-2.5e3', -2500],
    ['+7', 7],
    [' 12.25 ', 12.25],
    ['.5', 0.5],
    ['5.', 5],
    ['1e-7', 1e-7],
    ['12345678901234567', Number('12345678901234567')], // more than 15 digits: the text path
    ['1e400', NaN], // overflows to Infinity: not a number
    ['', NaN],
    ['-', NaN],
    ['1.2.3', NaN],
    ['12abc', NaN],
    ['1e', NaN],
  ])('%j → %d', (s, want) => expect(scan(s).v).toEqual(want));
  it('stops at the delimiter and says where', () => {
    const r = scan('3.25,9');
    expect(r.v).toBe(3.25);
    expect(r.end).toBe(4);
  });
  it('a decimal comma only when allowed (semicolon or tab logs)', () => {
    expect(scan('1,5', ';', true)).toMatchObject({ v: 1.5, comma: true });
    expect(scan('1,5', ',', false).v).toBe(1);
    expect(scan('1.234,5', ';', true).v).toBeNaN();
  });
  it('a quote sends the line to the quote-aware path', () => expect(scan('"3"').quoted).toBe(true));
  it('equals Number(text) for any double written in fixed or exponent notation (property)', () =>
    fc.assert(
      fc.property(
        fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e12, max: 1e12 }),
        fc.integer({ min: 0, max: 9 }),
        (x, d) => {
          for (const s of [x.toFixed(d), x.toExponential(d), String(x)]) expect(scan(s).v).toBe(Number(s));
        },
      ),
      { numRuns: 2000 },
    ));
});
