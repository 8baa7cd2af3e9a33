import 'server-only';
import { NextResponse, type NextRequest } from 'next/server';
import { ZodError, type ZodType } from 'zod';
import { HttpError, isDataException, isDatabaseUnavailable } from './errors';
import { isCrossSiteWrite } from './same-origin';

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
 * Wraps a route handler: refuses a state-changing request sent from another site with 403 before
 * the handler runs (see `isCrossSiteWrite`), maps validation errors to 400 with field errors,
 * HttpErrors to their status, an unreachable database to 503, a value the database refuses
 * (SQLSTATE class 22) to 400, and anything else to a plain 500 without internals.
 */
export function route<P = Record<string, never>>(
  fn: (req: NextRequest, params: P) => Promise<Response>,
) {
  return async (req: NextRequest, ctx: Ctx<P>): Promise<Response> => {
    try {
      if (isCrossSiteWrite(req)) return jsonError(403, 'This request came from a page of another site and was refused.');
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
      if (isDataException(err)) {
        console.error('A value reached the database that the route schema should have refused', err);
        return jsonError(400, 'A value in the request cannot be stored as given.');
      }
      console.error('Unhandled error in route handler', err);
      return jsonError(500, 'Something went wrong on our side.');
    }
  };
}

/** The largest JSON body a route reads unless it says otherwise (a body map says more). */
export const defaultBodyLimitBytes = 1024 * 1024;
/** Deepest nesting of arrays and objects a JSON body may have; no form of ours goes past 12. */
export const maxJsonDepth = 64;

const tooLarge = (max: number) =>
  new HttpError(413, `The request body is too large: at most ${max >= 1024 * 1024 ? `${Math.round(max / 1024 / 1024)} MB` : `${Math.round(max / 1024)} KB`}.`);

/** Reads the body as text, refusing it as soon as it passes `max` bytes (Content-Length is not trusted). */
async function readText(req: Request, max: number): Promise<string> {
  const declared = Number(req.headers.get('content-length') ?? NaN);
  if (Number.isFinite(declared) && declared > max) throw tooLarge(max);
  if (!req.body) return '';
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    let step: ReadableStreamReadResult<Uint8Array>;
    try {
      step = await reader.read();
    } catch {
      throw new HttpError(400, 'The request body did not arrive whole.');
    }
    if (step.done) break;
    size += step.value.byteLength;
    if (size > max) {
      await reader.cancel().catch(() => {});
      throw tooLarge(max);
    }
    chunks.push(step.value);
  }
  return Buffer.concat(chunks).toString('utf8');
}

const loneSurrogate = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

function checkText(v: string): void {
  if (v.includes('\u0000')) throw new HttpError(400, 'Text may not contain the NUL character (U+0000).');
  if (loneSurrogate.test(v)) throw new HttpError(400, 'Text must be valid Unicode (a lone surrogate was sent).');
}

/**
 * Checks a parsed JSON value before any schema sees it: nesting no deeper than `maxJsonDepth`
 * (deeper values would overflow the stack of whatever walks them later), no NUL characters in
 * strings or keys (PostgreSQL text cannot hold them) and no lone surrogates (they cannot be stored
 * as UTF-8 verbatim). Iterative, so hostile nesting cannot overflow the check itself.
 */
function checkJsonValue(root: unknown): void {
  const stack: [unknown, number][] = [[root, 0]];
  while (stack.length) {
    const [v, depth] = stack.pop()!;
    if (typeof v === 'string') {
      checkText(v);
      continue;
    }
    if (!v || typeof v !== 'object') continue;
    if (depth >= maxJsonDepth) throw new HttpError(400, `The request body is nested too deeply (at most ${maxJsonDepth} levels).`);
    if (Array.isArray(v)) {
      for (const x of v) stack.push([x, depth + 1]);
    } else {
      for (const [k, x] of Object.entries(v)) {
        checkText(k);
        stack.push([x, depth + 1]);
      }
    }
  }
}

/**
 * Reads and validates a JSON body. Refused before the schema runs: a body that is not declared as
 * JSON (415; a form or text post from another site cannot pass as JSON), larger than `maxBytes`
 * (413), not valid JSON (400), nested deeper than `maxJsonDepth` or holding NUL characters (400).
 * Keys such as `__proto__` arrive as plain own properties (JSON.parse never sets a prototype) and
 * the schemas drop or refuse keys they do not know.
 */
export async function parseBody<T>(req: Request, schema: ZodType<T>, opts: { maxBytes?: number } = {}): Promise<T> {
  const max = opts.maxBytes ?? defaultBodyLimitBytes;
  const type = req.headers.get('content-type');
  if (type !== null && !/^application\/([\w.+-]+\+)?json\s*(;|$)/i.test(type.trim())) {
    throw new HttpError(415, 'Send the request body as JSON (Content-Type: application/json).');
  }
  const text = await readText(req, max);
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch {
    throw new HttpError(400, 'The request body must be JSON.');
  }
  checkJsonValue(raw);
  return schema.parse(raw);
}

/** Validates query-string parameters (NUL characters and lone surrogates refused, as in bodies). */
export function parseQuery<T>(req: NextRequest, schema: ZodType<T>): T {
  const entries = Object.fromEntries(req.nextUrl.searchParams.entries());
  for (const [k, v] of Object.entries(entries)) {
    checkText(k);
    checkText(v);
  }
  return schema.parse(entries);
}
