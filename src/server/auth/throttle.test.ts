import { describe, expect, it } from 'vitest';
import { THROTTLE, waitFor } from './throttle.server';

const now = new Date('2026-12-02T12:00:00Z');
const ago = (ms: number) => new Date(now.getTime() - ms);

describe('waitFor', () => {
  it('lets the free failures through, then waits 30 s, doubling to at most 15 minutes', () => {
    expect(waitFor('pair', 4, now, now)).toBe(0);
    expect(waitFor('pair', 5, now, now)).toBe(30_000);
    expect(waitFor('pair', 6, now, now)).toBe(60_000);
    expect(waitFor('pair', 9, now, now)).toBe(480_000);
    expect(waitFor('pair', 40, now, now)).toBe(THROTTLE.maxWaitMs);
    expect(waitFor('email', 9, now, now)).toBe(0);
    expect(waitFor('email', 10, now, now)).toBe(30_000);
    expect(waitFor('address', 29, now, now)).toBe(0);
    expect(waitFor('address', 30, now, now)).toBe(30_000);
  });

  it('counts the wait from the last failure, and forgets a counter quiet for the window', () => {
    expect(waitFor('pair', 5, ago(10_000), now)).toBe(20_000);
    expect(waitFor('pair', 5, ago(40_000), now)).toBe(0);
    expect(waitFor('pair', 20, ago(THROTTLE.windowMs + 1), now)).toBe(0);
  });
});
