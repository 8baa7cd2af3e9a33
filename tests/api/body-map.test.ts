import { afterAll, beforeAll, describe, expect, it, inject } from 'vitest';
import knexFactory, { type Knex } from 'knex';
import { randomUUID } from 'node:crypto';
import { as, newStyleBody, styleByCode } from './helpers';

let knex: Knex;
let textureIds: string[] = [];
let otherStudioTexture: string | null = null;

beforeAll(async () => {
  knex = knexFactory({ client: 'pg', connection: inject('databaseUrl') });
  const studio = await knex('studios').where({ name: 'Hollowfell Knit Lab' }).first('id');
  textureIds = await knex('textures').where({ studio_id: studio.id }).whereNull('archived_at').orderBy('name').pluck('id');
  const other = await knex('studios').where({ name: 'Oxbow Knit Collective' }).first('id');
  const [t] = await knex('textures').where({ studio_id: other.id }).pluck('id');
  otherStudioTexture = t ?? null;
});
afterAll(async () => { await knex?.destroy(); });

const rect = (x0: number, y0: number, x1: number, y1: number) => [{ x: x0, y: y0 }, { x: x1, y: y0 }, { x: x1, y: y1 }, { x: x0, y: y1 }];

async function freshMap() {
  const designer = await as('designer');
  const style = (await designer.post('/api/styles', newStyleBody())).json.style;
  const map = (await designer.get(`/api/styles/${style.id}/body-map`)).json;
  return { designer, style, map };
}

function withZone(map: any, zone: Partial<{ id: string; polygon: { x: number; y: number }[]; textureId: string; fn: string; name: string }> = {}) {
  const panels = structuredClone(map.panels);
  panels[0].zones.push({
    id: zone.id ?? randomUUID(), name: zone.name ?? 'Side compression', textureId: zone.textureId ?? textureIds[1], fn: zone.fn ?? 'compression', order: 1,
    polygon: zone.polygon ?? rect(10, 100, 120, 600),
  });
  return panels;
}

describe('body map API', () => {
  it('the demo library has textures to paint with', () => {
    expect(textureIds.length).toBeGreaterThanOrEqual(8);
  });

  it('GET generates front and back panels half the cylinder wide when nothing is saved', async () => {
    const { map, style } = await freshMap();
    expect(map.generated).toBe(true);
    expect(map.version).toBe(style.version);
    const kinds = map.panels.map((p: any) => p.kind);
    expect(kinds.slice(0, 2)).toEqual(['front', 'back']);
    // 14 in × 28 npi × π = 1231.5 → 1232 needles at a multiple of 4; each panel is half.
    expect(map.panels[0].widthNeedles).toBe(616);
  });

  it('a generated map takes the base size of the saved size spec: body and sleeve lengths, and a flat body panel as wide as the chest half-width', async () => {
    const { designer, style, map } = await freshMap();
    const texture = await knex('textures').where({ id: map.panels[0].baseTextureId }).first('courses_per_cm');
    const cpc = Number(texture.courses_per_cm);
    // Without a spec: the 60 cm default body length.
    expect(map.panels[0].heightCourses).toBe(Math.round(60 * cpc));
    const fit = (await designer.get(`/api/styles/${style.id}/fit`)).json.fit;
    const points = fit.spec.points.map((p: any) =>
      p.point === 'body-length-hps' ? { ...p, baseCm: 66 } : p.point === 'sleeve-length' ? { ...p, baseCm: 64 } : p);
    const { baseSize, girths, cutAndSew, baseTextureId, compressionTextureId, cylinderDiametersIn, target } = fit.spec;
    const saved = await designer.put(`/api/styles/${style.id}/fit`, { version: fit.version, baseSize, points, girths, cutAndSew, baseTextureId, compressionTextureId, cylinderDiametersIn, target });
    expect(saved.status).toBe(200);
    const now = (await designer.get(`/api/styles/${style.id}/body-map`)).json;
    expect(now.generated).toBe(true);
    expect(now.panels[0].heightCourses).toBe(Math.round(66 * cpc));
    expect(now.panels.find((p: any) => p.kind === 'sleeve-left').heightCourses).toBe(Math.round(64 * cpc));
    // The seamless body stays half the cylinder.
    expect(now.panels[0].widthNeedles).toBe(616);

    const flatBody = { ...newStyleBody(), construction: 'flat', machine: { kind: 'flat', gauge: 14, bedNeedles: 2000 } };
    const flat = (await designer.post('/api/styles', flatBody)).json.style;
    const flatFit = (await designer.get(`/api/styles/${flat.id}/fit`)).json.fit;
    const flatMap = (await designer.get(`/api/styles/${flat.id}/body-map`)).json;
    const flatTexture = await knex('textures').where({ id: flatMap.panels[0].baseTextureId }).first('wales_per_cm');
    const chest = flatFit.spec.points.map((p: any) => (p.point === 'chest-half' ? { ...p, baseCm: 44 } : p));
    const s = flatFit.spec;
    expect((await designer.put(`/api/styles/${flat.id}/fit`, { version: flatFit.version, baseSize: s.baseSize, points: chest, girths: s.girths, cutAndSew: s.cutAndSew,
      baseTextureId: s.baseTextureId, compressionTextureId: s.compressionTextureId, cylinderDiametersIn: s.cylinderDiametersIn, target: s.target })).status).toBe(200);
    const flatNow = (await designer.get(`/api/styles/${flat.id}/body-map`)).json;
    expect(flatNow.panels[0].widthNeedles).toBe(Math.round(44 * Number(flatTexture.wales_per_cm)));
  });

  it('a style whose machine setup says raglan gets raglan outlines; an unknown sleeve style is a 400; existing styles stay set-in', async () => {
    const designer = await as('designer');
    const body = newStyleBody();
    const raglan = await designer.post('/api/styles', { ...body, machine: { ...body.machine, sleeveStyle: 'raglan' } });
    expect(raglan.status).toBe(201);
    expect(raglan.json.style.machine.sleeveStyle).toBe('raglan');
    const setIn = (await freshMap()).map;
    const map = (await designer.get(`/api/styles/${raglan.json.style.id}/body-map`)).json;
    const sleeve = map.panels.find((p: any) => p.kind === 'sleeve-left');
    // A raglan sleeve top is two straight lines and a short top edge: six vertices with the cuff; the set-in cap is a curve.
    expect(sleeve.cutOutline).toHaveLength(6);
    expect(setIn.panels.find((p: any) => p.kind === 'sleeve-left').cutOutline.length).toBeGreaterThan(6);
    const bad = await designer.post('/api/styles', { ...newStyleBody(), machine: { ...body.machine, sleeveStyle: 'puff' } });
    expect(bad.status).toBe(400);
  });

  it('PUT saves panels and zones at the current version; GET returns them; an audit entry is written', async () => {
    const { designer, style, map } = await freshMap();
    const panels = withZone(map);
    const res = await designer.put(`/api/styles/${style.id}/body-map`, { version: map.version, panels });
    expect(res.status).toBe(200);
    expect(res.json.version).toBe(map.version + 1);
    const again = (await designer.get(`/api/styles/${style.id}/body-map`)).json;
    expect(again.generated).toBe(false);
    expect(again.panels[0].zones).toEqual(panels[0].zones);
    expect(again.panels.map((p: any) => p.id)).toEqual(panels.map((p: any) => p.id));
    const hist = (await designer.get(`/api/styles/${style.id}/history`)).json.entries;
    expect(hist[0].action).toBe('body-map.save');
    expect(hist[0].details.zones).toBe(1);
    // The textures used are now the style's textures.
    const used = await knex('style_textures').where({ style_id: style.id }).pluck('texture_id');
    expect(used).toEqual(expect.arrayContaining([textureIds[1], map.panels[0].baseTextureId]));
  });

  it('a stale save gets 409 and changes nothing', async () => {
    const { designer, style, map } = await freshMap();
    const first = await designer.put(`/api/styles/${style.id}/body-map`, { version: map.version, panels: withZone(map, { name: 'First' }) });
    expect(first.status).toBe(200);
    const stale = await designer.put(`/api/styles/${style.id}/body-map`, { version: map.version, panels: withZone(map, { name: 'Stale' }) });
    expect(stale.status).toBe(409);
    const now = (await designer.get(`/api/styles/${style.id}/body-map`)).json;
    expect(now.panels[0].zones.map((z: any) => z.name)).toEqual(['First']);
    expect(now.version).toBe(first.json.version);
  });

  it('interleaved saves from two designers: one wins, the other gets 409; no zone lost or duplicated', async () => {
    const { designer, style, map } = await freshMap();
    const admin = await as('admin');
    const a = withZone(map, { name: 'From designer' });
    const b = withZone(map, { name: 'From admin' });
    const results = await Promise.all([
      designer.put(`/api/styles/${style.id}/body-map`, { version: map.version, panels: a }),
      admin.put(`/api/styles/${style.id}/body-map`, { version: map.version, panels: b }),
    ]);
    expect(results.map((r) => r.status).sort()).toEqual([200, 409]);
    const winner = results[0]!.status === 200 ? 'From designer' : 'From admin';
    const now = (await designer.get(`/api/styles/${style.id}/body-map`)).json;
    expect(now.panels[0].zones.map((z: any) => z.name)).toEqual([winner]);
    const zoneRows = await knex('zones as z').join('panels as p', 'p.id', 'z.panel_id').where('p.style_id', style.id).count<{ count: string }[]>('* as count');
    expect(Number(zoneRows[0]!.count)).toBe(1);
  });

  it('refuses bad geometry and foreign textures with 400 and field errors, saving nothing', async () => {
    const { designer, style, map } = await freshMap();
    const put = (panels: any) => designer.put(`/api/styles/${style.id}/body-map`, { version: map.version, panels });
    const bowtie = [{ x: 10, y: 10 }, { x: 100, y: 100 }, { x: 100, y: 10 }, { x: 10, y: 100 }];
    const selfCrossing = await put(withZone(map, { polygon: bowtie }));
    expect(selfCrossing.status).toBe(400);
    expect(JSON.stringify(selfCrossing.json.fieldErrors)).toMatch(/cross/);
    const outside = await put(withZone(map, { polygon: rect(500, 10, 900, 50) }));
    expect(outside.status).toBe(400);
    expect(JSON.stringify(outside.json.fieldErrors)).toMatch(/outside the panel/);
    expect((await put(withZone(map, { fn: 'decoration' }))).status).toBe(400);
    expect((await put(withZone(map, { textureId: randomUUID() }))).status).toBe(400);
    if (otherStudioTexture) expect((await put(withZone(map, { textureId: otherStudioTexture }))).status).toBe(400);
    expect((await designer.request('PUT', `/api/styles/${style.id}/body-map`, '{"version":', { 'content-type': 'application/json' })).status).toBe(400);
    const now = (await designer.get(`/api/styles/${style.id}/body-map`)).json;
    expect(now.generated).toBe(true);
  });

  it('the client reads a shared style\'s map but may not save it; the mill may not read the working copy', async () => {
    const shared = await styleByCode('HF27-101');
    const client = await as('client');
    const res = await client.get(`/api/styles/${shared.id}/body-map`);
    expect(res.status).toBe(200);
    expect((await client.put(`/api/styles/${shared.id}/body-map`, { version: res.json.version, panels: res.json.panels })).status).toBe(403);
    const mill = await as('mill');
    expect((await mill.get(`/api/styles/${shared.id}/body-map`)).status).toBe(403);
    expect((await mill.put(`/api/styles/${shared.id}/body-map`, { version: res.json.version, panels: res.json.panels })).status).toBe(403);
    // What the mill sees of the body map is the released revision's snapshot.
    const releases = (await mill.get(`/api/styles/${shared.id}/releases`)).json.releases as { id: string }[];
    expect(releases.length).toBeGreaterThan(0);
    const release = await mill.get(`/api/releases/${releases[0]!.id}`);
    expect(release.status).toBe(200);
    expect(release.json.release.snapshot.panels.length).toBeGreaterThan(0);
    const notShared = await styleByCode('HF27-103');
    expect((await client.get(`/api/styles/${notShared.id}/body-map`)).status).toBe(404);
  });

});

describe('outline upload', () => {
  it('turns an SVG outline into a polygon filling the panel, and refuses a non-SVG with a clear 400', async () => {
    const { designer, style } = await freshMap();
    const ok = await designer.post(`/api/styles/${style.id}/body-map/outline`, {
      svg: '<svg viewBox="0 0 100 200"><script>alert(1)</script><path d="M0 20 Q50 0 100 20 L100 200 L0 200 Z"/></svg>',
      widthNeedles: 616, heightCourses: 1740,
    });
    expect(ok.status).toBe(200);
    expect(Math.max(...ok.json.polygon.map((p: any) => p.x))).toBe(616);
    expect(Math.max(...ok.json.polygon.map((p: any) => p.y))).toBe(1740);
    const bad = await designer.post(`/api/styles/${style.id}/body-map/outline`, { svg: '<html>nope</html>', widthNeedles: 616, heightCourses: 1740 });
    expect(bad.status).toBe(400);
    expect(bad.json.error).toMatch(/not an SVG/);
    const huge = await designer.post(`/api/styles/${style.id}/body-map/outline`, { svg: `<svg>${'x'.repeat(1_000_100)}</svg>`, widthNeedles: 616, heightCourses: 1740 });
    expect(huge.status).toBe(400);
  });
});
