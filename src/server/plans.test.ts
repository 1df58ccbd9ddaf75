import { describe, expect, it } from 'vitest';
import { toAppError } from './errors';
import { validatePlan } from './plans.server';

const plan = (ids: string[]) => ({
  units: 'SI',
  vessel: { shape: 'cylinder', ends: 'closed', insideDiameter: 1000, wallThickness: 10, length: 4000 },
  material: { elasticModulus: 200_000, poissonRatio: 0.3, yieldStrength: 260 },
  testPressure: 2,
  columns: { pressure: 'P [MPa]' },
  gauges: ids.map((id, i) => ({ id, kind: 'uniaxial', channels: [`SG${i}`], angleDeg: 90 })),
});

describe('gauge ids', () => {
  it('accept up to 60 characters of letters, digits, space, dot, underscore and hyphen', () => {
    expect(() => validatePlan(plan(['H1', 'A-2', 'R1.a', 'nozzle N1 hoop', 'x'.repeat(60)]))).not.toThrow();
  });

  it.each([
    ['61 characters', 'x'.repeat(61), /is 61 characters long; at most 60/],
    ['a formula', '=HYPERLINK(x)', /may hold only letters/],
    ['a leading hyphen', '-12', /may hold only letters/],
    ['a slash (rosette grids use it)', 'R1/A', /must not contain '\/'/],
    ['a tab', 'H\t1', /may hold only letters/],
  ])('refuse %s with a 422 naming the gauge', (_, id, message) => {
    try {
      validatePlan(plan(['H1', id]));
      throw new Error('accepted');
    } catch (err) {
      const e = toAppError(err) as unknown as {
        status: number;
        code: string;
        details: { issues: { path: string; message: string }[] };
      };
      expect(e.status).toBe(422);
      expect(e.code).toBe('invalid-plan');
      expect(e.details.issues[0]!.path).toBe('gauges[1].id');
      expect(e.details.issues[0]!.message).toMatch(message);
    }
  });
});
