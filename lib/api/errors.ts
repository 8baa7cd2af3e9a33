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

/** True for errors that mean the database cannot be reached (down, restarting, pool timeout). */
export function isDatabaseUnavailable(err: unknown): boolean {
  if (!err || typeof err !== 'object') return false;
  const e = err as { code?: string; name?: string; message?: string };
  const codes = ['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', '57P01', '57P02', '57P03', '08006', '08001', '08003'];
  if (e.code && codes.includes(e.code)) return true;
  if (e.name === 'KnexTimeoutError') return true;
  const m = e.message ?? '';
  return /Connection terminated|timeout acquiring a connection|the database system is (starting up|shutting down)/i.test(m);
}
