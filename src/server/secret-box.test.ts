import { afterEach, describe, expect, it } from 'vitest';
import { resetConfigForTests } from '../config.server';
import { isSealed, openText, sealText } from './secret-box.server';

const setSecret = (s: string) => {
  process.env.AUTH_SECRET = s;
  resetConfigForTests();
};
afterEach(() => {
  delete process.env.AUTH_SECRET;
  resetConfigForTests();
});

describe('sealed outbox bodies', () => {
  it('round-trip, differ every time, and hide the text', () => {
    setSecret('c'.repeat(64));
    const text = 'Open it: https://hoopline.example/share/AbCdEf0123456789AbCdEf0123456789AbCdEf01234';
    const a = sealText(text);
    const b = sealText(text);
    expect(a).not.toBe(b);
    expect(isSealed(a)).toBe(true);
    expect(a).not.toContain('share');
    expect(openText(a)).toBe(text);
  });

  it('refuse a body altered or sealed under another AUTH_SECRET; pass old plain bodies through', () => {
    setSecret('d'.repeat(64));
    const sealed = sealText('secret link');
    const raw = Buffer.from(sealed.slice(3), 'base64url');
    raw[raw.length - 1]! ^= 1;
    expect(() => openText(`v1.${raw.toString('base64url')}`)).toThrow();
    setSecret('e'.repeat(64));
    expect(() => openText(sealed)).toThrow();
    expect(openText('written before sealing')).toBe('written before sealing');
  });
});
