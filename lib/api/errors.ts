/** An error that maps to an HTTP answer. Thrown by the authorization helper and the data layer. */
export class HttpError extends Error {
  constructor(
    public readonly status: number,
    message: string,
    public readonly body: Record<string, unknown> = {},
  ) {
    super(message);
  }
}

export const unauthorized = () => new HttpError(401, 'Sign in to continue.');
export const forbidden = () => new HttpError(403, 'Your role may not do this.');
export const notFound = (what = 'Not found.') => new HttpError(404, what);
export const conflict = (message: string, body: Record<string, unknown> = {}) =>
  new HttpError(409, message, body);

const unreachableCodes = new Set([
  'ECONNREFUSED', 'ECONNRESET', 'ECONNABORTED', 'ETIMEDOUT', 'EPIPE', 'EHOSTUNREACH', 'ENETUNREACH', 'ENOTFOUND', 'EAI_AGAIN',
]);
const unreachableMessage =
  /Connection terminated|Connection ended unexpectedly|not queryable|timeout acquiring a connection|the database system is (starting up|shutting down|in recovery mode)|terminating connection due to administrator command|server closed the connection unexpectedly/i;

/**
 * True for errors that mean the database cannot be reached (down, restarting, pool timeout, a
 * connection lost in the middle of a transaction). PostgreSQL's SQLSTATE classes 08 (connection
 * exception) and 57P (operator intervention: shutdown, crash, cannot connect now) count, as do
 * socket errors; the error's `cause` and an AggregateError's `errors` are looked at too.
 */
export function isDatabaseUnavailable(err: unknown, depth = 0): boolean {
  if (!err || typeof err !== 'object' || depth > 4) return false;
  const e = err as { code?: unknown; name?: string; message?: string; cause?: unknown; errors?: unknown };
  const code = typeof e.code === 'string' ? e.code : '';
  if (unreachableCodes.has(code) || /^08[0-9A-Z]{3}$/.test(code) || /^57P0[1-3]$/.test(code)) return true;
  if (e.name === 'KnexTimeoutError') return true;
  if (unreachableMessage.test(e.message ?? '')) return true;
  if (Array.isArray(e.errors) && e.errors.some((x) => isDatabaseUnavailable(x, depth + 1))) return true;
  return isDatabaseUnavailable(e.cause, depth + 1);
}

/**
 * True for PostgreSQL data exceptions (SQLSTATE class 22: a value out of range, text the column
 * cannot hold, a malformed uuid or number). They come from the request's values, so they are the
 * caller's 400, not our 500; the route schemas should catch them first.
 */
export function isDataException(err: unknown): boolean {
  if (!err || typeof err !== 'object') return false;
  const e = err as { code?: unknown; severity?: unknown };
  return typeof e.code === 'string' && /^22[0-9A-Z]{3}$/.test(e.code) && typeof e.severity === 'string';
}
