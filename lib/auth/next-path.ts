const probeOrigin = 'http://x.invalid';

/**
 * Where to go after signing in: `next` when it is a path on this site, otherwise `fallback`.
 * A browser reads `//host`, `/\host` and (after it drops tabs and line breaks) `/<tab>/host` as
 * another site, so the path must start with one `/` not followed by `/` or `\`, hold no control
 * characters, and resolve against a probe origin to that same origin (WHATWG URL Standard, "URL
 * parsing": tabs and newlines are removed, `\` counts as `/` in special schemes).
 */
export function sameOriginPath(next: unknown, fallback = '/'): string {
  if (typeof next !== 'string' || !next.startsWith('/')) return fallback;
  if (next[1] === '/' || next[1] === '\\') return fallback;
  if (/[\u0000-\u001f\u007f]/.test(next)) return fallback;
  let resolved: URL;
  try {
    resolved = new URL(next, probeOrigin);
  } catch {
    return fallback;
  }
  return resolved.origin === probeOrigin ? next : fallback;
}
