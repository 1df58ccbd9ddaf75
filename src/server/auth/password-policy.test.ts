import { describe, expect, it } from 'vitest';
import { passwordProblem } from './password-policy.server';

describe('the password rule', () => {
  it.each(['copper-kettle-rain-8261', 'correct horse battery staple', 'Tq7#vL2m!pX9wR4z'])('accepts %s', (p) =>
    expect(passwordProblem(p)).toBeNull(),
  );

  it.each([
    ['too short', 'Tq7#vL2m!pX', /at least 12 characters/],
    ['a common password', 'password1234', /too easy to guess/],
    ['a keyboard walk', 'qwertyuiop12', /too easy to guess/],
    ['the site name', 'hoopline2026!', /too easy to guess/],
    ['over 72 bytes', 'ü'.repeat(40), /at most 72 bytes/],
  ])('refuses %s', (_, p, message) => expect(passwordProblem(p)).toMatch(message));

  it('counts the person\u2019s own name and e-mail as easy to guess', () => {
    expect(passwordProblem('sorensen2026!')).toBeNull();
    expect(passwordProblem('sorensen2026!', ['imke.sorensen@example.com', 'Imke Sorensen'])).toMatch(/too easy/);
  });
});
