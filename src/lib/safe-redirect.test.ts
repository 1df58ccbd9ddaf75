import { describe, expect, it } from 'vitest';
import { safeNextPath } from './safe-redirect';

describe('safeNextPath', () => {
  it.each([
    ['/tests/7/review', '/tests/7/review'],
    ['/vessels?page=2#top', '/vessels?page=2#top'],
    ['/%5Cevil.example', '/%5Cevil.example'], // an encoded backslash is a path on this site
  ])('keeps the path %s', (next, want) => expect(safeNextPath(next)).toBe(want));

  it.each([
    '/\\evil.example',
    '\\\\evil.example',
    '//evil.example',
    '///evil.example',
    'https://evil.example/',
    'javascript:alert(1)',
    '/\t/evil.example',
    '/\n/evil.example',
    'evil.example',
    '',
    null,
    undefined,
    '/' + 'x'.repeat(3000),
  ])('sends %j home instead', (next) => expect(safeNextPath(next)).toBe('/'));
});
