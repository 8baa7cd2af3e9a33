/**
 * Every route handler under app/api, read from the files, so a test that walks the routes covers a
 * new one the day it lands (the authorization matrix, hostile input, isolation).
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';

export type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
export interface RouteInfo {
  /** "METHOD /api/template", e.g. "GET /api/styles/[id]". */
  key: string;
  method: Method;
  template: string;
  /** A write that reads a JSON body through parseBody(). */
  parsesBody: boolean;
  /** A write that reads a multipart upload through readMultipart(). */
  multipart: boolean;
}

const apiRoot = path.resolve(import.meta.dirname, '../../app/api');

/** The routes, sorted by key. */
export function discoverRoutes(): RouteInfo[] {
  const out: RouteInfo[] = [];
  const walk = (dir: string) => {
    for (const name of readdirSync(dir)) {
      const p = path.join(dir, name);
      if (statSync(p).isDirectory()) walk(p);
      else if (name === 'route.ts') {
        const src = readFileSync(p, 'utf8');
        const template = '/api/' + path.relative(apiRoot, dir).split(path.sep).join('/');
        for (const m of src.matchAll(/export\s+(?:const|async\s+function|function)\s+(GET|POST|PUT|PATCH|DELETE)\b/g)) {
          const method = m[1] as Method;
          const writes = method !== 'GET' && method !== 'DELETE';
          out.push({
            key: `${method} ${template}`, method, template,
            parsesBody: writes && src.includes('parseBody('),
            multipart: writes && src.includes('readMultipart('),
          });
        }
      }
    }
  };
  walk(apiRoot);
  return out.sort((a, b) => a.key.localeCompare(b.key));
}
