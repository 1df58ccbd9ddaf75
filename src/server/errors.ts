// The catalogue of errors a user can cause. Each has a permanent code, an HTTP status and a
// message that says what happened and what to do. Anything else is an internal fault (500).

export class AppError extends Error {
  constructor(
    readonly status: 400 | 401 | 403 | 404 | 405 | 409 | 410 | 413 | 422 | 429 | 503,
    readonly code: string,
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
    this.name = 'AppError';
  }
}

export const errors = {
  unauthenticated: () => new AppError(401, 'unauthenticated', 'Sign in, or send Authorization: Bearer <API token>.'),
  badToken: () =>
    new AppError(
      401,
      'invalid-token',
      'The API token is unknown or has been revoked. Create a new one on your account page.',
    ),
  forbidden: (need: readonly string[]) =>
    new AppError(
      403,
      'forbidden',
      `This needs the role ${need.join(' or ')}. Ask an administrator if you should have it.`,
    ),
  crossOrigin: () =>
    new AppError(
      403,
      'cross-origin',
      'Cross-site requests are refused. Submit the form from Hoopline itself, or use an API token.',
    ),
  notFound: (what: string) => new AppError(404, 'not-found', `No ${what} with that id.`),
  methodNotAllowed: () => new AppError(405, 'method-not-allowed', 'This address is read-only.'),
  released: () => new AppError(409, 'test-released', 'This test is released and locked; nothing about it can change.'),
  conflict: (code: string, message: string, details?: unknown) => new AppError(409, code, message, details),
  gone: (message: string) => new AppError(410, 'link-gone', message),
  tooLarge: (limit: number) =>
    new AppError(413, 'too-large', `The file is larger than the limit of ${Math.round(limit / 1024 / 1024)} MB.`, {
      limitBytes: limit,
    }),
  invalid: (message: string, details?: unknown) => new AppError(400, 'invalid-request', message, details),
  unprocessable: (code: string, message: string, details?: unknown) => new AppError(422, code, message, details),
  unavailable: (message: string) => new AppError(503, 'unavailable', message),
};
