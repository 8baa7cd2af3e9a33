import knexFactory from 'knex';
import { describe, expect, inject, it } from 'vitest';
import { accounts, anonymous, as, Client, demoPassword } from './helpers';
import { reserveSignInAttempt, signInLimits } from '@/lib/db/sign-in-attempts';

describe('sign-in', () => {
  it('signs in, answers who am I, signs out', async () => {
    const c = new Client('designer');
    const res = await c.post('/api/auth/sign-in', { email: accounts.designer, password: demoPassword });
    expect(res.status).toBe(200);
    expect(res.json.user.role).toBe('designer');
    const cookieHeader = res.headers.getSetCookie().join('\n');
    expect(cookieHeader).toMatch(/HttpOnly/i);
    expect(cookieHeader).toMatch(/SameSite=Lax/i);
    // Tests run over plain http on 127.0.0.1, so the cookie must not be marked Secure here.
    expect(cookieHeader).not.toMatch(/;\s*Secure/i);

    const me = await c.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.json.user.email).toBe(accounts.designer);
    expect(me.json.user).not.toHaveProperty('passwordHash');

    await c.post('/api/auth/sign-out');
    expect((await c.get('/api/auth/me')).status).toBe(401);
  });

  it('accepts the e-mail in any case', async () => {
    const c = new Client('x');
    const res = await c.post('/api/auth/sign-in', { email: accounts.admin.toUpperCase(), password: demoPassword });
    expect(res.status).toBe(200);
  });

  it('rejects a wrong password with 401 and a malformed body with 400', async () => {
    const c = anonymous();
    expect((await c.post('/api/auth/sign-in', { email: accounts['colour-lead'], password: 'nope' })).status).toBe(401);
    const bad = await c.post('/api/auth/sign-in', { email: 'not-an-email' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.json.fieldErrors)).toEqual(expect.arrayContaining(['email', 'password']));
    const notJson = await c.request('POST', '/api/auth/sign-in', '{oops', { 'content-type': 'application/json' });
    expect(notJson.status).toBe(400);
  });

  it('rate-limits failed sign-ins per account with 429, even with the right password afterwards', async () => {
    const email = 'nobody-here@hollowfell.example';
    const c = anonymous();
    const statuses: number[] = [];
    for (let i = 0; i < 6; i++) {
      statuses.push((await c.request('POST', '/api/auth/sign-in', { email, password: 'wrong' }, { 'x-forwarded-for': `10.9.0.${i}` })).status);
    }
    expect(statuses.slice(0, 5)).toEqual([401, 401, 401, 401, 401]);
    expect(statuses[5]).toBe(429);
    const blocked = await c.request('POST', '/api/auth/sign-in', { email, password: 'wrong' });
    expect(blocked.status).toBe(429);
    expect(Number(blocked.headers.get('retry-after'))).toBeGreaterThan(0);
  });

  it('rate-limits failed sign-ins per address across accounts', async () => {
    const c = anonymous();
    const addr = { 'x-forwarded-for': '10.77.0.1' };
    let last = 0;
    for (let i = 0; i < 31; i++) {
      last = (await c.request('POST', '/api/auth/sign-in', { email: `probe${i}@elsewhere.example`, password: 'x' }, addr)).status;
    }
    expect(last).toBe(429);
    // A different address is not blocked.
    const other = await c.request('POST', '/api/auth/sign-in', { email: 'probe-x@elsewhere.example', password: 'x' }, { 'x-forwarded-for': '10.77.0.2' });
    expect(other.status).toBe(401);
  });

  it('counts the address the proxy added (the last forwarded entry), not what the caller wrote before it', async () => {
    const c = anonymous();
    let last = 0;
    for (let i = 0; i <= signInLimits.perAddress; i++) {
      const forwarded = `10.66.${i}.1, 10.78.0.1`;
      last = (await c.request('POST', '/api/auth/sign-in', { email: `spoof${i}@elsewhere.example`, password: 'x' }, { 'x-forwarded-for': forwarded })).status;
    }
    expect(last).toBe(429);
  });

  it('failures against one account, past its limit, do not block another account from the same address', async () => {
    const c = anonymous();
    const addr = { 'x-forwarded-for': '10.80.0.1' };
    const hammered = `hammered-${Date.now()}@elsewhere.example`;
    const statuses: number[] = [];
    for (let i = 0; i <= signInLimits.perAddress + 5; i++) {
      statuses.push((await c.request('POST', '/api/auth/sign-in', { email: hammered, password: 'wrong' }, addr)).status);
    }
    expect(statuses.filter((s) => s === 401)).toHaveLength(signInLimits.perAccount);
    expect(statuses.at(-1)).toBe(429);
    const other = await new Client('other').request('POST', '/api/auth/sign-in', { email: accounts['colour-lead'], password: demoPassword }, addr);
    expect(other.status).toBe(200);
  });

  it('an unknown address has no counter of its own: failures of many accounts never add up against another', async () => {
    // The test server sits behind a trusted proxy (every request has an address), so this is the
    // data layer as a server without TRUST_PROXY calls it: address null.
    const knex = knexFactory({ client: 'pg', connection: inject('databaseUrl') });
    try {
      const now = new Date();
      const probe = `${Date.now()}-${Math.random().toString(36).slice(2)}`;
      for (let i = 0; i <= signInLimits.perAddress + 5; i++) {
        expect((await reserveSignInAttempt(`unknown-${i}-${probe}@elsewhere.example`, null, now, knex)).waitSeconds).toBe(0);
      }
      expect((await reserveSignInAttempt(`another-${probe}@elsewhere.example`, null, now, knex)).waitSeconds).toBe(0);
      // The same failures from one known address do add up.
      let last = 0;
      for (let i = 0; i <= signInLimits.perAddress; i++) {
        last = (await reserveSignInAttempt(`known-${i}-${probe}@elsewhere.example`, `10.81.0.1-${probe}`, now, knex)).waitSeconds;
      }
      expect(last).toBeGreaterThan(0);
    } finally {
      await knex.destroy();
    }
  });

  it('a parallel burst of wrong passwords gets no more answers than the per-account limit before 429', async () => {
    const email = `burst-${Date.now()}@hollowfell.example`;
    const burst = signInLimits.perAccount * 3;
    const statuses = await Promise.all(
      Array.from({ length: burst }, () =>
        anonymous().request('POST', '/api/auth/sign-in', { email, password: 'wrong' }, { 'x-forwarded-for': '10.79.0.1' }).then((r) => r.status),
      ),
    );
    const answered = statuses.filter((s) => s !== 429);
    expect(answered.every((s) => s === 401)).toBe(true);
    // Each attempt takes its own count, so exactly the limit get an answer (no more, however they interleave).
    expect(answered.length).toBe(signInLimits.perAccount);
  });

  it('a deactivated account cannot sign in and its session stops working', async () => {
    const admin = await as('admin');
    const email = `temp-${Date.now()}@hollowfell.example`;
    const created = await admin.post('/api/members', { email, name: 'Temp Knitter', role: 'designer', password: 'temporary-pass-1' });
    expect(created.status).toBe(201);
    const temp = new Client('temp');
    expect((await temp.post('/api/auth/sign-in', { email, password: 'temporary-pass-1' })).status).toBe(200);
    expect((await temp.get('/api/styles')).status).toBe(200);
    expect((await admin.patch(`/api/members/${created.json.member.id}`, { active: false })).status).toBe(200);
    expect((await temp.get('/api/styles')).status).toBe(401);
    expect((await new Client('t2').post('/api/auth/sign-in', { email, password: 'temporary-pass-1' })).status).toBe(401);
  });

  it('keeps at least one active admin', async () => {
    const admin = await as('admin');
    const me = await admin.get('/api/auth/me');
    const res = await admin.patch(`/api/members/${me.json.user.id}`, { role: 'designer' });
    expect(res.status).toBe(400);
  });
});

describe('members: mill and client accounts belong to an organisation of their kind', () => {
  const fieldError = (res: { status: number; json: { fieldErrors?: Record<string, string[]> } }) => [res.status, Object.keys(res.json.fieldErrors ?? {})];

  it('POST refuses an organisation of the wrong kind or of another studio', async () => {
    const admin = await as('admin');
    const orgs = (await admin.get('/api/organisations')).json.organisations as { id: string; name: string }[];
    const mill = orgs.find((o) => o.name === 'Quellmoor Knitworks')!.id;
    const client = orgs.find((o) => o.name === 'Varrow Sport')!.id;
    const body = (organisationId: string) => ({ email: `org-${Date.now()}-${Math.random().toString(36).slice(2)}@quellmoor.example`, name: 'Yarn Store Hand', role: 'mill', password: 'temporary-pass-1', organisationId });
    expect(fieldError(await admin.post('/api/members', body(client)))).toEqual([400, ['organisationId']]);
    const other = await as('otherStudioAdmin');
    expect(fieldError(await other.post('/api/members', body(mill)))).toEqual([400, ['organisationId']]);
    const created = await admin.post('/api/members', body(mill));
    expect(created.status).toBe(201);
    expect(created.json.member.organisationName).toBe('Quellmoor Knitworks');
  });

  it('PATCH to a mill or client role checks the organisation is the studio\'s and of that kind', async () => {
    const admin = await as('admin');
    const orgs = (await admin.get('/api/organisations')).json.organisations as { id: string; name: string }[];
    const mill = orgs.find((o) => o.name === 'Quellmoor Knitworks')!.id;
    const client = orgs.find((o) => o.name === 'Varrow Sport')!.id;
    const created = await admin.post('/api/members', { email: `role-${Date.now()}@hollowfell.example`, name: 'Role Changer', role: 'designer', password: 'temporary-pass-1' });
    expect(created.status).toBe(201);
    const path = `/api/members/${created.json.member.id}`;

    expect(fieldError(await admin.patch(path, { role: 'mill' }))).toEqual([400, ['organisationId']]);
    expect(fieldError(await admin.patch(path, { role: 'mill', organisationId: client }))).toEqual([400, ['organisationId']]);
    const toMill = await admin.patch(path, { role: 'mill', organisationId: mill });
    expect(toMill.status).toBe(200);
    expect(toMill.json.member).toMatchObject({ role: 'mill', organisationName: 'Quellmoor Knitworks' });
    // Now a mill account: becoming a client without naming a client keeps the mill, which does not fit.
    expect(fieldError(await admin.patch(path, { role: 'client' }))).toEqual([400, ['organisationId']]);
    expect((await admin.patch(path, { role: 'client', organisationId: client })).json.member.organisationName).toBe('Varrow Sport');
    // Back to the studio: no organisation any more.
    const toStudio = await admin.patch(path, { role: 'designer' });
    expect(toStudio.status).toBe(200);
    expect(toStudio.json.member.organisationName).toBeNull();

    // Another studio cannot attach its member to this studio's mill.
    const other = await as('otherStudioAdmin');
    const theirs = await other.post('/api/members', { email: `oxbow-${Date.now()}@oxbow.example`, name: 'Oxbow Knitter', role: 'designer', password: 'temporary-pass-1' });
    expect(theirs.status).toBe(201);
    expect(fieldError(await other.patch(`/api/members/${theirs.json.member.id}`, { role: 'mill', organisationId: mill }))).toEqual([400, ['organisationId']]);
  });
});
