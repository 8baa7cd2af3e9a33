/**
 * The mill round against the running app and its fakes: release (frozen snapshot, status, history,
 * e-mail read from the SMTP fake), client review, exports read back, the server-built mill pack,
 * uploads against the S3 fake (accepted, too large, wrong type, SVG with script, failures halfway),
 * and test knits with deviation flags and decisions.
 */
import http from 'node:http';
import { readdir, readFile } from 'node:fs/promises';
import path from 'node:path';
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { PNG } from 'pngjs';
import { ListObjectsV2Command, S3Client } from '@aws-sdk/client-s3';
import { as, baseUrl, newStyleBody, type Client } from './helpers';
import { readPdf } from '../support/pdf-reader';
import { readPhys } from '@/lib/mill/png';

const mailDir = () => inject('mailDir');

interface Caught { id: string; to: string[]; subject: string; text: string }

async function caughtMail(): Promise<Caught[]> {
  const names = (await readdir(mailDir()).catch(() => [] as string[])).filter((n) => n.endsWith('.json'));
  return Promise.all(names.map(async (n) => JSON.parse(await readFile(path.join(mailDir(), n), 'utf8')) as Caught));
}

async function waitForMail(match: (m: Caught) => boolean, ms = 10_000): Promise<Caught> {
  const end = Date.now() + ms;
  while (Date.now() < end) {
    const hit = (await caughtMail()).find(match);
    if (hit) return hit;
    await new Promise((r) => setTimeout(r, 150));
  }
  throw new Error('No such e-mail reached the SMTP fake');
}

async function bucketKeys(): Promise<string[]> {
  const s3 = new S3Client({
    region: 'us-east-1', endpoint: inject('s3Endpoint'), forcePathStyle: true, credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' },
  });
  const out = await s3.send(new ListObjectsV2Command({ Bucket: inject('s3Bucket') }));
  return (out.Contents ?? []).map((o) => o.Key!);
}

function pngBytes(w = 6, h = 4): Buffer {
  const p = new PNG({ width: w, height: h });
  p.data.fill(180);
  return PNG.sync.write(p);
}

async function postForm(c: Client, url: string, fields: Record<string, string | { bytes: Uint8Array; name: string; type: string }>) {
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) {
    if (typeof v === 'string') form.set(k, v);
    else form.set(k, new Blob([Buffer.from(v.bytes)], { type: v.type }), v.name);
  }
  const res = await fetch(baseUrl() + url, { method: 'POST', body: form, headers: { cookie: c.cookie } });
  return { status: res.status, json: (await res.json().catch(() => null)) as any };
}

async function getBytes(c: Client, url: string) {
  const res = await fetch(baseUrl() + url, { headers: { cookie: c.cookie } });
  return { status: res.status, headers: res.headers, bytes: new Uint8Array(await res.arrayBuffer()) };
}

let orgs: { quellmoor: string; brannock: string; varrow: string };
let textureIds: string[];

async function releasableStyle(designer: Client, textures = textureIds.slice(0, 3)) {
  const s = (await designer.post('/api/styles', newStyleBody())).json.style as { id: string; version: number };
  const put = await designer.put(`/api/styles/${s.id}/textures`, { version: s.version, textureIds: textures });
  expect(put.status).toBe(200);
  return { id: s.id, version: put.json.version as number };
}

beforeAll(async () => {
  const admin = await as('admin');
  const list = (await admin.get('/api/organisations')).json.organisations as { id: string; name: string }[];
  const id = (n: string) => list.find((o) => o.name === n)!.id;
  orgs = { quellmoor: id('Quellmoor Knitworks'), brannock: id('Brannock Flat Knitting'), varrow: id('Varrow Sport') };
  const lib = (await admin.get('/api/library/textures')).json.textures as { id: string; name: string }[];
  textureIds = ['Plain plated jersey', '2×1 mock rib compression', 'Eyelet ventilation mesh'].map((n) => lib.find((t) => t.name === n)!.id);
});

describe('release to mills', () => {
  it('freezes the revision, changes the status, writes the history and e-mails the mill a link', async () => {
    const designer = await as('designer');
    const s = await releasableStyle(designer);
    const res = await designer.post(`/api/styles/${s.id}/releases`, { version: s.version, millIds: [orgs.quellmoor], note: 'Knit the mesh first.' });
    expect(res.status).toBe(201);
    const release = res.json.release;
    expect(release.revision).toBe(1);
    expect(res.json.mail.sent).toEqual(expect.arrayContaining(['programming@quellmoor.example', 'mill@quellmoor.example']));
    const style = (await designer.get(`/api/styles/${s.id}`)).json.style;
    expect(style.status).toBe('released');
    const history = (await designer.get(`/api/styles/${s.id}/history`)).json;
    expect(JSON.stringify(history)).toContain('style.release');

    const mail = await waitForMail((m) => m.to.includes('programming@quellmoor.example') && m.text.includes(`/releases/${release.id}`));
    expect(mail.subject).toContain('revision 1 released to Quellmoor Knitworks');
    expect(mail.text).toContain(`${baseUrl()}/releases/${release.id}`);
    expect(mail.text).toContain('Knit the mesh first.');

    // The mill reads it; the other studio does not.
    const mill = await as('mill');
    const seen = await mill.get(`/api/releases/${release.id}`);
    expect(seen.status).toBe(200);
    expect(seen.json.release.snapshot.textures).toHaveLength(3);
    expect((await (await as('otherStudioAdmin')).get(`/api/releases/${release.id}`)).status).toBe(404);

    // Later edits do not change what was released; releasing again raises the revision.
    const now = (await designer.get(`/api/styles/${s.id}`)).json.style;
    const put = await designer.put(`/api/styles/${s.id}/textures`, { version: now.version, textureIds: textureIds.slice(0, 1) });
    expect(put.status).toBe(200);
    const again = await mill.get(`/api/releases/${release.id}`);
    expect(again.json.release.snapshot.textures).toHaveLength(3);
    const second = await designer.post(`/api/styles/${s.id}/releases`, { version: put.json.version, millIds: [orgs.quellmoor] });
    expect(second.status).toBe(201);
    expect(second.json.release.revision).toBe(2);
    expect((await mill.get(`/api/releases/${second.json.release.id}`)).json.release.snapshot.textures).toHaveLength(1);
  });

  it('answers bad input with field errors and a stale version with 409, saving nothing', async () => {
    const designer = await as('designer');
    const s = await releasableStyle(designer);
    const bad = await designer.post(`/api/styles/${s.id}/releases`, { version: s.version, millIds: [] });
    expect(bad.status).toBe(400);
    expect(bad.json.fieldErrors.millIds).toBeDefined();
    const notMill = await designer.post(`/api/styles/${s.id}/releases`, { version: s.version, millIds: [orgs.varrow] });
    expect(notMill.status).toBe(400);
    expect(notMill.json.fieldErrors['millIds.0']).toEqual(['Not a mill of the studio']);
    expect((await designer.post(`/api/styles/${s.id}/releases`, { version: s.version - 1, millIds: [orgs.quellmoor] })).status).toBe(409);
    expect((await designer.post(`/api/styles/${s.id}/releases`, 'not json')).status).toBe(400);
    expect((await designer.get(`/api/styles/${s.id}/releases`)).json.releases).toHaveLength(0);
    expect((await designer.get(`/api/styles/${s.id}`)).json.style.status).not.toBe('released');
  });
});

describe('client review', () => {
  it('lets the client asked see, comment and decide, and tells the designer', async () => {
    const designer = await as('designer');
    const client = await as('client');
    const s = await releasableStyle(designer);
    const rel = (await designer.post(`/api/styles/${s.id}/releases`, { version: s.version, millIds: [orgs.quellmoor] })).json.release;
    expect((await client.get(`/api/releases/${rel.id}`)).status).toBe(404);
    const ask = await designer.post(`/api/releases/${rel.id}/reviews`, { clientId: orgs.varrow });
    expect(ask.status).toBe(201);
    await waitForMail((m) => m.to.includes('client@varrow.example') && m.text.includes(`/releases/${rel.id}`));
    expect((await client.get(`/api/releases/${rel.id}`)).status).toBe(200);
    expect((await client.post(`/api/releases/${rel.id}/comments`, { body: '' })).status).toBe(400);
    expect((await client.post(`/api/releases/${rel.id}/comments`, { body: 'Can the vent go lower?' })).status).toBe(201);
    const noReason = await client.post(`/api/releases/${rel.id}/decision`, { decision: 'changes-requested' });
    expect(noReason.status).toBe(400);
    expect(noReason.json.fieldErrors.comment).toBeDefined();
    const ok = await client.post(`/api/releases/${rel.id}/decision`, { decision: 'approved', comment: 'Good to knit.' });
    expect(ok.status).toBe(200);
    expect(ok.json.release.reviews[0].status).toBe('approved');
    await waitForMail((m) => m.to.includes('designer@hollowfell.example') && m.subject.includes('approved'));
    expect((await (await as('mill')).post(`/api/releases/${rel.id}/decision`, { decision: 'approved' })).status).toBe(403);
  });
});

describe('exports of a release', () => {
  let styleId: string;
  let releaseId: string;
  beforeAll(async () => {
    const designer = await as('designer');
    const s = await releasableStyle(designer);
    styleId = s.id;
    releaseId = (await designer.post(`/api/styles/${s.id}/releases`, { version: s.version, millIds: [orgs.quellmoor] })).json.release.id;
  });

  it('prints the swatch sheet on A4 and US Letter with true-size swatches', async () => {
    const mill = await as('mill');
    for (const [paper, w, h] of [['a4', 210, 297], ['letter', 215.9, 279.4]] as const) {
      const res = await getBytes(mill, `/api/styles/${styleId}/exports/swatch-sheet.pdf?release=${releaseId}&paper=${paper}`);
      expect(res.status).toBe(200);
      expect(res.headers.get('content-type')).toBe('application/pdf');
      const pages = await readPdf(res.bytes);
      expect(pages.length).toBe(2);
      for (const p of pages) {
        expect(p.widthMm).toBeCloseTo(w, 1);
        expect(p.heightMm).toBeCloseTo(h, 1);
        expect(p.text).toContain('Print at 100 % / actual size');
        expect(p.rects.some((r) => r.paint === 'fill' && Math.abs(r.widthMm - 50) < 0.05)).toBe(true);
        expect(p.rects.some((r) => r.paint === 'fill' && Math.abs(r.widthMm - 50.8) < 0.05)).toBe(true);
      }
      // 2×1 mock rib compression: 3 needles at 24 wales/cm = 1.25 mm a repeat; the swatch is whole repeats.
      const all = pages.flatMap((p) => p.rects.filter((r) => r.paint === 'stroke'));
      expect(all.some((r) => Math.abs(r.widthMm / 1.25 - Math.round(r.widthMm / 1.25)) * 1.25 < 0.2 && r.widthMm > 40)).toBe(true);
      expect(pages.map((p) => p.text).join(' ')).toContain('2×1 mock rib compression');
    }
  });

  it('gives the tile with pHYs, the stitch map with its legend and the yarn list', async () => {
    const mill = await as('mill');
    const release = (await mill.get(`/api/releases/${releaseId}`)).json.release;
    const texture = release.snapshot.textures[0];
    const tile = await getBytes(mill, `/api/styles/${styleId}/exports/tile.png?release=${releaseId}&texture=${texture.id}&pxPerCm=120`);
    expect(tile.status).toBe(200);
    const phys = readPhys(tile.bytes)!;
    expect(phys.unit).toBe('metre');
    expect(phys.pxPerMetreX).toBeGreaterThan(11900);
    expect(phys.pxPerMetreX).toBeLessThan(12100);
    const panel = release.snapshot.panels[0];
    const map = await getBytes(mill, `/api/styles/${styleId}/exports/stitch-map.png?release=${releaseId}&panel=${panel.id}`);
    expect(PNG.sync.read(Buffer.from(map.bytes)).width).toBe(panel.widthNeedles);
    const legend = await mill.get(`/api/styles/${styleId}/exports/stitch-map.json?release=${releaseId}&panel=${panel.id}`);
    expect(JSON.parse(legend.text).legend[0].textureName).toBe('not knitted');
    expect((await mill.get(`/api/styles/${styleId}/exports/stitch-map.csv?panel=${panel.kind}`)).text).toContain('index,hex');
    const yarns = await mill.get(`/api/styles/${styleId}/exports/yarn-list.csv`);
    expect(yarns.status).toBe(200);
    expect(yarns.text).toContain('Polyamide 6.6 78/68 semi-dull');
    expect((await mill.get(`/api/styles/${styleId}/exports/tile.png?release=${releaseId}`)).json.fieldErrors.texture).toBeDefined();
    expect((await mill.get(`/api/styles/${styleId}/exports/tile.png?texture=nope`)).status).toBe(400);
    expect((await mill.get(`/api/styles/${styleId}/exports/tile.png?texture=${texture.id}&pxPerCm=9000`)).status).toBe(400);
    expect((await mill.get(`/api/styles/${styleId}/exports/thing.exe`)).status).toBe(400);
    expect((await (await as('client')).get(`/api/styles/${styleId}/exports/yarn-list.csv`)).status).toBe(403);
  });

  it('builds the mill pack on the server with progress, for the mill to download', async () => {
    const mill = await as('mill');
    const start = await mill.post(`/api/styles/${styleId}/mill-pack`, { releaseId, paper: 'letter' });
    expect(start.status).toBe(202);
    let job = start.json.job;
    const seen = new Set<string>();
    const end = Date.now() + 90_000;
    while ((job.status === 'queued' || job.status === 'running') && Date.now() < end) {
      await new Promise((r) => setTimeout(r, 200));
      job = (await mill.get(`/api/mill-pack-jobs/${job.id}`)).json.job;
      seen.add(job.status);
    }
    expect(job.status).toBe('done');
    expect(job.progress).toBe(100);
    const file = await getBytes(mill, `/api/files/${job.fileId}`);
    expect(file.status).toBe(200);
    const pages = await readPdf(file.bytes);
    expect(pages.length).toBe(job.pages);
    expect(pages[0]!.widthMm).toBeCloseTo(215.9, 1);
    expect(pages[1]!.text).toContain('Contents');
    pages.forEach((p, i) => expect(p.text).toContain(`Page ${i + 1} of ${pages.length}`));
    expect(pages.map((p) => p.text).join(' ')).toContain('Fibre content label');
    expect((await (await as('otherStudioAdmin')).get(`/api/files/${job.fileId}`)).status).toBe(404);
    expect((await mill.post(`/api/styles/${styleId}/mill-pack`, { paper: 'a3' })).status).toBe(400);
  }, 120_000);
});

describe('the swatch sheet kept between downloads', () => {
  it('is the same file until the data changes; a library edit, a list change and a release each show at once', async () => {
    const designer = await as('designer');
    const stamp = Date.now().toString(36);
    const yarn = (await designer.post('/api/library/yarns', {
      name: `Swatch cache polyamide ${stamp}`, supplierRef: 'TST-S', count: { value: 70, unit: 'den' },
      makeUp: { kind: 'single', fibre: 'polyamide' }, colour: { state: 'dyeable' },
    })).json.yarn;
    const created = await designer.post('/api/library/textures', {
      name: `Swatch cache jersey ${stamp}`, family: 'jersey', repeat: { needles: 1, courses: 1, cells: ['k'] },
      feeders: [{ ground: yarn.id }], density: { walesPerCm: 20, coursesPerCm: 28 }, loopMm: { knit: 2.4, tuck: 1.8 },
    });
    expect(created.status).toBe(201);
    const texture = created.json.texture;
    const s = await releasableStyle(designer, [texture.id]);
    const sheet = async (c: Client, query = '') => {
      const res = await getBytes(c, `/api/styles/${s.id}/exports/swatch-sheet.pdf${query}`);
      expect(res.status).toBe(200);
      return { bytes: res.bytes, text: (await readPdf(res.bytes)).map((p) => p.text).join(' ') };
    };
    const first = await sheet(designer);
    expect(first.text).toContain(`Swatch cache jersey ${stamp}`);
    expect(Buffer.from((await sheet(designer)).bytes).equals(Buffer.from(first.bytes))).toBe(true);
    // Each paper size is a file of its own.
    expect((await readPdf((await sheet(designer, '?paper=letter')).bytes))[0]!.widthMm).toBeCloseTo(215.9, 1);
    expect((await readPdf((await sheet(designer)).bytes))[0]!.widthMm).toBeCloseTo(210, 1);

    // Released as it stands, then renamed in the library (the style's version does not move).
    const release = (await designer.post(`/api/styles/${s.id}/releases`, { version: s.version, millIds: [orgs.quellmoor] })).json.release;
    expect((await sheet(designer)).text).toContain(`Swatch cache jersey ${stamp}`);
    const renamed = await designer.patch(`/api/library/textures/${texture.id}`, { version: texture.version, name: `Swatch cache single jersey ${stamp}` });
    expect(renamed.status).toBe(200);
    const working = await sheet(designer);
    expect(working.text).toContain(`Swatch cache single jersey ${stamp}`);
    expect(working.text).toContain('working copy, not released');
    // The release keeps its name; the mill reads the release, never the working copy.
    const released = await sheet(await as('mill'));
    expect(released.text).toContain(`Swatch cache jersey ${stamp}`);
    expect(released.text).not.toContain(`Swatch cache single jersey ${stamp}`);
    expect(released.text).toContain('Revision 1 (released');
    expect((await sheet(designer, `?release=${release.id}`)).text).toContain(`Swatch cache jersey ${stamp}`);

    // A second texture on the style's list: a second swatch.
    const style = (await designer.get(`/api/styles/${s.id}`)).json.style;
    const put = await designer.put(`/api/styles/${s.id}/textures`, { version: style.version, textureIds: [texture.id, textureIds[1]] });
    expect(put.status).toBe(200);
    expect((await sheet(designer)).text).toContain('2×1 mock rib compression');
  });
});

describe('uploads', () => {
  let styleId: string;
  beforeAll(async () => {
    styleId = (await (await as('designer')).post('/api/styles', newStyleBody())).json.style.id;
  });
  const count = async () => (await (await as('designer')).get(`/api/styles/${styleId}/files`)).json.files.length as number;

  it('accepts a photo, stores it privately and serves it to the studio only', async () => {
    const designer = await as('designer');
    const res = await postForm(designer, `/api/styles/${styleId}/files`, { file: { bytes: pngBytes(), name: 'swatch.png', type: 'image/png' } });
    expect(res.status).toBe(201);
    expect(res.json.file).toMatchObject({ kind: 'photo', contentType: 'image/png', widthPx: 6, heightPx: 4 });
    const got = await getBytes(designer, `/api/files/${res.json.file.id}`);
    expect(got.status).toBe(200);
    expect(Buffer.from(got.bytes).equals(pngBytes())).toBe(true);
    expect((await getBytes(await as('mill'), `/api/files/${res.json.file.id}`)).status).toBe(404);
    expect((await bucketKeys()).some((k) => k.includes(styleId))).toBe(true);
  });

  it('refuses a photo that is too large, and a file whose name lies about its type', async () => {
    const designer = await as('designer');
    const before = await count();
    const big = Buffer.concat([pngBytes(), Buffer.alloc(10 * 1024 * 1024 + 10)]);
    const tooBig = await postForm(designer, `/api/styles/${styleId}/files`, { file: { bytes: big, name: 'big.png', type: 'image/png' } });
    expect(tooBig.status).toBe(413);
    expect(tooBig.json.error).toMatch(/at most 10\.0 MB/);
    const fake = await postForm(designer, `/api/styles/${styleId}/files`, { file: { bytes: Buffer.from('MZ\x90\x00 this is a program'), name: 'photo.png', type: 'image/png' } });
    expect(fake.status).toBe(415);
    expect(fake.json.fieldErrors.file[0]).toContain('content was checked');
    expect(await count()).toBe(before);
  });

  it('sanitises an SVG with a script', async () => {
    const designer = await as('designer');
    const svg = '<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10" onload="alert(1)"><script>alert(2)</script><rect width="10" height="10" fill="#2c7a6b"/></svg>';
    const res = await postForm(designer, `/api/styles/${styleId}/files`, { file: { bytes: Buffer.from(svg), name: 'logo.svg', type: 'image/svg+xml' } });
    expect(res.status).toBe(201);
    expect(res.json.removed).toEqual(expect.arrayContaining(['<script>', 'event handler onload']));
    const got = await getBytes(designer, `/api/files/${res.json.file.id}`);
    const text = Buffer.from(got.bytes).toString('utf8');
    expect(text).toContain('<rect');
    expect(text).not.toMatch(/script|onload/);
    expect(got.headers.get('content-security-policy')).toContain("default-src 'none'");
  });

  it('leaves nothing behind when an upload fails halfway', async () => {
    const designer = await as('designer');
    const before = await count();
    const keysBefore = (await bucketKeys()).length;
    // The connection drops in the middle of the body.
    const boundary = 'halfwayboundary';
    const body = Buffer.concat([
      Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="cut.png"\r\nContent-Type: image/png\r\n\r\n`),
      pngBytes(200, 200),
      Buffer.from(`\r\n--${boundary}--\r\n`),
    ]);
    await new Promise<void>((resolve) => {
      const req = http.request(`${baseUrl()}/api/styles/${styleId}/files`, {
        method: 'POST',
        headers: { cookie: designer.cookie, 'content-type': `multipart/form-data; boundary=${boundary}`, 'content-length': String(body.length) },
      });
      req.on('error', () => resolve());
      req.on('response', (r) => {
        r.resume();
        resolve();
      });
      req.write(body.subarray(0, Math.floor(body.length / 2)));
      setTimeout(() => {
        req.destroy();
        resolve();
      }, 300);
    });
    // A file that arrives cut off (its last bytes missing) is refused as incomplete.
    const full = pngBytes(50, 50);
    const cut = await postForm(designer, `/api/styles/${styleId}/files`, { file: { bytes: full.subarray(0, full.length - 30), name: 'cut.png', type: 'image/png' } });
    expect(cut.status).toBe(400);
    expect(cut.json.error).toContain('incomplete');
    await new Promise((r) => setTimeout(r, 500));
    expect(await count()).toBe(before);
    expect((await bucketKeys()).length).toBe(keysBefore);
  });
});

describe('test knits', () => {
  it('are requested in one click, sent by the mill with figures, flagged off plan, and decided', async () => {
    const designer = await as('designer');
    const mill = await as('mill');
    const s = await releasableStyle(designer);
    const rel = (await designer.post(`/api/styles/${s.id}/releases`, { version: s.version, millIds: [orgs.quellmoor] })).json.release;
    const req = await designer.post(`/api/releases/${rel.id}/test-knits`);
    expect(req.status).toBe(201);
    expect(req.json.created).toBe(3);
    expect((await designer.post(`/api/releases/${rel.id}/test-knits`)).json.created).toBe(0);
    await waitForMail((m) => m.to.includes('mill@quellmoor.example') && m.subject.includes('3 test knits requested'));

    const knits = (await mill.get(`/api/styles/${s.id}/test-knits`)).json.testKnits as any[];
    expect(knits).toHaveLength(3);
    const k = knits.find((x) => x.textureName === 'Plain plated jersey');
    expect(k.planned.walesPerCm).toBe(21);

    const missing = await postForm(mill, `/api/test-knits/${k.id}/submission`, { photo: { bytes: pngBytes(), name: 'k.png', type: 'image/png' }, walesPerCm: '21' });
    expect(missing.status).toBe(400);
    expect(Object.keys(missing.json.fieldErrors)).toEqual(expect.arrayContaining(['coursesPerCm', 'gsm']));
    const noPhoto = await postForm(mill, `/api/test-knits/${k.id}/submission`, { walesPerCm: '21', coursesPerCm: '29', gsm: '150' });
    expect(noPhoto.status).toBe(400);
    expect(noPhoto.json.fieldErrors.photo).toBeDefined();

    // 29 → 31.5 courses/cm is +8.6 %: past the 5 % threshold.
    const sent = await postForm(mill, `/api/test-knits/${k.id}/submission`, {
      photo: { bytes: pngBytes(), name: 'jersey.png', type: 'image/png' }, walesPerCm: '21,2', coursesPerCm: '31.5', gsm: String(Math.round(k.planned.gsm)), note: 'Knitted on feeder 3.',
    });
    expect(sent.status).toBe(200);
    const tk = sent.json.testKnit;
    expect(tk.status).toBe('knitted');
    expect(tk.flagged).toBe(true);
    const courses = tk.deviation.figures.find((f: any) => f.figure === 'coursesPerCm');
    expect(courses.percent).toBeCloseTo(((31.5 - 29) / 29) * 100, 6);
    expect(courses.flagged).toBe(true);
    expect(tk.deviation.figures.find((f: any) => f.figure === 'walesPerCm').flagged).toBe(false);
    await waitForMail((m) => m.to.includes('designer@hollowfell.example') && m.subject.includes('off plan'));
    expect((await getBytes(designer, `/api/files/${tk.photoFileId}`)).status).toBe(200);

    expect((await mill.post(`/api/test-knits/${k.id}/decision`, { version: tk.version, decision: 'approved' })).status).toBe(403);
    expect((await designer.post(`/api/test-knits/${k.id}/decision`, { version: tk.version, decision: 'change-requested' })).status).toBe(400);
    expect((await designer.post(`/api/test-knits/${k.id}/decision`, { version: tk.version - 1, decision: 'approved' })).status).toBe(409);
    const decided = await designer.post(`/api/test-knits/${k.id}/decision`, { version: tk.version, decision: 'change-requested', comment: 'Open the stitch cam a little.' });
    expect(decided.status).toBe(200);
    expect(decided.json.testKnit.status).toBe('change-requested');
    await waitForMail((m) => m.to.includes('programming@quellmoor.example') && m.subject.includes('needs a change'));
    expect((await designer.post(`/api/test-knits/${k.id}/decision`, { version: decided.json.testKnit.version, decision: 'approved' })).status).toBe(409);
  });
});

describe('a file write that fails halfway (data layer)', () => {
  it('keeps no row when the store fails, and removes the object when a later step fails', async () => {
    process.env.DATABASE_URL = inject('databaseUrl');
    const { storeFile, withStoredFiles } = await import('@/lib/db/files');
    const { db } = await import('@/lib/db/knex');
    const studio = (await db()('studios').where({ name: 'Hollowfell Knit Lab' }).first()) as { id: string };
    const upload = { kind: 'photo' as const, contentType: 'image/png', bytes: new Uint8Array(pngBytes()), widthPx: 6, heightPx: 4 };
    const meta = { studioId: studio.id, styleId: null, organisationId: null, uploadedBy: null, purpose: 'attachment' as const, upload, originalName: 'x.png' };
    const rows = async () => Number(((await db()('files').count('* as n').first()) as { n: string }).n);
    const before = await rows();
    const down = { put: async () => { throw new Error('store down'); }, get: async () => new Uint8Array(), delete: async () => {} };
    await expect(withStoredFiles(down, (trx, written) => storeFile(trx, down, meta, written))).rejects.toThrow('store down');
    expect(await rows()).toBe(before);
    const deleted: string[] = [];
    const up = { put: async () => {}, get: async () => new Uint8Array(), delete: async (k: string) => { deleted.push(k); } };
    await expect(
      withStoredFiles(up, async (trx, written) => {
        await storeFile(trx, up, meta, written);
        throw new Error('a later step failed');
      }),
    ).rejects.toThrow('a later step failed');
    expect(deleted).toHaveLength(1);
    expect(await rows()).toBe(before);
    await db().destroy();
  });
});
