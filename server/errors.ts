// Every error the API sends is JSON: { error: { code, message, fields? } }.
import type { ErrorRequestHandler, RequestHandler, Response } from 'express';
import type { ZodError } from 'zod';

export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly extra: Record<string, unknown> = {},
  ) {
    super(message);
  }
}

export const notFound = (what = 'not found') => new HttpError(404, 'not_found', what);

/** Field path → first message, e.g. { "document.items.0.x": "Too big: expected number to be <=200" }. */
export function zodFields(err: ZodError): Record<string, string> {
  // A Map, so a field called "__proto__" is a field like any other.
  const fields = new Map<string, string>();
  const put = (path: PropertyKey[], message: string) => {
    // A field name is echoed back, so an absurd one (a fuzzer's megabyte key) is cut short.
    const key = path.length ? path.map((p) => String(p).slice(0, 100)).join('.') : '(body)';
    if (fields.size < 50 && !fields.has(key)) fields.set(key, message);
  };
  for (const issue of err.issues) {
    // An unknown field is named by its own path, not by its parent's.
    if (issue.code === 'unrecognized_keys') for (const k of issue.keys) put([...issue.path, k], 'unknown field');
    else put(issue.path, issue.message);
  }
  return Object.fromEntries(fields);
}

export function validationError(err: ZodError, where: 'body' | 'query' | 'params' = 'body'): HttpError {
  const fields = zodFields(err);
  const names = Object.keys(fields);
  const first = names[0]!;
  const message = `invalid ${where}: ${first === '(body)' ? '' : `${first}: `}${fields[first]}${names.length > 1 ? ` (and ${names.length - 1} more)` : ''}`;
  return new HttpError(400, 'invalid_input', message, { fields });
}

export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new HttpError(404, 'no_route', `no API route ${req.method} ${req.path}`));
};

/** Seconds a client is told to wait (Retry-After) while the database is unreachable. */
export const DB_RETRY_AFTER_S = 5;

// SQLSTATE classes 08 (connection exception) and 57P (operator intervention: shutdown, restart, cannot
// connect now), 53300 (too many connections), and the node-postgres / socket errors of a lost connection.
const DB_DOWN_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', 'ENOTFOUND', 'EAI_AGAIN', '53300', '57P01', '57P02', '57P03']);
const DB_DOWN_MESSAGE = /Connection terminated|connection timeout|timeout exceeded when trying to connect|Client has encountered a connection error|the database system is (starting up|shutting down)|terminating connection due to administrator command/i;

/** True when err (or an error it wraps: Drizzle wraps the driver's in `cause`) says PostgreSQL cannot be reached. */
export function isDatabaseUnavailable(err: unknown): boolean {
  for (let e = err as { code?: unknown; cause?: unknown; message?: unknown } | undefined, depth = 0; e && depth < 5; e = e.cause as typeof e, depth++) {
    const code = typeof e.code === 'string' ? e.code : '';
    if (DB_DOWN_CODES.has(code) || code.startsWith('08')) return true;
    if (typeof e.message === 'string' && DB_DOWN_MESSAGE.test(e.message)) return true;
  }
  return false;
}

function sendDatabaseUnavailable(res: Response) {
  res.setHeader('Retry-After', String(DB_RETRY_AFTER_S));
  res.status(503).json({ error: { code: 'database_unavailable', message: `the database cannot be reached just now; try again in ${DB_RETRY_AFTER_S} s`, retryAfterS: DB_RETRY_AFTER_S } });
}

export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  if (isDatabaseUnavailable(err)) {
    req.log?.warn({ err: { message: err?.message, code: err?.cause?.code ?? err?.code } }, 'database unavailable');
    sendDatabaseUnavailable(res);
    return;
  }
  if (err instanceof HttpError) {
    if (typeof err.extra.retryAfterS === 'number') res.setHeader('Retry-After', String(err.extra.retryAfterS));
    const { fields, ...extra } = err.extra as { fields?: Record<string, string> };
    res.status(err.status).json({ error: { code: err.code, message: err.message, ...(fields ? { fields } : {}), ...extra } });
    return;
  }
  // Errors from body-parser carry a status (413 too large, 400 bad JSON).
  const status = typeof err?.status === 'number' && err.status >= 400 && err.status < 500 ? err.status : 500;
  if (status === 500) req.log?.error({ err }, 'unhandled error');
  const code = status === 413 ? 'too_large' : status === 400 ? 'bad_request' : status === 500 ? 'internal' : 'error';
  const message =
    status === 413 ? 'the request body is too large' : status === 400 ? `the request body is not valid JSON` : status === 500 ? 'something went wrong on the server' : String(err?.message ?? 'error');
  res.status(status).json({ error: { code, message } });
};
