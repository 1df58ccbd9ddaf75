import { describe, expect, it } from 'vitest';
import { safeCell } from './csv';

describe('every CSV text cell is neutralised; numbers are not', () => {
  it.each([
    ['=1+2', "'=1+2"],
    ['+SUM(A1)', "'+SUM(A1)"],
    ['-cmd|x', "'-cmd|x"],
    ['@import', "'@import"],
    ['\tx', "'\tx"],
    ['\rx', "'\rx"],
    ['H1', 'H1'],
    ["'=already", "'=already"],
    ['', ''],
  ])('%j → %j', (cell, want) => expect(safeCell(cell)).toBe(want));

  it.each(['12', '-0.35', '1.2e-7', '-4E+3', '0.5', '.5', '7.'])('leaves the number %s', (n) =>
    expect(safeCell(n)).toBe(n),
  );
});
