// The catalogue of errors a user can cause. Each has a permanent code, an HTTP status and a
// default message that says what happened and what to do; a call site may give a more specific
// message and details. Anything else is an internal fault (500, logged). The engine's own input
// errors (src/lib/reduction/errors.ts) keep their codes and map to 422 in `fromInputError`.
import { isInputError, type InputErrorCode } from '../lib/reduction/errors';
import { rolesFor, type Permission } from '../lib/roles';

type ErrorStatus = 400 | 401 | 403 | 404 | 405 | 409 | 410 | 413 | 422 | 429 | 500 | 503;

export const errorCatalogue = {
  'invalid-request': { status: 400, message: 'The request is not valid.' },
  unauthenticated: { status: 401, message: 'Sign in, or send Authorization: Bearer <API token>.' },
  'invalid-token': {
    status: 401,
    message: 'The API token is unknown, expired or revoked. Create a new one on your account page.',
  },
  'wrong-password': {
    status: 401,
    message: 'That is not your password; nothing was signed. Type the password you sign in with.',
  },
  forbidden: { status: 403, message: 'Your role may not do this. Ask an administrator if you should.' },
  'token-not-allowed': {
    status: 403,
    message:
      'An API token cannot do this: sign in to Hoopline in the browser. Tokens upload logs and read; they never sign or manage accounts.',
  },
  'token-scope': { status: 403, message: 'This API token lacks the scope for this request.' },
  'cross-origin': {
    status: 403,
    message: 'Cross-site requests are refused. Submit the form from Hoopline itself, or use an API token.',
  },
  'own-review': {
    status: 403,
    message: 'You signed the engineering review of this test; another person must release it.',
  },
  'not-found': { status: 404, message: 'Nothing with that id.' },
  'own-account': {
    status: 409,
    message: 'You cannot disable your own account; ask another administrator.',
  },
  'stale-reduction': {
    status: 409,
    message: 'The record changed since you opened it. Reload the page, check the current reduction, then sign.',
  },
  'statement-changed': {
    status: 409,
    message:
      'The record changed while the statement was open: the words you read are no longer what would be signed. Read the statement again and sign.',
  },
  'plan-changed': {
    status: 409,
    message: 'The test plan changed while the log was uploading; nothing was stored. Upload the log again.',
  },
  'database-refused': {
    status: 409,
    message: 'The database refused the change because the record is locked; nothing was changed.',
  },
  'live-session-open': {
    status: 409,
    message: 'This test has an open live session already: carry on with it, finish it or abandon it first.',
  },
  'live-session-closed': {
    status: 409,
    message: 'This live session is finished or abandoned; it takes no more chunks. Open a new one.',
  },
  'live-session-empty': { status: 409, message: 'This live session has no chunks yet: there is nothing to finish.' },
  'chunk-conflict': {
    status: 409,
    message:
      'A chunk with this number holds other bytes; nothing was stored. Send the chunk named in details.expected.',
  },
  'chunk-gap': {
    status: 409,
    message: 'This chunk comes after a gap; nothing was stored. Send the chunk named in details.expected first.',
  },
  'method-not-allowed': { status: 405, message: 'This address is read-only.' },
  'test-released': { status: 409, message: 'This test is released and locked; nothing about it can change.' },
  'no-result': { status: 409, message: 'There is no finished reduction yet. Upload a log and run a reduction first.' },
  'no-logs': { status: 409, message: 'Upload a log before starting a reduction.' },
  'not-reduced': {
    status: 409,
    message: 'The newest logs have not been reduced yet: run a reduction that covers every log, then review.',
  },
  incomplete: {
    status: 409,
    message: 'The log has not reached test pressure and come back to zero; a partial record cannot be reviewed.',
  },
  'open-flags': { status: 409, message: 'Disposition every flagged gauge first.' },
  'already-reviewed': { status: 409, message: 'This reduction has been reviewed already.' },
  'not-reviewed': {
    status: 409,
    message: 'Only a reviewed test can be released; the engineering review is not signed.',
  },
  'already-revoked': { status: 409, message: 'This link was revoked already.' },
  'tag-taken': { status: 409, message: 'A vessel with that tag exists already.' },
  'email-taken': { status: 409, message: 'An account with that e-mail exists already.' },
  'own-role': {
    status: 409,
    message: 'You cannot take the admin role from your own account; ask another administrator.',
  },
  'link-gone': { status: 410, message: 'This link has expired or been revoked. Ask the QA manager for a new one.' },
  'account-link-gone': {
    status: 410,
    message:
      'This link has been used already or has expired. Ask for a new one on the sign-in page or from an administrator.',
  },
  'too-large': { status: 413, message: 'The request is larger than the limit.' },
  'invalid-plan': { status: 422, message: 'The test plan is not valid.' },
  'unknown-gauge': { status: 422, message: 'The current reduction has no gauge with that id.' },
  'empty-file': { status: 422, message: 'The file is empty.' },
  'weak-password': {
    status: 422,
    message: 'Choose a longer or less common password: at least 12 characters that are not easy to guess.',
  },
  throttled: {
    status: 429,
    message: 'Too many failed attempts. Wait a little and try again.',
  },
  unavailable: {
    status: 503,
    message: 'A service Hoopline needs is not answering; nothing was changed. Try again shortly.',
  },
  internal: {
    status: 500,
    message:
      'Something went wrong on the server and it has been logged. A change in progress was not saved (each change is stored whole or not at all): try again, and if it happens again give your administrator the reference shown.',
  },
} as const satisfies Record<string, { status: ErrorStatus; message: string }>;

export type ErrorCode = keyof typeof errorCatalogue;

export class AppError extends Error {
  readonly status: ErrorStatus;
  readonly code: ErrorCode | InputErrorCode;
  readonly details?: unknown;

  /**
   * An error from the catalogue; `message` replaces the default with a more specific one. The
   * engine's input-error codes (a bad plan or log) are accepted too and always answer 422.
   */
  constructor(code: ErrorCode | InputErrorCode, message?: string, details?: unknown) {
    const entry: { status: ErrorStatus; message: string } | undefined =
      code in errorCatalogue ? errorCatalogue[code as ErrorCode] : undefined;
    super(message ?? entry?.message ?? 'The plan or the log is not valid.');
    this.name = 'AppError';
    this.status = entry?.status ?? 422;
    this.code = code;
    this.details = details;
  }
}

/**
 * The one place that maps known error kinds to an AppError: AppErrors themselves, and the
 * engine's input errors as 422 with the engine's code, message and details. Null otherwise.
 */
export function toAppError(err: unknown): AppError | null {
  if (err instanceof AppError) return err;
  if (isInputError(err)) return new AppError(err.code, err.message, err.details);
  return null;
}

/** Shorthands for the errors whose message is built from a value. */
export const errors = {
  forbidden: (permission: Permission) =>
    new AppError(
      'forbidden',
      `This needs the role ${rolesFor(permission).join(' or ')}. Ask an administrator if you should have it.`,
    ),
  notFound: (what: string) => new AppError('not-found', `No ${what} with that id.`),
  tooLargeBody: (limitBytes: number) =>
    new AppError('too-large', `The request body is larger than the limit of ${Math.round(limitBytes / 1024)} KB.`, {
      limitBytes,
    }),
  tooLarge: (limitBytes: number) =>
    new AppError('too-large', `The file is larger than the limit of ${Math.round(limitBytes / 1024 / 1024)} MB.`, {
      limitBytes,
    }),
  chunkTooLarge: (limitBytes: number) =>
    new AppError(
      'too-large',
      `The chunk is larger than the limit of ${Math.round(limitBytes / 1024 / 1024)} MB: send smaller chunks (the push script's --max-chunk).`,
      { limitBytes },
    ),
  invalid: (message: string, details?: unknown) => new AppError('invalid-request', message, details),
  unavailable: (message?: string) => new AppError('unavailable', message),
  throttled: (waitMs: number) =>
    new AppError('throttled', `Too many failed attempts. Wait ${Math.ceil(waitMs / 1000)} s and try again.`, {
      retryAfterSeconds: Math.ceil(waitMs / 1000),
    }),
  tokenScope: (scope: string) =>
    new AppError(
      'token-scope',
      `This API token lacks the \`${scope}\` scope. Create a token with it on your account page.`,
      { needs: scope },
    ),
};
