// Property-based: random bytes and random malformed CSV never crash the parser; every run ends
// in a result or an InputError (never a TypeError or a RangeError).
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { reduceLog } from './reduce';
import { inspectLogHead } from './inspect';
import { InputError } from './errors';
import { parsePlan } from './plan';
import { demoPlanInput } from './testing/fixtures';
import { syntheticLog } from './testing/synthetic-log';

const plan = parsePlan({
  ...demoPlanInput,
  gauges: [
    { id: 'H1', kind: 'uniaxial', channels: ['SG1'], angleDeg: 90 },
    { id: 'R1', kind: 'rosette-delta', channels: ['SG4', 'SG5', 'SG6'], angleDeg: 0, transverseSensitivity: 0.02 },
  ],
});

async function outcome(chunks: (Uint8Array | string)[]): Promise<'result' | 'input-error'> {
  try {
    const { result } = await reduceLog(
      plan,
      (async function* () {
        yield* chunks;
      })(),
    );
    expect(['conforms', 'flagged', 'incomplete']).toContain(result.verdict);
    expect(() => JSON.stringify(result)).not.toThrow();
    return 'result';
  } catch (e) {
    if (e instanceof InputError) {
      expect(e.message.length).toBeGreaterThan(0);
      expect(e.message).not.toMatch(/\n/);
      return 'input-error';
    }
    throw e;
  }
}

const good = syntheticLog(plan, { rateHz: 1, holdSeconds: 20, rampSeconds: 10 });
const goodLines = good.split('\n');

describe('the parser never crashes', () => {
  it('random bytes', async () => {
    await fc.assert(
      fc.asyncProperty(fc.uint8Array({ maxLength: 3000 }), async (bytes) => {
        await outcome([bytes]);
      }),
      { numRuns: 150 },
    );
  });
  it('random text in random chunks', async () => {
    await fc.assert(
      fc.asyncProperty(fc.array(fc.string({ unit: 'binary', maxLength: 200 }), { maxLength: 20 }), async (parts) => {
        await outcome(parts);
      }),
      { numRuns: 150 },
    );
  });
  it('a real header followed by malformed rows', async () => {
    const cell = fc.oneof(
      fc.constantFrom('', 'NaN', '-', '"', '""', '1e999', '1,5', ';', '\t', '\r', 'ERR', '2025-01-01T00:00:00Z'),
      fc.double({ noNaN: false }).map(String),
      fc.string({ maxLength: 6 }),
    );
    const row = fc.array(cell, { maxLength: 9 }).map((c) => c.join(fc.sample(fc.constantFrom(',', ';', '\t'), 1)[0]));
    await fc.assert(
      fc.asyncProperty(fc.array(row, { maxLength: 60 }), fc.integer({ min: 1, max: 97 }), async (rows, size) => {
        const text = goodLines[0] + '\n' + rows.join('\n');
        const bytes = new TextEncoder().encode(text);
        const chunks: Uint8Array[] = [];
        for (let i = 0; i < bytes.length; i += size) chunks.push(bytes.subarray(i, i + size));
        await outcome(chunks);
      }),
      { numRuns: 150 },
    );
  });
  it('a good log with random damage (lines dropped, cells replaced, cut anywhere)', async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.array(fc.tuple(fc.nat(goodLines.length - 1), fc.string({ maxLength: 12 })), { maxLength: 30 }),
        fc.nat(good.length),
        async (edits, cut) => {
          const lines = [...goodLines];
          for (const [i, s] of edits) lines[i] = s;
          await outcome([lines.join('\n').slice(0, cut)]);
        },
      ),
      { numRuns: 100 },
    );
  });
  it('inspectLogHead on random text ends in info or InputError', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'binary', maxLength: 500 }), (s) => {
        try {
          inspectLogHead(plan, s);
        } catch (e) {
          if (!(e instanceof InputError)) throw e;
        }
      }),
      { numRuns: 300 },
    );
  });
});
