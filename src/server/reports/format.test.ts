import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import {
  buildExportFilename,
  formatFixed,
  formatPercent,
  formatPlain,
  formatSlopeNumber,
  neutraliseFormula,
  showNumber,
} from './format';
import { formatSlope } from '../../lib/ui-format';
import { buildAxis, decimalsForStep, pickTickStep } from './pdf-figure';
import { interFontPath } from './pdf-text';
import { buildSiReportInput } from './testing/report-fixture';
import { decodeWoff } from './woff';

describe('number formatting', () => {
  it.each<[number | null, number, string]>([
    [236.955, 2, '236.96'],
    [-0.0001, 2, '0.00'],
    [-1.5, 1, '-1.5'],
    [null, 2, ''],
    [Number.NaN, 2, ''],
    [Number.POSITIVE_INFINITY, 1, ''],
  ])('formatFixed(%s, %i) = %j', (value, decimals, expected) => {
    expect(formatFixed(value, decimals)).toBe(expected);
  });

  it('writes fractions as percentages and plan values without float noise', () => {
    expect(formatPercent(-0.13084, 2)).toBe('-13.08');
    expect(formatPercent(null)).toBe('');
    expect(formatPlain(0.1 + 0.2)).toBe('0.3');
    expect(formatPlain(200000)).toBe('200000');
  });

  it.each([
    ['=SUM(A1)', "'=SUM(A1)"],
    ['+1', "'+1"],
    ['@cmd', "'@cmd"],
    ['-x', "'-x"],
    ['plain text', 'plain text'],
  ])('neutraliseFormula(%j) = %j', (text, expected) => {
    expect(neutraliseFormula(text)).toBe(expected);
  });

  it('names the download from the test, reduction and draft state in ASCII', () => {
    const input = buildSiReportInput();
    expect(buildExportFilename(input, 'pdf')).toBe(
      'hoopline-test-12-hydrotest-t-101-after-nozzle-repair-r34-draft.pdf',
    );
    input.draft = false;
    input.test.name = 'Prüfung Behälter Nr. 7';
    expect(buildExportFilename(input, 'csv')).toBe('hoopline-test-12-prufung-behalter-nr-7-r34.csv');
  });
});

describe('one slope formatter for the screens, the PDF and the CSV', () => {
  it.each([237.04, -71.083, 1.63414, -0.49172, 0.0123456, 1234.5])(
    '%d: the CSV cell is the screen text with an ASCII minus, the PDF the screen text',
    (v) => {
      const screen = formatSlope(v, 'MPa', false);
      expect(formatSlopeNumber(v)).toBe(screen.replace('\u2212', '-'));
      expect(showNumber(formatSlopeNumber(v))).toBe(screen);
      expect(Number(formatSlopeNumber(v))).toBeCloseTo(v, Math.max(0, 3 - Math.floor(Math.log10(Math.abs(v)))) - 1);
    },
  );
  it('writes four significant figures and nothing for an absent slope', () => {
    expect(formatSlopeNumber(237.04)).toBe('237.0');
    expect(formatSlopeNumber(-1.63414)).toBe('-1.634');
    expect(formatSlopeNumber(null)).toBe('');
    expect(formatSlopeNumber(Number.NaN)).toBe('');
  });
});

describe('figure axes', () => {
  it.each([
    [3.4, 5, 0.5],
    [800, 5, 200],
    [450, 5, 100],
    [0.016, 5, 0.0025],
    [1, 5, 0.2],
  ])('pickTickStep(%d) is a round step', (range, target, step) => {
    expect(pickTickStep(range, target)).toBeCloseTo(step, 12);
  });

  it('starts at zero, ends on a whole step, and ignores a sliver below zero', () => {
    expect(buildAxis([0, 3.4])).toEqual({ min: 0, max: 3.5, step: 0.5 });
    expect(buildAxis([-1.2, 195])).toEqual({ min: 0, max: 200, step: 50 });
    const negative = buildAxis([-120, 300]);
    expect(negative.min).toBeLessThanOrEqual(-120);
    expect(negative.max).toBeGreaterThanOrEqual(300);
    expect(buildAxis([0, 0]).max).toBeGreaterThan(0);
    expect(decimalsForStep(0.25)).toBe(2);
    expect(decimalsForStep(50)).toBe(0);
  });
});

describe('decodeWoff', () => {
  it('rebuilds a TrueType font from the packaged WOFF', () => {
    const ttf = decodeWoff(readFileSync(interFontPath('latin', 400)));
    expect(ttf.readUInt32BE(0)).toBe(0x00010000);
    const numTables = ttf.readUInt16BE(4);
    const tags = Array.from({ length: numTables }, (_, i) => ttf.subarray(12 + i * 16, 16 + i * 16).toString('latin1'));
    expect(tags).toEqual(expect.arrayContaining(['cmap', 'glyf', 'head', 'hmtx', 'loca', 'name']));
    for (let i = 0; i < numTables; i += 1) {
      const offset = ttf.readUInt32BE(12 + i * 16 + 8);
      const length = ttf.readUInt32BE(12 + i * 16 + 12);
      expect(offset % 4).toBe(0);
      expect(offset + length).toBeLessThanOrEqual(ttf.length);
    }
  });

  it('names the problem for a file that is not WOFF 1.0', () => {
    expect(() => decodeWoff(readFileSync(interFontPath('latin', 400).replace(/\.woff$/, '.woff2')))).toThrow(
      /not a WOFF 1\.0 font/,
    );
  });
});
