/**
 * Every route handler, called as every role and signed out, with the status each must answer.
 * The list of routes is read from app/api: a new route without entries here fails this test.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { discoverRoutes } from './routes';
import { anonymous, as, accounts, baseUrl, Client, demoPassword, newStyleBody, styleByCode, type Account } from './helpers';

type Caller = 'anon' | 'admin' | 'designer' | 'colour-lead' | 'client' | 'mill';
const callers: Caller[] = ['anon', 'admin', 'designer', 'colour-lead', 'client', 'mill'];

interface Ctx {
  sharedStyleId: string;
  kestenholmId: string;
  throwawayMemberId: string;
}

type Res = { status: number };
interface Entry {
  expect: Record<Caller, number>;
  run: (c: Client, ctx: Ctx, caller: Caller) => Promise<Res>;
}

const staffOnly = (ok: number) => ({ anon: 401, admin: ok, designer: ok, 'colour-lead': ok, client: 403, mill: 403 });
const editors = (ok: number) => ({ anon: 401, admin: ok, designer: ok, 'colour-lead': 403, client: 403, mill: 403 });
const adminOnly = (ok: number) => ({ anon: 401, admin: ok, designer: 403, 'colour-lead': 403, client: 403, mill: 403 });
const everyone = (ok: number) => ({ anon: 401, admin: ok, designer: ok, 'colour-lead': ok, client: ok, mill: ok });
/** The live working copy (body map, textures, yarns, trims): not the mill, which works from released revisions. */
const workingCopy = (ok: number) => ({ ...everyone(ok), mill: 403 });

async function freshStyle() {
  const designer = await as('designer');
  const res = await designer.post('/api/styles', newStyleBody());
  return res.json.style as { id: string; version: number };
}

// The studio library (yarns, textures) and a style's textures and trims.
let libSeq = 0;
const libName = (what: string) => `Matrix ${what} ${Date.now().toString(36)}-${(libSeq++).toString(36)}`;

async function freshYarn() {
  const designer = await as('designer');
  const res = await designer.post('/api/library/yarns', {
    name: libName('yarn'), count: { value: 78, unit: 'dtex' }, makeUp: { kind: 'single', fibre: 'polyamide' }, colour: { state: 'dyeable' },
  });
  return res.json.yarn as { id: string; version: number };
}

async function textureBody() {
  const designer = await as('designer');
  const yarns = (await designer.get('/api/library/yarns')).json.yarns as { id: string }[];
  const ground = yarns[0]!.id;
  return {
    name: libName('texture'), family: 'jersey', repeat: { needles: 2, courses: 2, cells: ['kk', 'kt'] },
    feeders: [{ ground }, { ground }], density: { walesPerCm: 20, coursesPerCm: 28 }, loopMm: { knit: 2.4, tuck: 1.8 },
  };
}

async function freshTexture() {
  const designer = await as('designer');
  const res = await designer.post('/api/library/textures', await textureBody());
  return res.json.texture as { id: string; version: number };
}

async function freshTrim() {
  const designer = await as('designer');
  const s = await freshStyle();
  const res = await designer.post(`/api/styles/${s.id}/trims`, {
    panelKind: 'front', kind: 'woven-label', method: 'sewn', box: { x: 10, y: 10, width: 20, height: 10 },
  });
  return { styleId: s.id, trim: res.json.trim as { id: string; version: number } };
}

// Colour: the studio's colour standards, a style's colourways and lab dips.
const colourEditors = (ok: number) => ({ anon: 401, admin: ok, designer: 403, 'colour-lead': ok, client: 403, mill: 403 });
const labDipSubmitters = (ok: number) => ({ anon: 401, admin: ok, designer: 403, 'colour-lead': 403, client: 403, mill: ok });
let colourSeq = 0;
const colourName = (what: string) => `Matrix ${what} ${Date.now().toString(36)}-${(colourSeq++).toString(36)}`;

async function freshStandard() {
  const lead = await as('colour-lead');
  const res = await lead.post('/api/library/colour-standards', { name: colourName('standard'), lab: { L: 40, a: 10, b: -20 }, source: 'digital' });
  return res.json.standard as { id: string; version: number };
}

async function freshColourway() {
  const lead = await as('colour-lead');
  const s = await freshStyle();
  const res = await lead.post(`/api/styles/${s.id}/colourways`, { name: colourName('colourway') });
  return { styleId: s.id, colourway: res.json.colourway as { id: string; version: number } };
}

let matrixTarget: Promise<{ styleId: string; targetId: string }> | undefined;
/** A colourway with one target on the shared style (which the mill sees), made once per run. */
function sharedTarget(styleId: string) {
  matrixTarget ??= (async () => {
    const lead = await as('colour-lead');
    const { yarns } = (await lead.get(`/api/styles/${styleId}/colourways`)).json as { yarns: { id: string; colour: { state: string }; fibres: { fibre: string }[] }[] };
    const pa = yarns.find((y) => y.colour.state === 'dyeable' && y.fibres.every((f) => f.fibre === 'polyamide'))!;
    const res = await lead.post(`/api/styles/${styleId}/colourways`, {
      name: colourName('colourway'),
      targets: [{ name: 'Ground', yarnIds: [pa.id], route: 'garment-dyed', colour: { source: 'lab', lab: { L: 30, a: 5, b: -20 } } }],
    });
    return { styleId, targetId: res.json.colourway.targets[0].id as string };
  })();
  return matrixTarget;
}

async function freshLabDip(styleId: string) {
  const mill = await as('mill');
  const { targetId } = await sharedTarget(styleId);
  const res = await mill.post(`/api/styles/${styleId}/lab-dips`, { targetId, measured: { L: 30.4, a: 5.2, b: -19.6 } });
  return res.json.labDip as { id: string; version: number };
}

// Fit: a style's size spec, its sheet, the studio factor, sample rounds and corrections.
async function freshRound() {
  const designer = await as('designer');
  const s = await freshStyle();
  const res = await designer.post(`/api/styles/${s.id}/fit/rounds`, { version: s.version, kind: 'proto', size: 'M', measurements: {} });
  return { styleId: s.id, roundId: res.json.round.id as string, version: res.json.fit.version as number };
}

async function freshCorrection() {
  const designer = await as('designer');
  const r = await freshRound();
  const res = await designer.post(`/api/styles/${r.styleId}/fit/rounds/${r.roundId}/corrections`, {
    version: r.version, point: 'chest-half', size: 'M', toCm: 31, scope: 'size',
  });
  const fit = res.json.fit;
  return { ...r, correctionId: fit.rounds[0].corrections[0].id as string, version: fit.version as number };
}

function roundPhotoForm() {
  const form = new FormData();
  form.set('photo', new Blob([tinyPng], { type: 'image/png' }), 'round.png');
  return form;
}

/** A round with one photo, attached by the designer. */
async function freshRoundPhoto() {
  const designer = await as('designer');
  const r = await freshRound();
  const res = await fetch(baseUrl() + `/api/styles/${r.styleId}/fit/rounds/${r.roundId}/photos`, { method: 'POST', body: roundPhotoForm(), headers: { cookie: designer.cookie } });
  const json = (await res.json()) as { photo: { id: string } };
  return { ...r, photoId: json.photo.id };
}

// The mill round: releases, client review, test knits, files, exports and mill packs.
const tinyPng = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAAAIAAAACCAIAAAD91JpzAAAAFklEQVR4nGP8z8DAwMDAxMDAwMDAAAANHQEDasKb6QAAAABJRU5ErkJggg==',
  'base64',
);

let orgIds: Promise<{ quellmoor: string; varrow: string }> | null = null;
function millAndClient() {
  orgIds ??= (async () => {
    const orgs = (await (await as('admin')).get('/api/organisations')).json.organisations as { id: string; name: string }[];
    return { quellmoor: orgs.find((o) => o.name === 'Quellmoor Knitworks')!.id, varrow: orgs.find((o) => o.name === 'Varrow Sport')!.id };
  })();
  return orgIds;
}

/** A fresh style with one texture, released to the demo mill, with the demo client asked to review it. */
async function freshRelease() {
  const designer = await as('designer');
  const s = await freshStyle();
  const textures = (await designer.get('/api/library/textures')).json.textures as { id: string }[];
  const put = await designer.put(`/api/styles/${s.id}/textures`, { version: s.version, textureIds: [textures[0]!.id] });
  const { quellmoor, varrow } = await millAndClient();
  const rel = await designer.post(`/api/styles/${s.id}/releases`, { version: put.json.version, millIds: [quellmoor] });
  const releaseId = rel.json.release.id as string;
  await designer.post(`/api/releases/${releaseId}/reviews`, { clientId: varrow });
  return { styleId: s.id, releaseId };
}

let sharedRelease: ReturnType<typeof freshRelease> | null = null;
const theRelease = () => (sharedRelease ??= freshRelease());

async function postForm(c: Client, path: string, form: FormData) {
  const res = await fetch(baseUrl() + path, { method: 'POST', body: form, headers: c.cookie ? { cookie: c.cookie } : {} });
  return { status: res.status };
}

function knitForm() {
  const form = new FormData();
  form.set('photo', new Blob([tinyPng], { type: 'image/png' }), 'knit.png');
  form.set('walesPerCm', '20.5');
  form.set('coursesPerCm', '28');
  form.set('gsm', '180');
  return form;
}

/** A test knit waiting for the mill (fresh per call). */
async function freshTestKnit(knitted: boolean) {
  const { releaseId } = await freshRelease();
  const res = await (await as('designer')).post(`/api/releases/${releaseId}/test-knits`);
  const knit = res.json.testKnits[0] as { id: string; version: number };
  if (!knitted) return knit;
  await postForm(await as('mill'), `/api/test-knits/${knit.id}/submission`, knitForm());
  const after = (await (await as('designer')).get(`/api/releases/${releaseId}/test-knits`)).json.testKnits[0];
  return after as { id: string; version: number };
}

const millRoundEntries: Record<string, Entry> = {
  'GET /api/styles/[id]/releases': { expect: everyone(200), run: async (c) => c.get(`/api/styles/${(await theRelease()).styleId}/releases`) },
  'POST /api/styles/[id]/releases': {
    expect: editors(201),
    run: async (c) => {
      const designer = await as('designer');
      const s = await freshStyle();
      const textures = (await designer.get('/api/library/textures')).json.textures as { id: string }[];
      const put = await designer.put(`/api/styles/${s.id}/textures`, { version: s.version, textureIds: [textures[0]!.id] });
      return c.post(`/api/styles/${s.id}/releases`, { version: put.json.version ?? s.version, millIds: [(await millAndClient()).quellmoor] });
    },
  },
  'GET /api/releases/[id]': { expect: everyone(200), run: async (c) => c.get(`/api/releases/${(await theRelease()).releaseId}`) },
  'POST /api/releases/[id]/reviews': {
    expect: editors(201),
    run: async (c) => c.post(`/api/releases/${(await theRelease()).releaseId}/reviews`, { clientId: (await millAndClient()).varrow }),
  },
  'POST /api/releases/[id]/comments': {
    expect: { anon: 401, admin: 201, designer: 201, 'colour-lead': 403, client: 201, mill: 403 },
    run: async (c) => c.post(`/api/releases/${(await theRelease()).releaseId}/comments`, { body: 'Matrix comment' }),
  },
  'POST /api/releases/[id]/decision': {
    expect: { anon: 401, admin: 403, designer: 403, 'colour-lead': 403, client: 200, mill: 403 },
    run: async (c) => c.post(`/api/releases/${(await theRelease()).releaseId}/decision`, { decision: 'approved' }),
  },
  'GET /api/releases/[id]/test-knits': { expect: everyone(200), run: async (c) => c.get(`/api/releases/${(await theRelease()).releaseId}/test-knits`) },
  'POST /api/releases/[id]/test-knits': { expect: editors(201), run: async (c) => c.post(`/api/releases/${(await theRelease()).releaseId}/test-knits`) },
  'GET /api/styles/[id]/test-knits': { expect: everyone(200), run: async (c) => c.get(`/api/styles/${(await theRelease()).styleId}/test-knits`) },
  'POST /api/test-knits/[id]/submission': {
    expect: { anon: 401, admin: 403, designer: 403, 'colour-lead': 403, client: 403, mill: 200 },
    run: async (c) => postForm(c, `/api/test-knits/${(await freshTestKnit(false)).id}/submission`, knitForm()),
  },
  'POST /api/test-knits/[id]/decision': {
    expect: editors(200),
    run: async (c) => {
      const k = await freshTestKnit(true);
      return c.post(`/api/test-knits/${k.id}/decision`, { version: k.version, decision: 'approved' });
    },
  },
  'GET /api/styles/[id]/files': { expect: everyone(200), run: (c, ctx) => c.get(`/api/styles/${ctx.sharedStyleId}/files`) },
  'POST /api/styles/[id]/files': {
    expect: { anon: 401, admin: 201, designer: 201, 'colour-lead': 403, client: 403, mill: 201 },
    run: async (c, ctx) => {
      const form = new FormData();
      form.set('file', new Blob([tinyPng], { type: 'image/png' }), 'matrix.png');
      return postForm(c, `/api/styles/${ctx.sharedStyleId}/files`, form);
    },
  },
  'GET /api/files/[id]': {
    // A file the mill uploaded: the studio and that mill read it; the client does not see it.
    expect: { anon: 401, admin: 200, designer: 200, 'colour-lead': 200, client: 404, mill: 200 },
    run: async (c, ctx) => {
      const mill = await as('mill');
      const form = new FormData();
      form.set('file', new Blob([tinyPng], { type: 'image/png' }), 'mill.png');
      const res = await fetch(baseUrl() + `/api/styles/${ctx.sharedStyleId}/files`, { method: 'POST', body: form, headers: { cookie: mill.cookie } });
      const id = ((await res.json()) as { file: { id: string } }).file.id;
      return c.get(`/api/files/${id}`);
    },
  },
  'GET /api/styles/[id]/exports/[kind]': {
    expect: { anon: 401, admin: 200, designer: 200, 'colour-lead': 200, client: 403, mill: 200 },
    run: async (c) => c.get(`/api/styles/${(await theRelease()).styleId}/exports/yarn-list.csv`),
  },
  'POST /api/styles/[id]/mill-pack': {
    expect: { anon: 401, admin: 202, designer: 202, 'colour-lead': 202, client: 403, mill: 202 },
    run: async (c) => {
      const r = await theRelease();
      return c.post(`/api/styles/${r.styleId}/mill-pack`, { releaseId: r.releaseId, paper: 'a4' });
    },
  },
  'GET /api/mill-pack-jobs/[id]': {
    expect: { anon: 401, admin: 200, designer: 200, 'colour-lead': 200, client: 403, mill: 200 },
    run: async (c) => {
      const r = await theRelease();
      const job = (await (await as('designer')).post(`/api/styles/${r.styleId}/mill-pack`, { releaseId: r.releaseId, paper: 'letter' })).json.job;
      return c.get(`/api/mill-pack-jobs/${job.id}`);
    },
  },
};

export const matrix: Record<string, Entry> = {
  ...millRoundEntries,
  'GET /api/health': {
    expect: { anon: 200, admin: 200, designer: 200, 'colour-lead': 200, client: 200, mill: 200 },
    run: (c) => c.get('/api/health'),
  },
  'POST /api/auth/sign-in': {
    // Unknown accounts are refused alike for everyone (valid sign-in is covered in auth.test.ts).
    expect: { anon: 401, admin: 401, designer: 401, 'colour-lead': 401, client: 401, mill: 401 },
    run: (c, _ctx, caller) => c.post('/api/auth/sign-in', { email: `matrix-${caller}@nowhere.example`, password: 'x' }),
  },
  'POST /api/auth/sign-out': {
    expect: { anon: 200, admin: 200, designer: 200, 'colour-lead': 200, client: 200, mill: 200 },
    run: async (_c, _ctx, caller) => {
      // A session of its own, so the shared clients stay signed in.
      const own = new Client('own');
      if (caller !== 'anon') await own.post('/api/auth/sign-in', { email: accounts[caller as Account], password: demoPassword });
      return own.post('/api/auth/sign-out');
    },
  },
  'GET /api/auth/me': { expect: everyone(200), run: (c) => c.get('/api/auth/me') },
  'POST /api/auth/password': {
    // Everyone signed in may change their own password. A throwaway account per role, so the shared
    // clients (and the demo password other tests sign in with) are left alone.
    expect: everyone(200),
    run: async (c, _ctx, caller) => {
      if (caller === 'anon') return c.post('/api/auth/password', { currentPassword: 'x', newPassword: 'throwaway-456' });
      const { quellmoor, varrow } = await millAndClient();
      const email = `pw-${caller}-${Date.now().toString(36)}@hollowfell.example`;
      const organisationId = caller === 'mill' ? quellmoor : caller === 'client' ? varrow : null;
      const made = await (await as('admin')).post('/api/members', { email, name: `Password ${caller}`, role: caller, password: 'throwaway-123', organisationId });
      if (made.status !== 201) throw new Error(`throwaway ${caller}: ${made.status} ${made.text}`);
      const own = new Client(`password ${caller}`);
      await own.post('/api/auth/sign-in', { email, password: 'throwaway-123' });
      const res = await own.post('/api/auth/password', { currentPassword: 'throwaway-123', newPassword: 'throwaway-456' });
      // Deactivated again at once: a second active admin would let auth.test.ts demote the demo admin.
      await (await as('admin')).patch(`/api/members/${made.json.member.id}`, { active: false });
      return res;
    },
  },
  'GET /api/styles': { expect: everyone(200), run: (c) => c.get('/api/styles') },
  'POST /api/styles': { expect: editors(201), run: (c) => c.post('/api/styles', newStyleBody()) },
  'GET /api/styles/[id]': { expect: everyone(200), run: (c, ctx) => c.get(`/api/styles/${ctx.sharedStyleId}`) },
  'PATCH /api/styles/[id]': {
    expect: editors(200),
    run: async (c) => {
      const s = await freshStyle();
      return c.patch(`/api/styles/${s.id}`, { version: s.version, name: 'Matrix rename' });
    },
  },
  'DELETE /api/styles/[id]': {
    expect: editors(200),
    run: async (c) => c.delete(`/api/styles/${(await freshStyle()).id}`),
  },
  'GET /api/styles/[id]/history': { expect: staffOnly(200), run: (c, ctx) => c.get(`/api/styles/${ctx.sharedStyleId}/history`) },
  'POST /api/styles/[id]/shares': {
    expect: editors(201),
    run: async (c, ctx) => c.post(`/api/styles/${(await freshStyle()).id}/shares`, { organisationId: ctx.kestenholmId }),
  },
  'DELETE /api/styles/[id]/shares/[organisationId]': {
    expect: editors(200),
    run: async (c, ctx) => {
      const s = await freshStyle();
      await (await as('designer')).post(`/api/styles/${s.id}/shares`, { organisationId: ctx.kestenholmId });
      return c.delete(`/api/styles/${s.id}/shares/${ctx.kestenholmId}`);
    },
  },
  'GET /api/styles/[id]/body-map': { expect: workingCopy(200), run: (c, ctx) => c.get(`/api/styles/${ctx.sharedStyleId}/body-map`) },
  'PUT /api/styles/[id]/body-map': {
    expect: editors(200),
    run: async (c) => {
      const s = await freshStyle();
      const map = (await (await as('designer')).get(`/api/styles/${s.id}/body-map`)).json;
      return c.put(`/api/styles/${s.id}/body-map`, { version: map.version, panels: map.panels });
    },
  },
  'POST /api/styles/[id]/body-map/outline': {
    expect: editors(200),
    run: (c, ctx) => c.post(`/api/styles/${ctx.sharedStyleId}/body-map/outline`, {
      svg: '<svg viewBox="0 0 10 20"><polygon points="0,0 10,0 10,20 0,20"/></svg>', widthNeedles: 600, heightCourses: 1200,
    }),
  },
  'GET /api/organisations': { expect: staffOnly(200), run: (c) => c.get('/api/organisations') },
  'GET /api/members': { expect: adminOnly(200), run: (c) => c.get('/api/members') },
  'POST /api/members': {
    expect: adminOnly(201),
    run: (c) =>
      c.post('/api/members', {
        email: `m-${Date.now()}-${Math.random().toString(36).slice(2)}@hollowfell.example`,
        name: 'Matrix Member', role: 'designer', password: 'matrix-pass-123',
      }),
  },
  'PATCH /api/members/[id]': {
    expect: adminOnly(200),
    run: (c, ctx) => c.patch(`/api/members/${ctx.throwawayMemberId}`, { name: 'Matrix Renamed' }),
  },
  'GET /api/library/yarns': { expect: staffOnly(200), run: (c) => c.get('/api/library/yarns') },
  'POST /api/library/yarns': {
    expect: editors(201),
    run: (c) =>
      c.post('/api/library/yarns', {
        name: libName('yarn'), count: '44 dtex', makeUp: { kind: 'single', fibre: 'polyamide' }, colour: { state: 'dyeable' },
      }),
  },
  'GET /api/library/yarns/[id]': { expect: staffOnly(200), run: async (c) => c.get(`/api/library/yarns/${(await freshYarn()).id}`) },
  'PATCH /api/library/yarns/[id]': {
    expect: editors(200),
    run: async (c) => {
      const y = await freshYarn();
      return c.patch(`/api/library/yarns/${y.id}`, { version: y.version, supplierRef: 'MX-1' });
    },
  },
  'DELETE /api/library/yarns/[id]': { expect: editors(200), run: async (c) => { const y = await freshYarn(); return c.delete(`/api/library/yarns/${y.id}?version=${y.version}`); } },
  'GET /api/library/textures': { expect: staffOnly(200), run: (c) => c.get('/api/library/textures') },
  'POST /api/library/textures': { expect: editors(201), run: async (c) => c.post('/api/library/textures', await textureBody()) },
  'GET /api/library/textures/[id]': { expect: staffOnly(200), run: async (c) => c.get(`/api/library/textures/${(await freshTexture()).id}`) },
  'PATCH /api/library/textures/[id]': {
    expect: editors(200),
    run: async (c) => {
      const t = await freshTexture();
      return c.patch(`/api/library/textures/${t.id}`, { version: t.version, notes: 'Matrix note' });
    },
  },
  'DELETE /api/library/textures/[id]': { expect: editors(200), run: async (c) => { const t = await freshTexture(); return c.delete(`/api/library/textures/${t.id}?version=${t.version}`); } },
  // Everyone who sees the style reads its textures and trims: mill and client included for shared styles.
  'GET /api/styles/[id]/textures': { expect: workingCopy(200), run: (c, ctx) => c.get(`/api/styles/${ctx.sharedStyleId}/textures`) },
  'PUT /api/styles/[id]/textures': {
    expect: editors(200),
    run: async (c) => {
      const s = await freshStyle();
      return c.put(`/api/styles/${s.id}/textures`, { version: s.version, textureIds: [(await freshTexture()).id] });
    },
  },
  'GET /api/styles/[id]/trims': { expect: workingCopy(200), run: (c, ctx) => c.get(`/api/styles/${ctx.sharedStyleId}/trims`) },
  'POST /api/styles/[id]/trims': {
    expect: editors(201),
    run: async (c) =>
      c.post(`/api/styles/${(await freshStyle()).id}/trims`, {
        panelKind: 'back', kind: 'care-label', method: 'sewn', box: { x: 1, y: 1, width: 30, height: 20 },
      }),
  },
  'PATCH /api/styles/[id]/trims/[trimId]': {
    expect: editors(200),
    run: async (c) => {
      const { styleId, trim } = await freshTrim();
      return c.patch(`/api/styles/${styleId}/trims/${trim.id}`, { version: trim.version, name: 'Matrix label' });
    },
  },
  'DELETE /api/styles/[id]/trims/[trimId]': {
    expect: editors(200),
    run: async (c) => {
      const { styleId, trim } = await freshTrim();
      return c.delete(`/api/styles/${styleId}/trims/${trim.id}`);
    },
  },
  // The yarn calculator and its order CSV: everyone who sees the style (prices only for the studio, see yarn-calculator.test.ts).
  'GET /api/styles/[id]/yarn-calculator': { expect: workingCopy(200), run: (c, ctx) => c.get(`/api/styles/${ctx.sharedStyleId}/yarn-calculator?qty=M:10`) },
  'GET /api/styles/[id]/yarn-order.csv': { expect: workingCopy(200), run: (c, ctx) => c.get(`/api/styles/${ctx.sharedStyleId}/yarn-order.csv?qty=M:10`) },
  'GET /api/library/colour-standards': { expect: staffOnly(200), run: (c) => c.get('/api/library/colour-standards') },
  'POST /api/library/colour-standards': {
    expect: colourEditors(201),
    run: (c) => c.post('/api/library/colour-standards', { name: colourName('standard'), lab: { L: 50, a: 0, b: 0 }, source: 'measured' }),
  },
  'GET /api/library/colour-standards/[id]': {
    expect: staffOnly(200),
    run: async (c) => c.get(`/api/library/colour-standards/${(await freshStandard()).id}`),
  },
  'PATCH /api/library/colour-standards/[id]': {
    expect: colourEditors(200),
    run: async (c) => {
      const s = await freshStandard();
      return c.patch(`/api/library/colour-standards/${s.id}`, { version: s.version, notes: 'Matrix note' });
    },
  },
  'DELETE /api/library/colour-standards/[id]': {
    expect: colourEditors(200),
    run: async (c) => c.delete(`/api/library/colour-standards/${(await freshStandard()).id}`),
  },
  // Everyone who sees the style reads its colourways and lab dips (a client only the approved colours).
  'GET /api/styles/[id]/colourways': { expect: everyone(200), run: (c, ctx) => c.get(`/api/styles/${ctx.sharedStyleId}/colourways`) },
  'POST /api/styles/[id]/colourways': {
    expect: colourEditors(201),
    run: async (c) => c.post(`/api/styles/${(await freshStyle()).id}/colourways`, { name: colourName('colourway') }),
  },
  'GET /api/styles/[id]/colourways/[colourwayId]': {
    // The seeded two-tone has an approved dip, so the client sees it too.
    expect: everyone(200),
    run: async (c, ctx) => {
      const list = (await (await as('admin')).get(`/api/styles/${ctx.sharedStyleId}/colourways`)).json;
      const cw = list.colourways.find((x: { name: string }) => x.name === 'Navy / Lichen');
      return c.get(`/api/styles/${ctx.sharedStyleId}/colourways/${cw.id}`);
    },
  },
  'PATCH /api/styles/[id]/colourways/[colourwayId]': {
    expect: colourEditors(200),
    run: async (c) => {
      const { styleId, colourway } = await freshColourway();
      return c.patch(`/api/styles/${styleId}/colourways/${colourway.id}`, { version: colourway.version, notes: 'Matrix note' });
    },
  },
  'DELETE /api/styles/[id]/colourways/[colourwayId]': {
    expect: colourEditors(200),
    run: async (c) => {
      const { styleId, colourway } = await freshColourway();
      return c.delete(`/api/styles/${styleId}/colourways/${colourway.id}`);
    },
  },
  'GET /api/styles/[id]/lab-dips': { expect: everyone(200), run: (c, ctx) => c.get(`/api/styles/${ctx.sharedStyleId}/lab-dips`) },
  'POST /api/styles/[id]/lab-dips': {
    expect: labDipSubmitters(201),
    run: async (c, ctx) => {
      const { targetId } = await sharedTarget(ctx.sharedStyleId);
      return c.post(`/api/styles/${ctx.sharedStyleId}/lab-dips`, { targetId, measured: { L: 30.2, a: 5.1, b: -19.8 }, comment: 'Matrix dip' });
    },
  },
  'GET /api/styles/[id]/lab-dips/[labDipId]': {
    // The seeded approved dip: the mill sent it, the client may read approved dips.
    expect: everyone(200),
    run: async (c, ctx) => {
      const dips = (await (await as('admin')).get(`/api/styles/${ctx.sharedStyleId}/lab-dips`)).json.labDips;
      const approved = dips.find((d: { status: string }) => d.status === 'approved');
      return c.get(`/api/styles/${ctx.sharedStyleId}/lab-dips/${approved.id}`);
    },
  },
  'PATCH /api/styles/[id]/lab-dips/[labDipId]': {
    expect: { anon: 401, admin: 200, designer: 403, 'colour-lead': 200, client: 403, mill: 403 },
    run: async (c, ctx) => {
      const dip = await freshLabDip(ctx.sharedStyleId);
      return c.patch(`/api/styles/${ctx.sharedStyleId}/lab-dips/${dip.id}`, { version: dip.version, decision: 'approved' });
    },
  },
  'GET /api/styles/[id]/fit': { expect: everyone(200), run: (c, ctx) => c.get(`/api/styles/${ctx.sharedStyleId}/fit`) },
  'PUT /api/styles/[id]/fit': {
    expect: editors(200),
    run: async (c) => {
      const s = await freshStyle();
      const fit = (await (await as('designer')).get(`/api/styles/${s.id}/fit`)).json.fit;
      const { baseSize, points, girths, cutAndSew, baseTextureId, compressionTextureId, cylinderDiametersIn, target } = fit.spec;
      return c.put(`/api/styles/${s.id}/fit`, { version: fit.version, baseSize, points, girths, cutAndSew, baseTextureId, compressionTextureId, cylinderDiametersIn, target });
    },
  },
  'GET /api/styles/[id]/fit/sheet': { expect: everyone(200), run: (c, ctx) => c.get(`/api/styles/${ctx.sharedStyleId}/fit/sheet`) },
  'PUT /api/styles/[id]/fit/equivalence': {
    expect: editors(200),
    run: async (c, ctx) => {
      const { studioFactor } = (await (await as('designer')).get(`/api/styles/${ctx.sharedStyleId}/fit`)).json.fit;
      const expected = studioFactor.isDefault ? null : studioFactor.factor;
      return c.put(`/api/styles/${ctx.sharedStyleId}/fit/equivalence`, { factor: 19 / 20.5, expected });
    },
  },
  'POST /api/styles/[id]/fit/rounds': {
    expect: editors(201),
    run: async (c) => {
      const s = await freshStyle();
      return c.post(`/api/styles/${s.id}/fit/rounds`, { version: s.version, kind: 'fit', size: 'M', measurements: { 'chest-half': 31 } });
    },
  },
  'PATCH /api/styles/[id]/fit/rounds/[roundId]': {
    expect: editors(200),
    run: async (c) => {
      const r = await freshRound();
      return c.patch(`/api/styles/${r.styleId}/fit/rounds/${r.roundId}`, { version: r.version, notes: 'Matrix note' });
    },
  },
  'DELETE /api/styles/[id]/fit/rounds/[roundId]': {
    expect: editors(200),
    run: async (c) => {
      const r = await freshRound();
      return c.delete(`/api/styles/${r.styleId}/fit/rounds/${r.roundId}?version=${r.version}`);
    },
  },
  'POST /api/styles/[id]/fit/rounds/[roundId]/photos': {
    expect: editors(201),
    run: async (c) => {
      const r = await freshRound();
      return postForm(c, `/api/styles/${r.styleId}/fit/rounds/${r.roundId}/photos`, roundPhotoForm());
    },
  },
  'DELETE /api/styles/[id]/fit/rounds/[roundId]/photos/[photoId]': {
    expect: editors(200),
    run: async (c) => {
      const p = await freshRoundPhoto();
      return c.delete(`/api/styles/${p.styleId}/fit/rounds/${p.roundId}/photos/${p.photoId}`);
    },
  },
  'POST /api/styles/[id]/fit/rounds/[roundId]/comments': {
    expect: editors(201),
    run: async (c) => {
      const r = await freshRound();
      return c.post(`/api/styles/${r.styleId}/fit/rounds/${r.roundId}/comments`, { version: r.version, body: 'Matrix comment' });
    },
  },
  'POST /api/styles/[id]/fit/rounds/[roundId]/corrections': {
    expect: editors(201),
    run: async (c) => {
      const r = await freshRound();
      return c.post(`/api/styles/${r.styleId}/fit/rounds/${r.roundId}/corrections`, { version: r.version, point: 'chest-half', size: 'M', toCm: 30, scope: 'size' });
    },
  },
  'PATCH /api/styles/[id]/fit/rounds/[roundId]/corrections/[correctionId]': {
    expect: editors(200),
    run: async (c) => {
      const k = await freshCorrection();
      return c.patch(`/api/styles/${k.styleId}/fit/rounds/${k.roundId}/corrections/${k.correctionId}`, { version: k.version, decision: 'accept' });
    },
  },
  // The brief and the quote: the brief for staff and the client reviewer (not the mill); costs for staff only.
  'GET /api/styles/[id]/brief': { expect: briefReaders(200), run: (c, ctx) => c.get(`/api/styles/${ctx.sharedStyleId}/brief`) },
  'PUT /api/styles/[id]/brief': {
    expect: editors(200),
    run: async (c) => c.put(`/api/styles/${(await freshStyle()).id}/brief`, { version: 0, answers: { sport: 'Trail running' } }),
  },
  'GET /api/styles/[id]/brief/checks': { expect: briefReaders(200), run: (c, ctx) => c.get(`/api/styles/${ctx.sharedStyleId}/brief/checks`) },
  'GET /api/styles/[id]/brief/references': { expect: briefReaders(200), run: (c, ctx) => c.get(`/api/styles/${ctx.sharedStyleId}/brief/references`) },
  'POST /api/styles/[id]/brief/references': {
    expect: editors(201),
    run: async (c) => postForm(c, `/api/styles/${(await freshStyle()).id}/brief/references`, referenceForm()),
  },
  'PUT /api/styles/[id]/brief/references/order': {
    expect: editors(200),
    run: async (c) => {
      const r = await freshReference();
      return c.put(`/api/styles/${r.styleId}/brief/references/order`, { ids: [r.refId] });
    },
  },
  'PATCH /api/styles/[id]/brief/references/[refId]': {
    expect: editors(200),
    run: async (c) => {
      const r = await freshReference();
      return c.patch(`/api/styles/${r.styleId}/brief/references/${r.refId}`, { caption: 'Matrix caption', tag: 'detail' });
    },
  },
  'DELETE /api/styles/[id]/brief/references/[refId]': {
    expect: editors(200),
    run: async (c) => {
      const r = await freshReference();
      return c.delete(`/api/styles/${r.styleId}/brief/references/${r.refId}`);
    },
  },
  'GET /api/styles/[id]/brief/references/[refId]/image': {
    expect: briefReaders(200),
    run: async (c, ctx) => {
      const r = await (sharedReference ??= freshReference(ctx.sharedStyleId));
      return c.get(`/api/styles/${r.styleId}/brief/references/${r.refId}/image`);
    },
  },
  'GET /api/styles/[id]/quote': { expect: staffOnly(200), run: (c, ctx) => c.get(`/api/styles/${ctx.sharedStyleId}/quote`) },
  'PUT /api/styles/[id]/quote': {
    expect: editors(200),
    run: async (c) => c.put(`/api/styles/${(await freshStyle()).id}/quote`, { version: 0, inputs: { feedersPerCourse: 1 } }),
  },
  'GET /api/styles/[id]/quote/export': { expect: staffOnly(200), run: (c, ctx) => c.get(`/api/styles/${ctx.sharedStyleId}/quote/export?format=csv`) },
  'GET /api/settings/costing': { expect: staffOnly(200), run: (c) => c.get('/api/settings/costing') },
  'PUT /api/settings/costing': { expect: editors(200), run: (c) => c.put('/api/settings/costing', { rates: { machineMinuteRate: 0.35 } }) },
  'GET /api/settings/machine-limits': { expect: staffOnly(200), run: (c) => c.get('/api/settings/machine-limits') },
  // Blank limits: the defaults stay, so the other tests' rule findings do not change.
  'PUT /api/settings/machine-limits': { expect: adminOnly(200), run: (c) => c.put('/api/settings/machine-limits', { limits: { maxFloatMm: null, maxTuckStack: null } }) },
};

function briefReaders(ok: number) {
  return { anon: 401, admin: ok, designer: ok, 'colour-lead': ok, client: ok, mill: 403 };
}

function referenceForm() {
  const form = new FormData();
  form.set('file', new Blob([tinyPng], { type: 'image/png' }), 'reference.png');
  form.set('caption', 'Matrix reference');
  form.set('tag', 'colour');
  return form;
}

/** A reference on a fresh style (or the given one), uploaded by the designer. */
async function freshReference(styleId?: string) {
  const designer = await as('designer');
  const id = styleId ?? (await freshStyle()).id;
  const res = await fetch(baseUrl() + `/api/styles/${id}/brief/references`, { method: 'POST', body: referenceForm(), headers: { cookie: designer.cookie } });
  const json = (await res.json()) as { reference: { id: string } };
  return { styleId: id, refId: json.reference.id };
}
let sharedReference: ReturnType<typeof freshReference> | null = null;

describe('authorization matrix', () => {
  const ctx = {} as Ctx;
  const clients = {} as Record<Caller, Client>;

  beforeAll(async () => {
    for (const c of callers) clients[c] = c === 'anon' ? anonymous() : await as(c);
    ctx.sharedStyleId = (await styleByCode('HF27-101')).id;
    const orgs = (await clients.admin.get('/api/organisations')).json.organisations;
    ctx.kestenholmId = orgs.find((o: { name: string }) => o.name === 'Kestenholm Outdoor').id;
    const m = await clients.admin.post('/api/members', {
      email: `throwaway-${Date.now()}@hollowfell.example`, name: 'Throwaway', role: 'designer', password: 'throwaway-123',
    });
    ctx.throwawayMemberId = m.json.member.id;
  });

  it('lists every route handler', () => {
    expect(Object.keys(matrix).sort()).toEqual(discoverRoutes().map((r) => r.key).sort());
  });

  for (const [key, entry] of Object.entries(matrix)) {
    it(key, async () => {
      const got: Record<string, number> = {};
      for (const caller of callers) got[caller] = (await entry.run(clients[caller], ctx, caller)).status;
      expect(got).toEqual(entry.expect);
    });
  }
});
