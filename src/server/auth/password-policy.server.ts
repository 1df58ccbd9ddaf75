// Which passwords Hoopline accepts: at least 12 characters, at most 72 bytes (bcrypt reads no
// further), and not easy to guess by zxcvbn-ts's estimate (score 3 of 4 or better) with the
// common-password and English dictionaries, the person's own name and e-mail and the word
// "hoopline" counted as guessable.
import { ZxcvbnFactory } from '@zxcvbn-ts/core';
import * as common from '@zxcvbn-ts/language-common';
import * as en from '@zxcvbn-ts/language-en';
import { AppError } from '../errors';

export const PASSWORD_MIN_LENGTH = 12;
export const PASSWORD_MAX_BYTES = 72;
const MIN_SCORE = 3;

let estimator: ZxcvbnFactory | null = null;
function zxcvbn(): ZxcvbnFactory {
  estimator ??= new ZxcvbnFactory({
    dictionary: { ...common.dictionary, ...en.dictionary },
    graphs: common.adjacencyGraphs,
    translations: en.translations,
  });
  return estimator;
}

/** Words about the person and the site that a guesser would try first. */
function guessableWords(context: readonly string[]): string[] {
  const words = new Set(['hoopline']);
  for (const c of context) for (const w of c.toLowerCase().split(/[^a-z0-9]+/)) if (w.length >= 3) words.add(w);
  return [...words];
}

/** Null when the password is acceptable, else a message saying what to change. */
export function passwordProblem(password: string, context: readonly string[] = []): string | null {
  if ([...password].length < PASSWORD_MIN_LENGTH)
    return `The password needs at least ${PASSWORD_MIN_LENGTH} characters; a few unrelated words make a good one.`;
  if (Buffer.byteLength(password, 'utf8') > PASSWORD_MAX_BYTES)
    return `The password may be at most ${PASSWORD_MAX_BYTES} bytes long.`;
  const r = zxcvbn().check(password, guessableWords(context));
  if (r.score >= MIN_SCORE) return null;
  const hint = [r.feedback.warning, ...r.feedback.suggestions].filter(Boolean).join(' ');
  return `That password is too easy to guess.${hint ? ` ${hint}` : ''} Add words or characters that are not about you or this site.`;
}

/** Throws 422 `weak-password` with the reason when the password is not acceptable. */
export function assertAcceptablePassword(password: string, context: readonly string[] = []): void {
  const problem = passwordProblem(password, context);
  if (problem) throw new AppError('weak-password', problem);
}
