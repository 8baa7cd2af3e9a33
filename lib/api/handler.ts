import 'server-only';
import { NextResponse, type NextRequest } from 'next/server';
import { ZodError, type ZodType } from 'zod';
import { HttpError, isDatabaseUnavailable } from './errors';

type Ctx<P> = { params: Promise<P> };

/** A JSON error body: `{ error, fieldErrors? }`. */
export function jsonError(status: number, error: string, extra: Record<string, unknown> = {}) {
  return NextResponse.json({ error, ...extra }, { status });
}

/** Field errors keyed by dotted path, for forms to show beside their fields. */
export function fieldErrors(err: ZodError): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const issue of err.issues) {
    const key = issue.path.join('.') || '_';
    (out[key] ??= []).push(issue.message);
  }
  return out;
}

/**
 * Wraps a route handler: maps validation errors to 400 with field errors, HttpErrors to their
 * status, an unreachable database to 503, and anything else to a plain 500 without internals.
 */
export function route<P = Record<string, never>>(
  fn: (req: NextRequest, params: P) => Promise<Response>,
) {
  return async (req: NextRequest, ctx: Ctx<P>): Promise<Response> => {
    try {
      const params = ctx?.params ? await ctx.params : ({} as P);
      return await fn(req, params);
    } catch (err) {
      if (err instanceof ZodError) {
        return jsonError(400, 'Some fields need attention.', { fieldErrors: fieldErrors(err) });
      }
      if (err instanceof HttpError) return jsonError(err.status, err.message, err.body);
      if (isDatabaseUnavailable(err)) {
        return jsonError(503, 'The database is unavailable for a moment. Nothing was lost; try again shortly.', {
          retryable: true,
        });
      }
      console.error('Unhandled error in route handler', err);
      return jsonError(500, 'Something went wrong on our side.');
    }
  };
}

/** Reads and validates a JSON body; a malformed body is a 400, not a 500. */
export async function parseBody<T>(req: Request, schema: ZodType<T>): Promise<T> {
  let raw: unknown;
  try {
    raw = await req.json();
  } catch {
    throw new HttpError(400, 'The request body must be JSON.');
  }
  return schema.parse(raw);
}

/** Validates query-string parameters. */
export function parseQuery<T>(req: NextRequest, schema: ZodType<T>): T {
  return schema.parse(Object.fromEntries(req.nextUrl.searchParams.entries()));
}
