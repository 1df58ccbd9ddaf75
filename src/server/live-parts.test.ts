// The pure parts of live test mode and the log service: the header check a live session runs
// on its first chunks, the event ids of the stream, and the warning e-mail's wording.
import { describe, expect, it } from 'vitest';
import type { Test } from '../db/schema';
import { toAppError } from './errors';
import { eventId, parseEventId } from './live-events.server';
import { liveWarningMail } from './live-mail.server';
import { checkLogHead, HEAD_BYTES } from './logs.server';
import { validatePlan } from './plans.server';

const plan = validatePlan({
  units: 'SI',
  vessel: { shape: 'cylinder', ends: 'closed', insideDiameter: 1000, wallThickness: 10, length: 4000 },
  material: { elasticModulus: 200_000, poissonRatio: 0.3, yieldStrength: 260 },
  testPressure: 2,
  columns: { time: 'time_s', pressure: 'P [MPa]' },
  gauges: [
    { id: 'H1', kind: 'uniaxial', channels: ['SG1'], angleDeg: 90 },
    { id: 'A1', kind: 'uniaxial', channels: ['SG2'], angleDeg: 0 },
  ],
});

const bytes = (s: string) => Buffer.from(s);
const LOG = 'unit,DAQ demo\noperator,night shift\ntime_s,P [MPa],SG1,SG2\n0,0.000,0.1,0.2\n0.5,0.010,1.1,0.4\n';

function refusal(fn: () => unknown) {
  try {
    fn();
  } catch (err) {
    const e = toAppError(err);
    if (!e) throw err;
    return { status: e.status, code: e.code, message: e.message, details: e.details as Record<string, unknown> };
  }
  throw new Error('accepted');
}

describe('the header check of the log service', () => {
  it('finds the header after a preamble and says what it holds', () => {
    const info = checkLogHead(plan, bytes(LOG), true);
    expect(info).toMatchObject({ headerLine: 3, delimiter: ',', columns: ['time_s', 'P [MPa]', 'SG1', 'SG2'] });
  });

  it('waits while a log still arriving has no whole header line yet', () => {
    expect(checkLogHead(plan, bytes('unit,DAQ demo\n'), false)).toBeNull();
    const cutInHeader = LOG.indexOf('SG2') + 1; // the header line is cut after "S"
    expect(checkLogHead(plan, bytes(LOG.slice(0, cutInHeader)), false)).toBeNull();
    expect(checkLogHead(plan, bytes(LOG.slice(0, LOG.indexOf('\n0,') + 1)), false)?.headerLine).toBe(3);
  });

  it("refuses a header that lacks a plan column with the engine's code, line and column", () => {
    const bad = LOG.replace('SG2', 'SGX');
    for (const ended of [true, false]) {
      const e = refusal(() => checkLogHead(plan, bytes(bad), ended));
      expect(e).toMatchObject({ status: 422, code: 'missing-column', details: { line: 3, column: 'SG2' } });
      expect(e.message).toContain("line 3, column 'SG2'");
    }
  });

  it('refuses a repeated column, binary bytes and an empty file', () => {
    const twice = LOG.replace('SG2', 'SG1');
    expect(refusal(() => checkLogHead(plan, bytes(twice), true))).toMatchObject({
      code: 'duplicate-column',
      details: { line: 3 },
    });
    expect(refusal(() => checkLogHead(plan, Buffer.from([0, 159, 146, 150, 10]), true)).code).toBe(
      'not-delimited-text',
    );
    expect(refusal(() => checkLogHead(plan, Buffer.alloc(0), true)).code).toBe('empty-file');
  });

  it('stops waiting once the head is full without a header', () => {
    const preamble = 'note,nothing here yet\n'.repeat(Math.ceil(HEAD_BYTES / 22) + 1);
    expect(refusal(() => checkLogHead(plan, bytes(preamble), false)).code).toBe('pressure-column-not-found');
  });
});

describe('live event ids', () => {
  it('are {session}.{ordinal} and parse back; anything else is no id', () => {
    expect(eventId({ sessionId: 12, ordinal: 7 })).toBe('12.7');
    expect(parseEventId('12.7')).toEqual({ sessionId: 12, ordinal: 7 });
    expect(parseEventId(' 3.0 ')).toEqual({ sessionId: 3, ordinal: 0 });
    for (const bad of [null, '', '12', '12.x', '-1.2', '1.2.3', '1e3.1']) expect(parseEventId(bad)).toBeNull();
  });
});

describe('the live warning e-mail', () => {
  it('names the test, gauge, code and pressure, says what to check, links the test and carries the caution', () => {
    const test = { id: 41, name: 'Receiver R-7 hydrotest', plan: { units: 'SI' } } as unknown as Test;
    const mail = liveWarningMail(test, 'Dana Field', {
      gaugeId: 'H2',
      code: 'trend-outside-band',
      message: 'slope 15 % below the prediction',
      pressure: 1.0004,
    });
    expect(mail.subject).toBe('Live warning on "Receiver R-7 hydrotest": gauge H2 (trend-outside-band)');
    expect(mail.text).toContain('gauge H2 raised the warning "trend-outside-band" at 1 MPa');
    expect(mail.text).toContain('What to check: check the gauge factor');
    expect(mail.text).toContain('slope 15 % below the prediction');
    expect(mail.text).toMatch(/\/tests\/41\/logs/);
    expect(mail.text).toContain('The test director decides whether to hold or depressurise');
    expect(mail.text).not.toMatch(/\n\n\n/);
  });
});
