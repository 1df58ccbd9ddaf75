import { describe, expect, it } from 'vitest';
import { backoffDelayMs, createPollPause } from './backoff.server';

describe('backoffDelayMs', () => {
  it('doubles per failure, with jitter between half and the whole, and stops at the maximum', () => {
    const low = () => 0;
    const high = () => 1;
    expect([0, 1, 2, 3].map((n) => backoffDelayMs(n, 2000, 300_000, high))).toEqual([2000, 4000, 8000, 16000]);
    expect([0, 1, 2, 3].map((n) => backoffDelayMs(n, 2000, 300_000, low))).toEqual([1000, 2000, 4000, 8000]);
    expect(backoffDelayMs(30, 2000, 300_000, high)).toBe(300_000);
    const spread = new Set(Array.from({ length: 50 }, () => backoffDelayMs(4, 2000, 300_000)));
    expect(spread.size).toBeGreaterThan(10);
    for (const d of spread) {
      expect(d).toBeGreaterThanOrEqual(16_000);
      expect(d).toBeLessThanOrEqual(32_000);
    }
  });
});

describe('createPollPause', () => {
  it('waits the poll interval while all is well, longer while the queue fails, and recovers', () => {
    const p = createPollPause({ pollMs: 100, maxMs: 5000 });
    expect(p.next()).toBe(100);
    for (let i = 0; i < 10; i++) p.failed();
    expect(p.next()).toBeGreaterThanOrEqual(2500);
    expect(p.next()).toBeLessThanOrEqual(5000);
    p.ok();
    expect(p.next()).toBe(100);
  });
});
