// Structured logs: one JSON line per event on stdout (pino). Requests and jobs log what they
// did, who asked and how long it took — never a password, a token, a cookie or a secret. Keys
// that could hold one are redacted, and errors are reduced to their type, code, message and
// stack, with the SQL and bound values that database errors carry left out.
import pino, { type Logger } from 'pino';
import { getConfig } from '../../config.server';

const SECRET_KEYS = [
  'password',
  'newPassword',
  'token',
  'secret',
  'authorization',
  'cookie',
  'AUTH_SECRET',
  'DATABASE_URL',
  'S3_SECRET_ACCESS_KEY',
  'SMTP_PASSWORD',
];

/** Message text before a database driver's "params:" tail (bound values may be personal data). */
function safeMessage(message: string): string {
  const cut = message.search(/\n?\s*params:/);
  return (cut >= 0 ? message.slice(0, cut) : message).slice(0, 2000);
}

interface SafeError {
  type: string;
  message: string;
  code?: string;
  stack?: string;
  cause?: SafeError;
}

/** An error as a log field: type, code, message and stack; no SQL, no bound values, no config. */
export function serializeError(err: unknown, depth = 0): SafeError {
  if (!(err instanceof Error)) return { type: typeof err, message: safeMessage(String(err)) };
  const message = safeMessage(err.message);
  const code = (err as { code?: unknown }).code;
  const stackLines = (err.stack ?? '').split('\n').filter((l) => /^\s+at /.test(l));
  const out: SafeError = {
    type: err.name,
    message,
    ...(typeof code === 'string' ? { code } : {}),
    stack: [`${err.name}: ${message}`, ...stackLines.slice(0, 20)].join('\n'),
  };
  if (err.cause !== undefined && depth < 3) out.cause = serializeError(err.cause, depth + 1);
  return out;
}

let root: Logger | null = null;

/** The process's logger (created on first use; level from LOG_LEVEL). */
export function logger(): Logger {
  root ??= pino({
    level: getConfig().LOG_LEVEL,
    timestamp: pino.stdTimeFunctions.isoTime,
    formatters: { level: (label) => ({ level: label }) },
    serializers: { err: serializeError, error: serializeError },
    redact: {
      paths: SECRET_KEYS.flatMap((k) => [k, `*.${k}`, `*.*.${k}`]),
      censor: '[redacted]',
    },
  });
  return root;
}
