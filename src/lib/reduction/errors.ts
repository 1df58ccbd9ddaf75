// The engine's one error type for user-caused problems (a bad plan, a bad log). The API maps it
// to 422 and the CLI to exit 2; anything else thrown by the engine is an internal fault.

export interface InputIssue {
  path: string;
  message: string;
}

export interface InputErrorDetails {
  /** 1-based physical line in the log (counting preamble and header lines) */
  line?: number;
  /** column name (or 1-based column number when the header has no name for it) */
  column?: string | number;
  /** plan field path, e.g. `vessel.wallThickness` */
  path?: string;
  /** every plan problem, for the plan editor */
  issues?: InputIssue[];
  /** 0-based index of the log segment when several segments were given */
  source?: number;
}

/** Permanent codes; the message says what happened and what to do. */
export const inputErrorCodes = [
  'invalid-plan',
  'not-delimited-text',
  'pressure-column-not-found',
  'missing-column',
  'duplicate-column',
  'unknown-pressure-unit',
  'implausible-pressure',
  'empty-column',
  'no-data',
  'too-few-levels',
  'invalid-series-request',
] as const;
export type InputErrorCode = (typeof inputErrorCodes)[number];

export class InputError extends Error {
  readonly code: InputErrorCode;
  readonly details?: InputErrorDetails;

  constructor(code: InputErrorCode, message: string, details?: InputErrorDetails) {
    super(message);
    this.name = 'InputError';
    this.code = code;
    this.details = details;
  }
}

export function isInputError(e: unknown): e is InputError {
  return e instanceof InputError;
}
