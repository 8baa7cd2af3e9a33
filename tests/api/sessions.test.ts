/**
 * Sessions that can be ended, the password change, refusal of cross-site writes and the security
 * headers. Each check that something is refused has a twin that shows the same request is
 * accepted when the one thing under test is right, so the refusal cannot come from elsewhere.
 */
import { randomUUID } from 'node:crypto';
import { sealData, unsealData } from 'iron-session';
import knexFactory, { type Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { accounts, anonymous, as, baseUrl, Client, demoPassword, newStyleBody } from './helpers';

const COOKIE = 'needlemap_session';
const ttlSeconds = 60 * 60 * 12;
const secret = () => inject('sessionSecret');

let knex: Knex;
beforeAll(() => {
  knex = knexFactory({ client: 'pg', connection: inject('databaseUrl'), pool: { min: 0, max: 2 } });
});
afterAll(async () => { await knex?.destroy(); });

const sealOf = (c: Client) => decodeURIComponent(c.cookie.slice(`${COOKIE}=`.length));
/** A client that sends the given seal as its session cookie. */
function withSeal(seal: string, label = 'copy'): Client {
  const c = new Client(label);
  c.cookie = `${COOKIE}=${encodeURIComponent(seal)}`;
  return c;
}
async function contents(seal: string) {
  return unsealData<{ sessionId?: string; expiresAtMs?: number }>(seal, { password: secret(), ttl: ttlSeconds });
}
const sessionRows = (id: string) => knex('sessions').where({ id }).count<{ count: string }[]>('* as count').then((r) => Number(r[0]!.count));

async function signedIn(email: string, password = demoPassword, label = email): Promise<Client> {
  const c = new Client(label);
  const res = await c.post('/api/auth/sign-in', { email, password });
  expect(res.status, res.text).toBe(200);
  return c;
}

/** An account of its own (admin-created), so changing its password disturbs no other test. */
async function throwaway(password = 'throwaway-pass-1') {
  const admin = await as('admin');
  const email = `sessions-${randomUUID().slice(0, 8)}@hollowfell.example`;
  const res = await admin.post('/api/members', { email, name: 'Session Tester', role: 'designer', password });
  expect(res.status, res.text).toBe(201);
  return { email, password, id: res.json.member.id as string };
}

describe('sessions', () => {
  it('the cookie names a session row; sign-out deletes the row and a copy of the cookie stops working at once', async () => {
    const c = await signedIn(accounts.designer);
    const { sessionId } = await contents(sealOf(c));
    expect(sessionId).toMatch(/^[0-9a-f-]{36}$/);
    expect(await sessionRows(sessionId!)).toBe(1);

    const copy = withSeal(sealOf(c));
    // Used before sign-out, so the server has the unsealed cookie in its cache.
    expect((await copy.get('/api/auth/me')).status).toBe(200);
    expect((await copy.get('/styles')).status).toBe(200);

    expect((await c.post('/api/auth/sign-out')).status).toBe(200);
    expect(c.cookie).toBe('');
    expect(await sessionRows(sessionId!)).toBe(0);
    expect((await copy.get('/api/auth/me')).status).toBe(401);
    const page = await copy.get('/styles');
    expect(page.status).toBeGreaterThanOrEqual(300);
    expect(page.status).toBeLessThan(400);
    expect(page.headers.get('location')).toMatch(/\/sign-in/);
  });

  it('a tampered cookie, or one sealed with another secret, is signed out', async () => {
    const c = await signedIn(accounts.designer);
    const seal = sealOf(c);
    expect((await withSeal(seal).get('/api/auth/me')).status).toBe(200);

    // One character changed inside the encrypted part (the fields are separated by '*').
    const parts = seal.split('*');
    const enc = parts[4]!;
    parts[4] = (enc[0] === 'A' ? 'B' : 'A') + enc.slice(1);
    const tampered = withSeal(parts.join('*'));
    expect((await tampered.get('/api/auth/me')).status).toBe(401);
    expect((await tampered.post('/api/styles', newStyleBody())).status).toBe(401);
    const page = await tampered.get('/styles');
    expect(page.headers.get('location')).toMatch(/\/sign-in/);

    const data = await contents(seal);
    const foreign = await sealData(data, { password: 'another-secret-of-at-least-32-characters-0123', ttl: ttlSeconds });
    expect((await withSeal(foreign).get('/api/auth/me')).status).toBe(401);
    expect((await withSeal('not-a-seal').get('/api/auth/me')).status).toBe(401);
  });

  it('an expired cookie is signed out, as is a session whose row has run out', async () => {
    const c = await signedIn(accounts.designer);
    const data = await contents(sealOf(c));
    expect(data.sessionId).toBeTruthy();

    // The same contents sealed again with the server's secret: accepted, so the seals made here are sound.
    const fresh = await sealData(data, { password: secret(), ttl: ttlSeconds });
    expect((await withSeal(fresh).get('/api/auth/me')).status).toBe(200);

    // Sealed with a time to live that ended two minutes ago (past the seal's minute of grace).
    const expired = await sealData(data, { password: secret(), ttl: -120 });
    expect((await withSeal(expired).get('/api/auth/me')).status).toBe(401);

    // A seal that is still valid but whose session end, as it says itself, has passed.
    const ended = await sealData({ ...data, expiresAtMs: Date.now() - 1000 }, { password: secret(), ttl: ttlSeconds });
    expect((await withSeal(ended).get('/api/auth/me')).status).toBe(401);

    // The row's own end is checked on every request, even for a cookie the server has cached.
    await knex('sessions').where({ id: data.sessionId }).update({ expires_at: knex.raw("now() - interval '1 minute'") });
    expect((await c.get('/api/auth/me')).status).toBe(401);
    expect((await withSeal(fresh).get('/api/auth/me')).status).toBe(401);
  });

  it('deactivating an account ends its sessions: reactivating it does not bring them back', async () => {
    const admin = await as('admin');
    const t = await throwaway();
    const c = await signedIn(t.email, t.password);
    const { sessionId } = await contents(sealOf(c));
    expect((await c.get('/api/auth/me')).status).toBe(200);

    expect((await admin.patch(`/api/members/${t.id}`, { active: false })).status).toBe(200);
    expect(await sessionRows(sessionId!)).toBe(0);
    expect((await admin.patch(`/api/members/${t.id}`, { active: true })).status).toBe(200);
    expect((await c.get('/api/auth/me')).status).toBe(401);
    // The account itself works again.
    await signedIn(t.email, t.password);
  });
});

describe('password change', () => {
  it('refuses a wrong current password and a weak new one with field errors, changing nothing', async () => {
    const t = await throwaway();
    const c = await signedIn(t.email, t.password);
    const other = await signedIn(t.email, t.password);

    const wrong = await c.post('/api/auth/password', { currentPassword: 'not-the-password', newPassword: 'a-new-pass-123' });
    expect(wrong.status).toBe(400);
    expect(Object.keys(wrong.json.fieldErrors)).toEqual(['currentPassword']);
    const short = await c.post('/api/auth/password', { currentPassword: t.password, newPassword: 'short' });
    expect(short.status).toBe(400);
    expect(Object.keys(short.json.fieldErrors)).toEqual(['newPassword']);
    const same = await c.post('/api/auth/password', { currentPassword: t.password, newPassword: t.password });
    expect(same.status).toBe(400);
    expect(Object.keys(same.json.fieldErrors)).toEqual(['newPassword']);
    const missing = await c.post('/api/auth/password', {});
    expect(Object.keys(missing.json.fieldErrors).sort()).toEqual(['currentPassword', 'newPassword']);

    // Nothing changed: the other session works and the old password still signs in.
    expect((await other.get('/api/auth/me')).status).toBe(200);
    await signedIn(t.email, t.password);
    expect((await anonymous().post('/api/auth/password', { currentPassword: t.password, newPassword: 'a-new-pass-123' })).status).toBe(401);
  });

  it('sets the new password and ends every other session of the account; the current one stays', async () => {
    const t = await throwaway();
    const c = await signedIn(t.email, t.password, 'changer');
    const other = await signedIn(t.email, t.password, 'other browser');
    const third = await signedIn(t.email, t.password, 'third browser');
    const bystander = await signedIn(accounts['colour-lead']);

    const res = await c.post('/api/auth/password', { currentPassword: t.password, newPassword: 'a-new-pass-123' });
    expect(res.status, res.text).toBe(200);
    expect(res.json.endedSessions).toBe(2);

    expect((await c.get('/api/auth/me')).status).toBe(200);
    expect((await other.get('/api/auth/me')).status).toBe(401);
    expect((await third.get('/api/auth/me')).status).toBe(401);
    expect((await bystander.get('/api/auth/me')).status).toBe(200);

    expect((await anonymous().post('/api/auth/sign-in', { email: t.email, password: t.password })).status).toBe(401);
    await signedIn(t.email, 'a-new-pass-123');
  });
});

describe('cross-site writes', () => {
  const foreign = 'https://elsewhere.example';

  it('a state-changing request from another origin is refused with 403 and changes nothing; from the app itself it goes through', async () => {
    const designer = await as('designer');
    const style = (await designer.post('/api/styles', newStyleBody())).json.style as { id: string; name: string; version: number };

    const fromElsewhere = { origin: foreign };
    const patch = await designer.request('PATCH', `/api/styles/${style.id}`, { version: style.version, name: 'Renamed from elsewhere' }, fromElsewhere);
    expect(patch.status).toBe(403);
    expect(typeof patch.json.error).toBe('string');
    expect((await designer.request('DELETE', `/api/styles/${style.id}`, undefined, fromElsewhere)).status).toBe(403);
    expect((await designer.request('PUT', `/api/styles/${style.id}/textures`, { version: style.version, textureIds: [] }, fromElsewhere)).status).toBe(403);
    const code = `X-${randomUUID().slice(0, 8)}`.toUpperCase();
    expect((await designer.request('POST', '/api/styles', newStyleBody(code), fromElsewhere)).status).toBe(403);
    expect((await designer.request('POST', '/api/styles', newStyleBody(code), { origin: 'null' })).status).toBe(403);
    // Without Origin the Referer decides.
    expect((await designer.request('POST', '/api/styles', newStyleBody(code), { referer: `${foreign}/page` })).status).toBe(403);

    const after = (await designer.get(`/api/styles/${style.id}`)).json.style;
    expect(after.name).toBe(style.name);
    expect(after.version).toBe(style.version);
    expect((await designer.get('/api/styles')).json.styles.some((s: { code: string }) => s.code === code)).toBe(false);

    // Reads are not refused; writes from the app's own pages, and from clients that send neither header, go through.
    expect((await designer.request('GET', `/api/styles/${style.id}`, undefined, fromElsewhere)).status).toBe(200);
    const own = await designer.request('PATCH', `/api/styles/${style.id}`, { version: style.version, name: 'Renamed here' }, { origin: baseUrl() });
    expect(own.status, own.text).toBe(200);
    const byReferer = await designer.request('POST', '/api/styles', newStyleBody(code), { referer: `${baseUrl()}/styles/new` });
    expect(byReferer.status, byReferer.text).toBe(201);
    expect((await designer.post('/api/styles', newStyleBody())).status).toBe(201);
  });

  it('sign-in from another origin is refused and sets no cookie', async () => {
    const c = new Client('elsewhere');
    const res = await c.request('POST', '/api/auth/sign-in', { email: accounts.designer, password: demoPassword }, { origin: foreign });
    expect(res.status).toBe(403);
    expect(res.headers.getSetCookie()).toEqual([]);
    const own = await c.request('POST', '/api/auth/sign-in', { email: accounts.designer, password: demoPassword }, { origin: baseUrl() });
    expect(own.status).toBe(200);
  });
});

describe('security headers', () => {
  const common = (h: Headers, what: string) => {
    expect(h.get('x-content-type-options'), what).toBe('nosniff');
    expect(h.get('referrer-policy'), what).toBe('strict-origin-when-cross-origin');
    expect(h.get('permissions-policy'), what).toMatch(/camera=\(\)/);
    expect(h.get('x-frame-options'), what).toBe('DENY');
  };

  it('pages carry a policy with a fresh nonce that their scripts bear', async () => {
    const designer = await as('designer');
    const nonces: string[] = [];
    for (const [c, path] of [[anonymous(), '/sign-in'], [designer, '/styles'], [designer, '/styles']] as const) {
      const res = await c.get(path);
      expect(res.status, path).toBe(200);
      common(res.headers, path);
      const csp = res.headers.get('content-security-policy') ?? '';
      expect(csp, path).toContain("frame-ancestors 'none'");
      expect(csp, path).toContain("object-src 'none'");
      expect(csp, path).not.toMatch(/script-src[^;]*'unsafe-inline'/);
      const nonce = /script-src[^;]*'nonce-([^']+)'/.exec(csp)?.[1];
      expect(nonce, path).toBeTruthy();
      nonces.push(nonce!);
      const scripts = [...res.text.matchAll(/<script\b[^>]*>/g)].map((m) => m[0]);
      expect(scripts.length, path).toBeGreaterThan(0);
      for (const s of scripts) expect(s, path).toContain(`nonce="${nonce}"`);
    }
    expect(new Set(nonces).size).toBe(nonces.length);
  });

  it('a redirect to sign-in and API answers carry them too', async () => {
    const redirect = await anonymous().get('/styles');
    expect(redirect.headers.get('location')).toMatch(/\/sign-in/);
    common(redirect.headers, 'redirect');
    expect(redirect.headers.get('content-security-policy')).toContain("frame-ancestors 'none'");

    const designer = await as('designer');
    for (const [c, path] of [[designer, '/api/auth/me'], [anonymous(), '/api/auth/me'], [anonymous(), '/api/health']] as const) {
      const res = await c.get(path);
      common(res.headers, path);
      const csp = res.headers.get('content-security-policy') ?? '';
      expect(csp, path).toContain("default-src 'none'");
      expect(csp, path).toContain("frame-ancestors 'none'");
    }
  });
});
