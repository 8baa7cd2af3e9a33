import { describe, expect, inject, it } from 'vitest';
import { PNG } from 'pngjs';
import { ListObjectsV2Command, S3Client } from '@aws-sdk/client-s3';
import { as, baseUrl, newStyleBody, styleByCode, type Client } from './helpers';

/** The body of a spec save from a GET answer, with changes. */
function specBody(fit: any, over: Record<string, unknown> = {}) {
  const { baseSize, points, girths, cutAndSew, baseTextureId, compressionTextureId, cylinderDiametersIn, target } = fit.spec;
  return { version: fit.version, baseSize, points, girths, cutAndSew, baseTextureId, compressionTextureId, cylinderDiametersIn, target, ...over };
}

const withPoint = (fit: any, point: string, change: Record<string, unknown>) =>
  fit.spec.points.map((p: any) => (p.point === point ? { ...p, ...change } : p));

async function freshFit() {
  const designer = await as('designer');
  const style = (await designer.post('/api/styles', newStyleBody())).json.style;
  const fit = (await designer.get(`/api/styles/${style.id}/fit`)).json.fit;
  return { designer, style, fit };
}

async function styleTextures(designer: any, name: string) {
  const lib = (await designer.get('/api/library/textures')).json.textures as { id: string; name: string }[];
  const t = lib.find((x) => x.name === name);
  if (!t) throw new Error(`no texture ${name}`);
  return t.id;
}

describe('fit API: the size spec', () => {
  it('the demo style has a graded spec, body girths, a cut-and-sew entry and a proto round', async () => {
    const designer = await as('designer');
    const s = await styleByCode('HF27-101');
    const res = await designer.get(`/api/styles/${s.id}/fit`);
    expect(res.status).toBe(200);
    const fit = res.json.fit;
    expect(fit.saved).toBe(true);
    expect(fit.sizes).toEqual(['XS', 'S', 'M', 'L', 'XL']);
    expect(fit.spec.baseSize).toBe('M');
    expect(fit.spec.points.find((p: any) => p.point === 'chest-half')).toMatchObject({ baseCm: 31, gradeCm: 2, toleranceCm: 1 });
    expect(fit.spec.points.find((p: any) => p.point === 'waist-half').overrides).toEqual({ XL: 36.5 });
    expect(fit.spec.girths.M).toEqual({ chest: 96, waist: 80, hip: 98 });
    expect(fit.spec.cutAndSew['chest-half']).toEqual({ M: 33.5 });
    expect(fit.textures.find((t: any) => t.id === fit.spec.compressionTextureId).forceExtension.length).toBeGreaterThan(0);
    expect(fit.rounds).toHaveLength(1);
    expect(fit.rounds[0]).toMatchObject({ roundNo: 1, kind: 'proto', size: 'M', receivedOn: '2027-02-18' });
    expect(fit.rounds[0].measurements.find((m: any) => m.point === 'chest-half')).toMatchObject({ measuredCm: 32.4, specCm: 31, toleranceCm: 1 });
    expect(fit.rounds[0].corrections[0]).toMatchObject({ point: 'armhole', status: 'proposed' });
  });

  it('a new style shows the garment defaults: points, common-practice grades and tolerances, no values', async () => {
    const { fit, style } = await freshFit();
    expect(fit.saved).toBe(false);
    expect(fit.version).toBe(style.version);
    expect(fit.spec.points.map((p: any) => p.point)).toEqual(['chest-half', 'waist-half', 'bottom-half', 'body-length-hps', 'sleeve-length', 'across-shoulder', 'armhole']);
    expect(fit.spec.points.every((p: any) => p.baseCm === null)).toBe(true);
    expect(fit.spec.target.level).toBe('moderate');
    expect(fit.studioFactor.factor).toBeGreaterThan(0.8);
  });

  it('PUT saves at the current version, raises it, grades on read, and writes a history entry', async () => {
    const { designer, style, fit } = await freshFit();
    const body = specBody(fit, {
      points: withPoint(fit, 'chest-half', { baseCm: 31, overrides: { L: 33.6 } }),
      girths: { M: { chest: 96 } },
      cutAndSew: { 'chest-half': { M: 33.5 } },
    });
    const res = await designer.put(`/api/styles/${style.id}/fit`, body);
    expect(res.status).toBe(200);
    expect(res.json.fit.version).toBe(fit.version + 1);
    expect(res.json.fit.saved).toBe(true);
    const again = (await designer.get(`/api/styles/${style.id}/fit`)).json.fit;
    expect(again.spec.points.find((p: any) => p.point === 'chest-half')).toMatchObject({ baseCm: 31, overrides: { L: 33.6 } });
    expect(again.spec.girths).toEqual({ M: { chest: 96 } });
    const sheet = (await designer.get(`/api/styles/${style.id}/fit/sheet`)).json.sheet;
    // No textures on a new style: no needles yet, and it says so.
    expect(sheet.notes.join(' ')).toMatch(/no texture/);
    const hist = (await designer.get(`/api/styles/${style.id}/history`)).json.entries;
    expect(hist[0].action).toBe('fit.spec.save');
    expect(hist[0].details.changedPoints).toEqual(['chest-half']);
  });

  it('a stale save gets 409 and changes nothing', async () => {
    const { designer, style, fit } = await freshFit();
    const first = await designer.put(`/api/styles/${style.id}/fit`, specBody(fit, { points: withPoint(fit, 'chest-half', { baseCm: 30 }) }));
    expect(first.status).toBe(200);
    const stale = await designer.put(`/api/styles/${style.id}/fit`, specBody(fit, { points: withPoint(fit, 'chest-half', { baseCm: 44 }) }));
    expect(stale.status).toBe(409);
    expect(stale.json.currentVersion).toBe(first.json.fit.version);
    const now = (await designer.get(`/api/styles/${style.id}/fit`)).json.fit;
    expect(now.spec.points.find((p: any) => p.point === 'chest-half').baseCm).toBe(30);
    expect(now.version).toBe(first.json.fit.version);
  });

  it('bad input gets 400 with field errors, never a 500, and saves nothing', async () => {
    const { designer, style, fit } = await freshFit();
    const put = (over: Record<string, unknown>) => designer.put(`/api/styles/${style.id}/fit`, specBody(fit, over));
    const notNumber = await put({ points: withPoint(fit, 'chest-half', { baseCm: 'wide', toleranceCm: -1 }) });
    expect(notNumber.status).toBe(400);
    expect(notNumber.json.fieldErrors['points.0.baseCm']).toEqual(['The base-size value must be a number']);
    expect(notNumber.json.fieldErrors['points.0.toleranceCm']).toEqual(['The tolerance cannot be negative']);
    const unknownPoint = await put({ points: [{ point: 'elbow', baseCm: 10, gradeCm: 0, toleranceCm: 1, overrides: {} }] });
    expect(unknownPoint.status).toBe(400);
    expect(unknownPoint.json.fieldErrors['points.0.point']).toEqual(['Not a point of measure']);
    const badSize = await put({ baseSize: 'XXXL' });
    expect(badSize.status).toBe(400);
    expect(badSize.json.fieldErrors.baseSize[0]).toMatch(/not one of the style sizes/);
    const badOverride = await put({ points: withPoint(fit, 'chest-half', { baseCm: 30, overrides: { XXXL: 40 } }) });
    expect(badOverride.status).toBe(400);
    expect(Object.keys(badOverride.json.fieldErrors)).toEqual(['points.0.overrides.XXXL']);
    const band = await put({ target: { level: 'firm', bands: { ...fit.spec.target.bands, firm: { minMmHg: 30, maxMmHg: 20 } } } });
    expect(band.status).toBe(400);
    expect(band.json.fieldErrors['target.bands.firm.maxMmHg']).toEqual(['The upper limit must be above the lower one']);
    expect((await put({ cylinderDiametersIn: [] })).json.fieldErrors.cylinderDiametersIn).toEqual(['Name at least one cylinder']);
    expect((await put({ cutAndSew: { inseam: { M: 70 } } })).json.fieldErrors['cutAndSew.inseam']).toEqual(['Only half-widths convert between cut-and-sew and seamless']);
    expect((await put({ version: undefined })).json.fieldErrors.version).toBeDefined();
    expect((await put({ extra: 1 })).status).toBe(400);
    expect((await designer.request('PUT', `/api/styles/${style.id}/fit`, '{"version":', { 'content-type': 'application/json' })).status).toBe(400);
    expect((await designer.get(`/api/styles/${style.id}/fit`)).json.fit.saved).toBe(false);
  });

  it('textures must be the style own; the compression one needs a force–extension test', async () => {
    const designer = await as('designer');
    const s = await styleByCode('HF27-103');
    const fit = (await designer.get(`/api/styles/${s.id}/fit`)).json.fit;
    const notOfStyle = await styleTextures(designer, 'Eyelet ventilation mesh');
    const res = await designer.put(`/api/styles/${s.id}/fit`, specBody(fit, { baseTextureId: notOfStyle }));
    expect(res.status).toBe(400);
    expect(res.json.fieldErrors.baseTextureId).toEqual(['Not one of the style textures']);
    const pique = fit.textures.find((t: any) => t.name === 'Piqué support').id;
    const noCurve = await designer.put(`/api/styles/${s.id}/fit`, specBody(fit, { compressionTextureId: pique }));
    expect(noCurve.status).toBe(400);
    expect(noCurve.json.fieldErrors.compressionTextureId[0]).toMatch(/no force–extension test/);
  });
});

describe('fit API: the sheet (needles, cylinder, compression)', () => {
  it('gives the demo top its cylinder per size, needle counts and a compression finding', async () => {
    const mill = await as('mill');
    const s = await styleByCode('HF27-101');
    const res = await mill.get(`/api/styles/${s.id}/fit/sheet`);
    expect(res.status).toBe(200);
    const sheet = res.json.sheet;
    expect(sheet.baseTexture.walesPerCm).toBe(21);
    const m = sheet.seamless.find((r: any) => r.size === 'M');
    // 31 cm × 21 wales/cm = 651 needles across; 15″ × E28 = 1320 needles → 31.43 cm relaxed.
    expect(m.cylinder).toMatchObject({ diameterIn: 15, needles: 1320 });
    expect(m.points.find((p: any) => p.point === 'chest-half').needlesAcrossHalfWidth).toBe(651);
    const xl = sheet.compression.find((r: any) => r.size === 'XL');
    const waist = xl.girths.find((g: any) => g.girth === 'waist');
    expect(waist.status).toBe('below');
    expect(waist.finding.advice).toMatch(/^Reduce the waist half-width of size XL by/);
    expect(sheet.caution).toMatch(/not a medical rating/);
  });
});

describe('fit API: sample rounds and corrections', () => {
  it('records a round against the spec, comments, proposes and accepts a correction that updates the spec', async () => {
    const { designer, style, fit } = await freshFit();
    const saved = (await designer.put(`/api/styles/${style.id}/fit`, specBody(fit, { points: withPoint(fit, 'chest-half', { baseCm: 31, gradeCm: 2 }) }))).json.fit;
    const created = await designer.post(`/api/styles/${style.id}/fit/rounds`, {
      version: saved.version, kind: 'fit', size: 'L', receivedOn: '2027-03-01', measurements: { 'chest-half': 34.6 },
    });
    expect(created.status).toBe(201);
    expect(created.json.round).toMatchObject({ roundNo: 1, kind: 'fit', size: 'L', measurements: [{ point: 'chest-half', measuredCm: 34.6, specCm: 33, toleranceCm: 1 }] });
    const roundId = created.json.round.id;
    const commented = await designer.post(`/api/styles/${style.id}/fit/rounds/${roundId}/comments`, { version: created.json.fit.version, body: 'Wide at the chest.' });
    expect(commented.status).toBe(201);
    expect(commented.json.fit.rounds[0].comments[0]).toMatchObject({ body: 'Wide at the chest.', userName: 'Tamsin Orlo' });
    const proposed = await designer.post(`/api/styles/${style.id}/fit/rounds/${roundId}/corrections`, {
      version: commented.json.fit.version, point: 'chest-half', size: 'L', toCm: 32.5, scope: 'point', reason: 'Tighter fit on the body.',
    });
    expect(proposed.status).toBe(201);
    const correction = proposed.json.fit.rounds[0].corrections[0];
    expect(correction).toMatchObject({ status: 'proposed', fromCm: 33, toCm: 32.5 });
    // Proposing changes nothing in the spec.
    expect(proposed.json.fit.spec.points.find((p: any) => p.point === 'chest-half').baseCm).toBe(31);

    const path = `/api/styles/${style.id}/fit/rounds/${roundId}/corrections/${correction.id}`;
    const staleAccept = await designer.patch(path, { version: commented.json.fit.version, decision: 'accept' });
    expect(staleAccept.status).toBe(409);
    const accepted = await designer.patch(path, { version: proposed.json.fit.version, decision: 'accept' });
    expect(accepted.status).toBe(200);
    // The whole point moves by −0.5 cm: base M 31 → 30.5.
    expect(accepted.json.fit.spec.points.find((p: any) => p.point === 'chest-half').baseCm).toBeCloseTo(30.5, 9);
    expect(accepted.json.fit.rounds[0].corrections[0]).toMatchObject({ status: 'accepted', decidedBy: 'Tamsin Orlo' });
    // The round keeps the spec it was measured against.
    expect(accepted.json.fit.rounds[0].measurements[0].specCm).toBe(33);
    const again = await designer.patch(path, { version: accepted.json.fit.version, decision: 'reject' });
    expect(again.status).toBe(409);
    const hist = (await designer.get(`/api/styles/${style.id}/history`)).json.entries;
    expect(hist[0]).toMatchObject({ action: 'fit.correction.accept', details: { point: 'chest-half', size: 'L', fromCm: 33, toCm: 32.5, scope: 'point' } });
  });

  it('edits a round: new points take the spec of today, measured ones keep theirs', async () => {
    const { designer, style, fit } = await freshFit();
    const saved = (await designer.put(`/api/styles/${style.id}/fit`, specBody(fit, {
      points: fit.spec.points.map((p: any) => ({ ...p, baseCm: p.point === 'chest-half' ? 31 : p.point === 'waist-half' ? 27 : null })),
    }))).json.fit;
    const created = (await designer.post(`/api/styles/${style.id}/fit/rounds`, { version: saved.version, kind: 'proto', size: 'M', measurements: { 'chest-half': 31.5 } })).json;
    const patched = await designer.patch(`/api/styles/${style.id}/fit/rounds/${created.round.id}`, {
      version: created.fit.version, notes: 'Measured again after washing.', measurements: { 'chest-half': 31.8, 'waist-half': 27.2 },
    });
    expect(patched.status).toBe(200);
    const r = patched.json.fit.rounds[0];
    expect(r.notes).toBe('Measured again after washing.');
    expect(r.measurements).toEqual([
      { point: 'chest-half', measuredCm: 31.8, specCm: 31, toleranceCm: 1 },
      { point: 'waist-half', measuredCm: 27.2, specCm: 27, toleranceCm: 1 },
    ]);
  });

  it('bad round input gets 400 with field errors; a stale round gets 409', async () => {
    const { designer, style, fit } = await freshFit();
    const post = (body: Record<string, unknown>) => designer.post(`/api/styles/${style.id}/fit/rounds`, { version: fit.version, kind: 'proto', size: 'M', ...body });
    const bad = await post({ kind: 'final', receivedOn: '2027-02-30', measurements: { 'chest-half': -3 } });
    expect(bad.status).toBe(400);
    expect(bad.json.fieldErrors).toMatchObject({
      kind: ['Choose proto, fit or pre-production'],
      receivedOn: ['A date like 2027-03-14'],
      'measurements.chest-half': ['The measured value must be above zero'],
    });
    const size = await post({ size: 'XXXL' });
    expect(size.status).toBe(400);
    expect(size.json.fieldErrors.size[0]).toMatch(/not one of the style sizes/);
    expect((await post({})).status).toBe(201);
    const stale = await post({});
    expect(stale.status).toBe(409);
    const now = (await designer.get(`/api/styles/${style.id}/fit`)).json.fit;
    expect(now.rounds).toHaveLength(1);
    const round = now.rounds[0];
    const noBody = await designer.post(`/api/styles/${style.id}/fit/rounds/${round.id}/comments`, { version: now.version, body: '   ' });
    expect(noBody.json.fieldErrors.body).toEqual(['Write a comment']);
    const movePoint = await designer.post(`/api/styles/${style.id}/fit/rounds/${round.id}/corrections`, { version: now.version, point: 'chest-half', size: 'M', toCm: 30, scope: 'point' });
    expect(movePoint.status).toBe(400);
    expect(movePoint.json.fieldErrors.scope[0]).toMatch(/no value here to move from/);
    expect((await designer.patch(`/api/styles/${style.id}/fit/rounds/${crypto.randomUUID()}`, { version: now.version, notes: 'x' })).status).toBe(404);
  });
});

describe('fit API: the studio factor', () => {
  it('sets the studio factor when the one you saw is current; otherwise 409', async () => {
    const designer = await as('designer');
    const s = await styleByCode('HF27-101');
    const before = (await designer.get(`/api/styles/${s.id}/fit`)).json.fit.studioFactor;
    const expected = before.isDefault ? null : before.factor;
    const set = await designer.put(`/api/styles/${s.id}/fit/equivalence`, { factor: 0.93, expected });
    expect(set.status).toBe(200);
    expect(set.json.studioFactor).toEqual({ factor: 0.93, isDefault: false });
    const stale = await designer.put(`/api/styles/${s.id}/fit/equivalence`, { factor: 0.9, expected });
    expect(stale.status).toBe(409);
    const bad = await designer.put(`/api/styles/${s.id}/fit/equivalence`, { factor: 3, expected: 0.93 });
    expect(bad.json.fieldErrors.factor).toEqual(['A factor above 1.2 is not realistic']);
    // Back to the common-practice value, 19 / 20.5.
    expect((await designer.put(`/api/styles/${s.id}/fit/equivalence`, { factor: 19 / 20.5, expected: 0.93 })).status).toBe(200);
    const hist = (await designer.get(`/api/styles/${s.id}/history`)).json.entries;
    expect(hist[0]).toMatchObject({ action: 'fit.factor', details: { from: 0.93 } });
  });
});

describe('fit API: roles and isolation', () => {
  it('colour lead, client and mill read a shared style fit but may not write it', async () => {
    const s = await styleByCode('HF27-101');
    for (const who of ['colour-lead', 'client', 'mill'] as const) {
      const c = await as(who);
      const res = await c.get(`/api/styles/${s.id}/fit`);
      expect(res.status).toBe(200);
      const fit = res.json.fit;
      expect((await c.put(`/api/styles/${s.id}/fit`, specBody(fit))).status).toBe(403);
      expect((await c.post(`/api/styles/${s.id}/fit/rounds`, { version: fit.version, kind: 'proto', size: 'M' })).status).toBe(403);
      const round = fit.rounds[0];
      const correction = round.corrections[0];
      expect((await c.patch(`/api/styles/${s.id}/fit/rounds/${round.id}/corrections/${correction.id}`, { version: fit.version, decision: 'accept' })).status).toBe(403);
    }
    // HF27-103 is not shared with the mill.
    const notShared = await styleByCode('HF27-103');
    expect((await (await as('mill')).get(`/api/styles/${notShared.id}/fit`)).status).toBe(404);
    expect((await (await as('mill')).get(`/api/styles/${notShared.id}/fit/sheet`)).status).toBe(404);
  });

  it('another studio sees nothing: admin@oxbow.example gets 404 everywhere', async () => {
    const other = await as('otherStudioAdmin');
    const s = await styleByCode('HF27-101');
    const fit = (await (await as('designer')).get(`/api/styles/${s.id}/fit`)).json.fit;
    const round = fit.rounds[0];
    expect((await other.get(`/api/styles/${s.id}/fit`)).status).toBe(404);
    expect((await other.get(`/api/styles/${s.id}/fit/sheet`)).status).toBe(404);
    expect((await other.put(`/api/styles/${s.id}/fit`, specBody(fit))).status).toBe(404);
    expect((await other.put(`/api/styles/${s.id}/fit/equivalence`, { factor: 0.9, expected: null })).status).toBe(404);
    expect((await other.post(`/api/styles/${s.id}/fit/rounds`, { version: fit.version, kind: 'proto', size: 'M' })).status).toBe(404);
    expect((await other.post(`/api/styles/${s.id}/fit/rounds/${round.id}/comments`, { version: fit.version, body: 'x' })).status).toBe(404);
    expect((await other.patch(`/api/styles/${s.id}/fit/rounds/${round.id}/corrections/${round.corrections[0].id}`, { version: fit.version, decision: 'accept' })).status).toBe(404);
    const after = (await (await as('designer')).get(`/api/styles/${s.id}/fit`)).json.fit;
    expect(after.version).toBe(fit.version);
  });
});

// ---------------------------------------------------------------------------------------------
// Round photos and deleting a round

function pngBytes(w = 6, h = 4, grey = 180): Buffer {
  const p = new PNG({ width: w, height: h });
  p.data.fill(grey);
  return PNG.sync.write(p);
}

async function postPhoto(c: Client, styleId: string, roundId: string, bytes: Uint8Array | null, name = 'front.png', type = 'image/png') {
  const form = new FormData();
  if (bytes) form.set('photo', new Blob([Buffer.from(bytes)], { type }), name);
  const res = await fetch(`${baseUrl()}/api/styles/${styleId}/fit/rounds/${roundId}/photos`, { method: 'POST', body: form, headers: { cookie: c.cookie } });
  const text = await res.text();
  return { status: res.status, json: text ? JSON.parse(text) : null };
}

async function download(c: Client, url: string) {
  const res = await fetch(baseUrl() + url, { headers: { cookie: c.cookie } });
  return { status: res.status, type: res.headers.get('content-type'), bytes: Buffer.from(await res.arrayBuffer()) };
}

/** Object keys of a style's round photos in the S3 fake. */
async function photoObjects(styleId: string): Promise<string[]> {
  const s3 = new S3Client({
    region: 'us-east-1', endpoint: inject('s3Endpoint'), forcePathStyle: true, credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' },
  });
  const out = await s3.send(new ListObjectsV2Command({ Bucket: inject('s3Bucket') }));
  return (out.Contents ?? []).map((o) => o.Key!).filter((k) => k.includes(`/${styleId}/sample-round-photo/`));
}

/** A fresh style shared with the demo mill, with one round recorded. */
async function sharedRound() {
  const { designer, style } = await freshFit();
  const orgs = (await (await as('admin')).get('/api/organisations')).json.organisations as { id: string; name: string }[];
  const quellmoor = orgs.find((o) => o.name === 'Quellmoor Knitworks')!.id;
  expect((await designer.post(`/api/styles/${style.id}/shares`, { organisationId: quellmoor })).status).toBe(201);
  const now = (await designer.get(`/api/styles/${style.id}/fit`)).json.fit;
  const created = await designer.post(`/api/styles/${style.id}/fit/rounds`, { version: now.version, kind: 'fit', size: 'M', measurements: { 'chest-half': 31.2 } });
  expect(created.status).toBe(201);
  return { designer, styleId: style.id as string, roundId: created.json.round.id as string, version: created.json.fit.version as number };
}

describe('fit API: round photos', () => {
  it('attaches photos to a round: listed on it, read by the studio and the mill it is shared with, 404 for the rest', async () => {
    const { designer, styleId, roundId, version } = await sharedRound();
    const first = await postPhoto(designer, styleId, roundId, pngBytes(), 'front on form.png');
    expect(first.status).toBe(201);
    expect(first.json.photo).toMatchObject({ name: 'front on form.png', contentType: 'image/png', widthPx: 6, heightPx: 4, uploadedBy: 'Tamsin Orlo' });
    expect(first.json.photo.url).toBe(`/api/files/${first.json.photo.fileId}`);
    // A photo carries no version but raises it, so a round deletion on an older view is refused.
    expect(first.json.fit.version).toBe(version + 1);
    const second = await postPhoto(designer, styleId, roundId, pngBytes(4, 8, 90), 'side seam.png');
    expect(second.status).toBe(201);
    const round = (await designer.get(`/api/styles/${styleId}/fit`)).json.fit.rounds[0];
    expect(round.photos.map((p: any) => p.name)).toEqual(['front on form.png', 'side seam.png']);

    const got = await download(designer, first.json.photo.url);
    expect(got.status).toBe(200);
    expect(got.type).toBe('image/png');
    expect(got.bytes.equals(pngBytes())).toBe(true);
    expect((await download(await as('colour-lead'), first.json.photo.url)).status).toBe(200);
    // The mill reads the rounds of a style shared with it, photos included.
    const mill = await as('mill');
    expect((await mill.get(`/api/styles/${styleId}/fit`)).json.fit.rounds[0].photos).toHaveLength(2);
    expect((await download(mill, first.json.photo.url)).status).toBe(200);
    // Not shared with the client; another studio sees nothing.
    expect((await download(await as('client'), first.json.photo.url)).status).toBe(404);
    expect((await download(await as('otherStudioAdmin'), first.json.photo.url)).status).toBe(404);
    // Round photos are not style attachments.
    expect((await designer.get(`/api/styles/${styleId}/files`)).json.files).toEqual([]);

    const hist = (await designer.get(`/api/styles/${styleId}/history`)).json.entries;
    expect(hist[0]).toMatchObject({ action: 'fit.round.photo.add', details: { roundNo: 1, name: 'side seam.png', widthPx: 4, heightPx: 8 } });
    expect(await photoObjects(styleId)).toHaveLength(2);
  });

  it('refuses what is not a photo whatever its name (415), a missing file (400) and an unknown round (404); nothing is stored', async () => {
    const { designer, styleId, roundId, version } = await sharedRound();
    const text = await postPhoto(designer, styleId, roundId, Buffer.from('measured flat, relaxed 24 h'), 'sample.jpg', 'image/jpeg');
    expect(text.status).toBe(415);
    expect(text.json.fieldErrors.photo[0]).toMatch(/its content was checked, not its name/);
    const pdf = await postPhoto(designer, styleId, roundId, Buffer.from('%PDF-1.4\n1 0 obj <<>> endobj\ntrailer <<>>\n%%EOF\n'), 'front.png');
    expect(pdf.status).toBe(415);
    const svg = await postPhoto(designer, styleId, roundId, Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><rect width="2" height="2"/></svg>'), 'back.webp', 'image/webp');
    expect(svg.status).toBe(415);
    const cut = pngBytes(40, 40);
    expect((await postPhoto(designer, styleId, roundId, cut.subarray(0, cut.length - 20), 'cut.png')).status).toBe(400);
    const none = await postPhoto(designer, styleId, roundId, null);
    expect(none.status).toBe(400);
    expect(none.json.fieldErrors.photo).toEqual(['Choose a file to upload']);
    expect((await postPhoto(designer, styleId, crypto.randomUUID(), pngBytes())).status).toBe(404);
    const fit = (await designer.get(`/api/styles/${styleId}/fit`)).json.fit;
    expect(fit.rounds[0].photos).toEqual([]);
    expect(fit.version).toBe(version);
    expect(await photoObjects(styleId)).toEqual([]);
  });

  it('removes a photo: gone from the round, from the store and from downloads, with a history entry', async () => {
    const { designer, styleId, roundId } = await sharedRound();
    const { photo } = (await postPhoto(designer, styleId, roundId, pngBytes(), 'twist.png')).json;
    const res = await designer.delete(`/api/styles/${styleId}/fit/rounds/${roundId}/photos/${photo.id}`);
    expect(res.status).toBe(200);
    expect(res.json.fit.rounds[0].photos).toEqual([]);
    expect((await download(designer, photo.url)).status).toBe(404);
    expect(await photoObjects(styleId)).toEqual([]);
    expect((await designer.delete(`/api/styles/${styleId}/fit/rounds/${roundId}/photos/${photo.id}`)).status).toBe(404);
    const hist = (await designer.get(`/api/styles/${styleId}/history`)).json.entries;
    expect(hist[0]).toMatchObject({ action: 'fit.round.photo.remove', details: { roundNo: 1, name: 'twist.png' } });
  });

  it('only those who record rounds attach or remove photos; another studio gets 404 and changes nothing', async () => {
    const { designer, styleId, roundId } = await sharedRound();
    const { photo } = (await postPhoto(designer, styleId, roundId, pngBytes())).json;
    for (const who of ['colour-lead', 'mill'] as const) {
      const c = await as(who);
      expect((await postPhoto(c, styleId, roundId, pngBytes())).status).toBe(403);
      expect((await c.delete(`/api/styles/${styleId}/fit/rounds/${roundId}/photos/${photo.id}`)).status).toBe(403);
    }
    const other = await as('otherStudioAdmin');
    expect((await postPhoto(other, styleId, roundId, pngBytes())).status).toBe(404);
    expect((await other.delete(`/api/styles/${styleId}/fit/rounds/${roundId}/photos/${photo.id}`)).status).toBe(404);
    expect((await designer.get(`/api/styles/${styleId}/fit`)).json.fit.rounds[0].photos).toHaveLength(1);
  });
});

describe('fit API: deleting a round', () => {
  it('deletes a round with its photos, comments and corrections; the accepted correction stays in the spec; recorded in history', async () => {
    const { designer, style, fit } = await freshFit();
    const saved = (await designer.put(`/api/styles/${style.id}/fit`, specBody(fit, { points: withPoint(fit, 'chest-half', { baseCm: 31, gradeCm: 2 }) }))).json.fit;
    const created = (await designer.post(`/api/styles/${style.id}/fit/rounds`, { version: saved.version, kind: 'proto', size: 'M', measurements: { 'chest-half': 32.4, 'waist-half': 27 } })).json;
    const roundId = created.round.id;
    const { photo, fit: withPhoto } = (await postPhoto(designer, style.id, roundId, pngBytes(), 'front.png')).json;
    let doc = (await designer.post(`/api/styles/${style.id}/fit/rounds/${roundId}/comments`, { version: withPhoto.version, body: 'Wide at the chest.' })).json.fit;
    doc = (await designer.post(`/api/styles/${style.id}/fit/rounds/${roundId}/corrections`, { version: doc.version, point: 'chest-half', size: 'M', toCm: 30.5, scope: 'point' })).json.fit;
    doc = (await designer.patch(`/api/styles/${style.id}/fit/rounds/${roundId}/corrections/${doc.rounds[0].corrections[0].id}`, { version: doc.version, decision: 'accept' })).json.fit;
    doc = (await designer.post(`/api/styles/${style.id}/fit/rounds/${roundId}/corrections`, { version: doc.version, point: 'waist-half', size: 'M', toCm: 26.5, scope: 'size' })).json.fit;
    expect(doc.spec.points.find((p: any) => p.point === 'chest-half').baseCm).toBe(30.5);
    const path = `/api/styles/${style.id}/fit/rounds/${roundId}`;

    const stale = await designer.delete(`${path}?version=${doc.version - 1}`);
    expect(stale.status).toBe(409);
    expect(stale.json.currentVersion).toBe(doc.version);
    expect((await designer.get(`/api/styles/${style.id}/fit`)).json.fit.rounds).toHaveLength(1);
    const noVersion = await designer.delete(path);
    expect(noVersion.status).toBe(400);
    expect(noVersion.json.fieldErrors.version).toEqual(['The version you edited is required']);
    expect((await (await as('otherStudioAdmin')).delete(`${path}?version=${doc.version}`)).status).toBe(404);
    expect((await (await as('colour-lead')).delete(`${path}?version=${doc.version}`)).status).toBe(403);

    const res = await designer.delete(`${path}?version=${doc.version}`);
    expect(res.status).toBe(200);
    expect(res.json.fit.version).toBe(doc.version + 1);
    expect(res.json.fit.rounds).toEqual([]);
    // The spec keeps the change the accepted correction made.
    expect(res.json.fit.spec.points.find((p: any) => p.point === 'chest-half').baseCm).toBe(30.5);
    expect((await download(designer, photo.url)).status).toBe(404);
    expect(await photoObjects(style.id)).toEqual([]);
    expect((await designer.delete(`${path}?version=${res.json.fit.version}`)).status).toBe(404);

    const hist = (await designer.get(`/api/styles/${style.id}/history`)).json.entries;
    expect(hist[0]).toMatchObject({
      action: 'fit.round.delete',
      details: { roundNo: 1, kind: 'proto', size: 'M', measured: 2, comments: 1, photos: 1, corrections: { accepted: 1, proposed: 1, rejected: 0 } },
    });
    // The correction's own entry stays in the history beside it.
    expect(hist.some((e: any) => e.action === 'fit.correction.accept' && e.details.point === 'chest-half')).toBe(true);
  });
});
