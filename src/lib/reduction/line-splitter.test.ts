import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { LineSplitter } from './line-splitter';

const decoder = new TextDecoder();
function split(chunks: Uint8Array[], max = Infinity): string[] {
  const out: string[] = [];
  const s = new LineSplitter(
    (buf, a, b) => out.push(decoder.decode(buf.subarray(a, b))),
    max,
    (n) => {
      throw new Error(`line of ${n} bytes`);
    },
  );
  for (const c of chunks) s.push(c);
  s.finish();
  return out;
}
const bytes = (s: string) => new TextEncoder().encode(s);
function cut(b: Uint8Array, at: number[]): Uint8Array[] {
  const points = [0, ...at.filter((x) => x > 0 && x < b.length).sort((x, y) => x - y), b.length];
  return points.slice(1).map((end, i) => b.subarray(points[i], end));
}

describe('LineSplitter: byte chunks cut anywhere give the same lines', () => {
  const text = 'a,b\r\n1,2\n\n3,µε\r\nlast';
  const want = ['a,b', '1,2', '', '3,µε', 'last'];
  it('one chunk', () => expect(split([bytes(text)])).toEqual(want));
  it('every byte its own chunk, including between CR and LF and inside µ', () =>
    expect(split([...bytes(text)].map((b) => new Uint8Array([b])))).toEqual(want));
  it('any cut points (property)', () =>
    fc.assert(
      fc.property(fc.array(fc.nat(40), { maxLength: 8 }), (at) => {
        expect(split(cut(bytes(text), at))).toEqual(want);
      }),
    ));
  it('a final LF gives no empty last line', () => expect(split([bytes('x\ny\n')])).toEqual(['x', 'y']));
  it('a line longer than the limit is refused while it is still arriving', () =>
    expect(() => split([bytes('x'.repeat(30)), bytes('y'.repeat(30))], 50)).toThrow(/line of 60 bytes/));
});
