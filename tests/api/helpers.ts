import { inject } from 'vitest';

export const demoPassword = 'knit-demo-2027';
export const accounts = {
  admin: 'admin@hollowfell.example',
  designer: 'designer@hollowfell.example',
  'colour-lead': 'colour@hollowfell.example',
  client: 'client@varrow.example',
  mill: 'mill@quellmoor.example',
  otherStudioAdmin: 'admin@oxbow.example',
} as const;
export type Account = keyof typeof accounts;

export const baseUrl = () => inject('baseUrl');

/** A signed-in HTTP client for one account (keeps its session cookie). */
export class Client {
  cookie = '';
  constructor(public readonly label: string) {}

  async request(method: string, path: string, body?: unknown, headers: Record<string, string> = {}) {
    const res = await fetch(baseUrl() + path, {
      method,
      headers: {
        ...(body !== undefined ? { 'content-type': 'application/json' } : {}),
        ...(this.cookie ? { cookie: this.cookie } : {}),
        ...headers,
      },
      body: body === undefined ? undefined : typeof body === 'string' ? body : JSON.stringify(body),
      redirect: 'manual',
    });
    const setCookie = res.headers.getSetCookie();
    for (const c of setCookie) {
      const [pair] = c.split(';');
      if (pair?.startsWith('needlemap_session=')) this.cookie = pair.endsWith('=') ? '' : pair;
    }
    const text = await res.text();
    let json: any = null;
    try { json = text ? JSON.parse(text) : null; } catch { json = null; }
    return { status: res.status, json, headers: res.headers, text };
  }
  get(path: string) { return this.request('GET', path); }
  post(path: string, body?: unknown) { return this.request('POST', path, body ?? {}); }
  patch(path: string, body?: unknown) { return this.request('PATCH', path, body ?? {}); }
  put(path: string, body?: unknown) { return this.request('PUT', path, body ?? {}); }
  delete(path: string) { return this.request('DELETE', path); }
}

const cache = new Map<string, Client>();

/** Signs in once per account per test file. */
export async function as(account: Account): Promise<Client> {
  const hit = cache.get(account);
  if (hit) return hit;
  const c = new Client(account);
  const res = await c.post('/api/auth/sign-in', { email: accounts[account], password: demoPassword });
  if (res.status !== 200) throw new Error(`sign-in as ${account} failed: ${res.status} ${res.text}`);
  cache.set(account, c);
  return c;
}

export const anonymous = () => new Client('signed-out');

let seq = 0;
/** A style code unique within the run. */
export const uniqueCode = (prefix = 'T') => `${prefix}-${Date.now().toString(36)}-${(seq++).toString(36)}`.toUpperCase();

export const newStyleBody = (code = uniqueCode()) => ({
  code,
  name: 'Test compression top',
  season: 'SS28',
  garmentType: 'long-sleeve-top',
  construction: 'seamless',
  machine: { kind: 'circular', diameterIn: 14, gauge: 28, needleMultiple: 4, feeders: 8, maxYarns: 3 },
  sizes: { labels: ['S', 'M', 'L'], base: 'M' },
});

export async function styleByCode(code: string) {
  const admin = await as('admin');
  const res = await admin.get('/api/styles');
  const s = res.json.styles.find((x: { code: string }) => x.code === code);
  if (!s) throw new Error(`no style ${code}`);
  return s as { id: string; version: number; code: string };
}
