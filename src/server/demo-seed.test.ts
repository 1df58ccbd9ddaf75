// The demo scenario must read like a real test (noise, settling, drift, one creeping gauge), not
// like a perfect synthetic line: a practitioner distrusts a record where every R² is 1.0000.
import { describe, expect, it } from 'vitest';
import { parsePlan } from '../lib/reduction';
import { reduceLog } from '../lib/reduction/reduce';
import { syntheticLog } from '../lib/reduction/testing/synthetic-log';
import { demoLogOptions, demoPlan } from './demo-seed.server';

describe('the demo log', () => {
  it('reduces to what the demo is about, with the scatter of a real acquisition', async () => {
    const plan = parsePlan(demoPlan);
    const csv = syntheticLog(plan, demoLogOptions);
    async function* source() {
      yield new TextEncoder().encode(csv);
    }
    const { result } = await reduceLog(plan, source());
    const g = Object.fromEntries(result.gauges.map((x) => [x.id, x]));
    // the two stories: A2 reads low and is flagged, H3 beside the nozzle is in the edge zone
    expect(g.A2!.flags).toContain('outside-band');
    expect(g.A2!.ratio!).toBeGreaterThan(0.85);
    expect(g.A2!.ratio!).toBeLessThan(0.9);
    expect(g.H3!.flags).toContain('edge-zone');
    // no fit is a perfect line, none so poor it is flagged nonlinear
    const r2 = result.gauges.map((x) => x.rSquared!);
    for (const r of r2) {
      expect(r).toBeLessThan(0.99995);
      expect(r).toBeGreaterThan(0.995);
    }
    expect(new Set(r2.map((r) => r.toFixed(4))).size).toBeGreaterThan(3);
    // H2 creeps a little in the hold at test pressure, less than the flag's limit
    expect(g.H2!.holdCreep!).toBeGreaterThan(5);
    expect(g.H2!.flags).not.toContain('hold-creep');
    expect(g.H1!.holdCreep!).toBeLessThan(3);
    expect(result.verdict).toBe('flagged');
  });

  it('is marked as a demo everywhere a person sees it', () => {
    expect(demoPlan.vessel.name).toMatch(/AR-102/);
    expect(demoLogOptions.format?.preamble).toContain('operator,demo');
  });
});
