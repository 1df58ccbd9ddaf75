import { describe, expect, it } from 'vitest';
import { canonicalJson } from './canonical-json';

describe('canonicalJson', () => {
  it('gives one text whatever order the keys were built in, at every depth', () => {
    const a = { b: 1, a: { y: [3, { q: 1, p: 2 }], x: 'é' } };
    const b = { a: { x: 'é', y: [3, { p: 2, q: 1 }] }, b: 1 };
    expect(canonicalJson(a)).toBe(canonicalJson(b));
    expect(canonicalJson(a)).toBe('{"a":{"x":"é","y":[3,{"p":2,"q":1}]},"b":1}');
  });

  it('drops undefined members and writes dates as JSON.stringify does; keeps array order', () => {
    expect(canonicalJson({ a: undefined, d: new Date('2026-01-02T03:04:05.006Z') })).toBe(
      '{"d":"2026-01-02T03:04:05.006Z"}',
    );
    expect(canonicalJson([2, 1])).not.toBe(canonicalJson([1, 2]));
    expect(canonicalJson(undefined)).toBe('null');
  });

  it('is unchanged by a JSON round trip (what the database gives back)', () => {
    const v = { n: 0.1 + 0.2, big: 1e21, neg: -0, s: 'line\nbreak', nested: [{ z: null, a: true }] };
    expect(canonicalJson(JSON.parse(JSON.stringify(v)))).toBe(canonicalJson(v));
  });
});
