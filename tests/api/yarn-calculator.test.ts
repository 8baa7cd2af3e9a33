import { describe, expect, it } from 'vitest';
import { anonymous, as, newStyleBody, styleByCode } from './helpers';

const calc = (id: string, query = '') => `/api/styles/${id}/yarn-calculator${query ? `?${query}` : ''}`;
const orderCsv = (id: string, query = '') => `/api/styles/${id}/yarn-order.csv${query ? `?${query}` : ''}`;

/** Every key anywhere in a JSON value. */
function keysOf(v: unknown, out = new Set<string>()): Set<string> {
  if (Array.isArray(v)) v.forEach((x) => keysOf(x, out));
  else if (v && typeof v === 'object') for (const [k, x] of Object.entries(v)) { out.add(k); keysOf(x, out); }
  return out;
}

describe('yarn calculator route', () => {
  it('the designer gets per-texture, per-size and order figures, both labels and the care advice, with costs', async () => {
    const designer = await as('designer');
    const ridge = await styleByCode('HF27-101');
    const res = await designer.get(calc(ridge.id, 'waste=5&method=nominal&qty=S:100,M:200'));
    expect(res.status).toBe(200);
    const { figures, yarns, style } = res.json;
    expect(style.baseSize).toBe('M');
    expect(res.json.generated).toBe(false);
    expect(figures.textures.length).toBeGreaterThanOrEqual(3);
    for (const t of figures.textures) {
      expect(t.inside + t.outside).toBeGreaterThan(0);
      for (const y of t.yarns) expect(y.metres).toBeGreaterThan(0);
    }
    expect(figures.sizes.map((s: { size: string }) => s.size)).toEqual(style.sizes);
    const m = figures.sizes.find((s: { size: string }) => s.size === 'M');
    expect(m.basis).toBe('drawn');
    const pa = yarns.find((y: { name: string }) => y.name === 'Polyamide 6.6 78/68 semi-dull');
    expect(m.consumption.yarns[pa.id].grossGrams).toBeCloseTo(m.consumption.yarns[pa.id].knittedGrams * 1.05, 6);
    // The demo style has a graded spec (Fit), so the other sizes are scaled, S below M.
    const s = figures.sizes.find((x: { size: string }) => x.size === 'S');
    expect(s.basis).toBe('graded');
    expect(s.consumption.grossGrams).toBeLessThan(m.consumption.grossGrams);
    expect(figures.order.garments).toMatchObject({ S: 100, M: 200 });
    expect(figures.order.yarns[pa.id].grams).toBeCloseTo(100 * s.consumption.yarns[pa.id].grossGrams + 200 * m.consumption.yarns[pa.id].grossGrams, 3);
    expect(figures.content.labels.eu.text).toMatch(/polyamide/);
    expect(figures.content.labels.us.text).toMatch(/nylon/);
    expect(figures.care.categories.dry.decidedBy).toContain('elastane');
    // Studio accounts see the prices and what they cost.
    expect(pa.pricePerKg).toBe(7.4);
    expect(m.costPerGarment).toBeGreaterThan(0);
    expect(figures.order.cost).toBeGreaterThan(0);
  });

  it('the waste allowance and the method change the figures', async () => {
    const designer = await as('designer');
    const ridge = await styleByCode('HF27-101');
    const five = (await designer.get(calc(ridge.id))).json.figures;
    const ten = (await designer.get(calc(ridge.id, 'waste=10'))).json.figures;
    const m5 = five.sizes.find((s: { size: string }) => s.size === 'M').consumption;
    const m10 = ten.sizes.find((s: { size: string }) => s.size === 'M').consumption;
    expect(m10.grossGrams / m5.grossGrams).toBeCloseTo(1.1 / 1.05, 9);
    const eu = (await designer.get(calc(ridge.id, 'method=eu-allowance'))).json.figures;
    expect(eu.content.method).toBe('eu-allowance');
    expect(eu.content.shares.polyamide).not.toBeCloseTo(five.content.shares.polyamide, 6);
  });

  it('the mill and the client read a shared style without any price or cost', async () => {
    const ridge = await styleByCode('HF27-101');
    const mill = await as('mill');
    const res = await mill.get(calc(ridge.id, 'qty=M:10'));
    expect(res.status).toBe(200);
    const keys = keysOf(res.json);
    for (const k of ['pricePerKg', 'costPerGarment', 'cost', 'unpricedYarnIds']) expect(keys.has(k)).toBe(false);
    expect(res.json.figures.order.kg).toBeGreaterThan(0);
    const client = await as('client');
    const shared = (await client.get('/api/styles')).json.styles[0];
    const seen = await client.get(calc(shared.id));
    expect(seen.status).toBe(200);
    expect(keysOf(seen.json).has('pricePerKg')).toBe(false);
    // Nor through the style's texture list or the CSV.
    const textures = await mill.get(`/api/styles/${ridge.id}/textures`);
    for (const y of textures.json.yarns) expect(y.pricePerKg).toBeNull();
    const csv = await mill.get(orderCsv(ridge.id));
    expect(csv.status).toBe(200);
    expect(csv.text).not.toMatch(/price|cost/i);
  });

  it('answers bad options with field errors, never a 500', async () => {
    const designer = await as('designer');
    const ridge = await styleByCode('HF27-101');
    const cases: [string, string][] = [
      ['waste=abc', 'waste'], ['waste=-1', 'waste'], ['waste=80', 'waste'], ['method=cotton-count', 'method'],
      ['qty=S:1.5', 'qty.S'], ['qty=S:-3', 'qty.S'], ['qty=hello', 'qty'], ['qty=S:1,S:2', 'qty'], ['qty=XXXL:4', 'qty'],
    ];
    for (const [query, field] of cases) {
      const res = await designer.get(calc(ridge.id, query));
      expect(res.status, query).toBe(400);
      expect(Object.keys(res.json.fieldErrors), query).toContain(field);
    }
    expect((await designer.get(orderCsv(ridge.id, 'waste=abc'))).status).toBe(400);
    expect((await designer.get('/api/styles/not-a-uuid/yarn-calculator')).status).toBe(400);
  });

  it('is scoped: signed out 401, another studio and unshared styles 404', async () => {
    const ridge = await styleByCode('HF27-101');
    expect((await anonymous().get(calc(ridge.id))).status).toBe(401);
    expect((await (await as('otherStudioAdmin')).get(calc(ridge.id))).status).toBe(404);
    const updraft = await styleByCode('HF27-102');
    expect((await (await as('mill')).get(calc(updraft.id))).status).toBe(404);
    expect((await (await as('mill')).get(orderCsv(updraft.id))).status).toBe(404);
  });

  it('a style without a saved body map or a graded spec: generated panels, base-size grams for every size', async () => {
    const designer = await as('designer');
    const s = (await designer.post('/api/styles', newStyleBody())).json.style;
    const res = await designer.get(calc(s.id));
    expect(res.status).toBe(200);
    expect(res.json.generated).toBe(true);
    expect(res.json.figures.grading.mode).toBe('base-only');
    const bases = res.json.figures.sizes.map((x: { basis: string }) => x.basis);
    expect(bases).toEqual(['base-grams', 'drawn', 'base-grams']);
  });
});

describe('yarn order CSV', () => {
  it('downloads one row per yarn with grams per garment and kg per size, prices for the studio', async () => {
    const designer = await as('designer');
    const ridge = await styleByCode('HF27-101');
    const res = await designer.get(orderCsv(ridge.id, 'waste=5&qty=S:10,M:20,L:0'));
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toMatch(/^text\/csv/);
    expect(res.headers.get('content-disposition')).toBe('attachment; filename="HF27-101-yarn-order.csv"');
    const rows = res.text.trim().split('\r\n').map((r: string) => r.split(','));
    expect(rows[0]!.slice(0, 4)).toEqual(['yarn', 'supplier_ref', 'dtex', 'g_per_garment_XS']);
    expect(rows[0]).toContain('garments_M');
    expect(rows[0]).toContain('kg_order');
    expect(rows[0]).toContain('price_per_kg');
    const col = rows[0]!.indexOf('garments_M');
    for (const r of rows.slice(1)) expect(r[col]).toBe('20');
    expect(rows.length).toBeGreaterThan(2);
  });
});

describe('knitted logos and the style texture list', () => {
  it('a knitted logo is knitted in and carries its finest detail; wrong pairings are field errors', async () => {
    const designer = await as('designer');
    const s = (await designer.post('/api/styles', newStyleBody())).json.style;
    const box = { x: 100, y: 200, width: 60, height: 40 };
    const ok = await designer.post(`/api/styles/${s.id}/trims`, { panelKind: 'front', name: 'Chest mark', kind: 'knitted-logo', method: 'knitted', detailMm: 0.8, box });
    expect(ok.status).toBe(201);
    expect(ok.json.trim).toMatchObject({ kind: 'knitted-logo', method: 'knitted', detailMm: 0.8, tempC: null });
    const sewnLogo = await designer.post(`/api/styles/${s.id}/trims`, { panelKind: 'front', kind: 'knitted-logo', method: 'sewn', box });
    expect(sewnLogo.status).toBe(400);
    expect(sewnLogo.json.fieldErrors.method).toBeDefined();
    const knittedLabel = await designer.post(`/api/styles/${s.id}/trims`, { panelKind: 'front', kind: 'woven-label', method: 'knitted', box });
    expect(knittedLabel.status).toBe(400);
    const tiny = await designer.post(`/api/styles/${s.id}/trims`, { panelKind: 'front', kind: 'knitted-logo', method: 'knitted', detailMm: 0, box });
    expect(tiny.json.fieldErrors.detailMm).toBeDefined();
    // A patch is checked against the stored trim: turning the logo into a label needs a method too.
    const patch = await designer.patch(`/api/styles/${s.id}/trims/${ok.json.trim.id}`, { version: ok.json.trim.version, kind: 'woven-label' });
    expect(patch.status).toBe(400);
    expect(patch.json.fieldErrors.method).toBeDefined();
    const fine = await designer.patch(`/api/styles/${s.id}/trims/${ok.json.trim.id}`, { version: ok.json.trim.version, detailMm: 0.3 });
    expect(fine.status).toBe(200);
    expect(fine.json.trim.detailMm).toBe(0.3);
  });

  it('a texture the saved body map uses cannot be taken off the style', async () => {
    const designer = await as('designer');
    const ridge = await styleByCode('HF27-101');
    const list = (await designer.get(`/api/styles/${ridge.id}/textures`)).json;
    const res = await designer.put(`/api/styles/${ridge.id}/textures`, { version: list.version, textureIds: list.textures.slice(1).map((t: { id: string }) => t.id) });
    expect(res.status).toBe(409);
    expect(res.json.error).toMatch(/The body map uses/);
    expect((await designer.get(`/api/styles/${ridge.id}/textures`)).json.textures).toHaveLength(list.textures.length);
    // Reordering keeps them all and is accepted.
    const reordered = [...list.textures].reverse().map((t: { id: string }) => t.id);
    const again = await designer.put(`/api/styles/${ridge.id}/textures`, { version: list.version, textureIds: reordered });
    expect(again.status).toBe(200);
    const back = await designer.put(`/api/styles/${ridge.id}/textures`, { version: again.json.version, textureIds: list.textures.map((t: { id: string }) => t.id) });
    expect(back.status).toBe(200);
  });
});

describe('the kept answers follow every write', () => {
  let seq = 0;
  const unique = (what: string) => `${what} ${Date.now().toString(36)}-${(seq++).toString(36)}`;
  const grossGrams = (answer: any, size = 'M') => answer.figures.sizes.find((s: { size: string }) => s.size === size).consumption.grossGrams as number;

  /** A style with a texture and a yarn of its own (so editing them touches no other test), its map saved. */
  async function ownStyle() {
    const designer = await as('designer');
    const yarn = (await designer.post('/api/library/yarns', {
      name: unique('Cache test polyamide'), supplierRef: 'TST-C', count: { value: 70, unit: 'den' },
      makeUp: { kind: 'single', fibre: 'polyamide' }, colour: { state: 'dyeable' }, pricePerKg: 8,
    })).json.yarn;
    const texture = (await designer.post('/api/library/textures', {
      name: unique('Cache test jersey'), family: 'jersey', repeat: { needles: 1, courses: 1, cells: ['k'] },
      feeders: [{ ground: yarn.id }], density: { walesPerCm: 20, coursesPerCm: 28 }, loopMm: { knit: 2.4, tuck: 1.8 },
    })).json.texture;
    const style = (await designer.post('/api/styles', newStyleBody())).json.style;
    const list = (await designer.get(`/api/styles/${style.id}/textures`)).json;
    expect((await designer.put(`/api/styles/${style.id}/textures`, { version: list.version, textureIds: [texture.id] })).status).toBe(200);
    const map = (await designer.get(`/api/styles/${style.id}/body-map`)).json;
    const saved = await designer.put(`/api/styles/${style.id}/body-map`, { version: map.version, panels: map.panels });
    expect(saved.status).toBe(200);
    return { designer, yarn, texture, style, panels: map.panels as { kind: string }[], version: saved.json.version as number };
  }

  it('the same question twice gets the same answer; a body-map save changes the next one', async () => {
    const { designer, style, panels, version } = await ownStyle();
    const first = await designer.get(calc(style.id, 'qty=M:10'));
    expect(first.status).toBe(200);
    expect(first.json.generated).toBe(false);
    expect((await designer.get(calc(style.id, 'qty=M:10'))).json).toEqual(first.json);
    // Without the first panel the garment takes less yarn.
    const smaller = await designer.put(`/api/styles/${style.id}/body-map`, { version, panels: panels.slice(1) });
    expect(smaller.status).toBe(200);
    const after = (await designer.get(calc(style.id, 'qty=M:10'))).json;
    expect(after.style.version).toBe(smaller.json.version);
    expect(grossGrams(after)).toBeLessThan(grossGrams(first.json));
    // The CSV is made from the same answer and follows too.
    const csvAfter = await designer.get(orderCsv(style.id, 'qty=M:10'));
    const kgCol = (text: string) => { const rows = text.trim().split('\r\n').map((r) => r.split(',')); return rows[1]![rows[0]!.indexOf('kg_order')]; };
    expect(Number(kgCol(csvAfter.text))).toBeCloseTo(after.figures.order.kg, 2);
  });

  it('a yarn or texture edit in the library changes the next answer, though the style itself is unchanged', async () => {
    const { designer, yarn, texture, style } = await ownStyle();
    const before = (await designer.get(calc(style.id))).json;
    // Twice the count, twice the grams (grams = metres × dtex ÷ 10 000).
    const heavier = await designer.patch(`/api/library/yarns/${yarn.id}`, { version: yarn.version, count: { value: 140, unit: 'den' } });
    expect(heavier.status).toBe(200);
    const afterYarn = (await designer.get(calc(style.id))).json;
    expect(afterYarn.style.version).toBe(before.style.version);
    expect(grossGrams(afterYarn)).toBeCloseTo(grossGrams(before) * 2, 6);
    // A longer loop takes more yarn per stitch.
    const longer = await designer.patch(`/api/library/textures/${texture.id}`, { version: texture.version, loopMm: { knit: 3.6, tuck: 1.8 } });
    expect(longer.status).toBe(200);
    const afterTexture = (await designer.get(calc(style.id))).json;
    expect(grossGrams(afterTexture)).toBeCloseTo(grossGrams(afterYarn) * 1.5, 6);
    // The price is the yarn's too: the studio sees the new one.
    const dearer = await designer.patch(`/api/library/yarns/${yarn.id}`, { version: heavier.json.yarn.version, pricePerKg: 12 });
    expect(dearer.status).toBe(200);
    const afterPrice = (await designer.get(calc(style.id))).json;
    expect(afterPrice.yarns.find((y: { id: string }) => y.id === yarn.id).pricePerKg).toBe(12);
  });

  it('a trim and a size spec change the next answer', async () => {
    const { designer, style } = await ownStyle();
    const before = (await designer.get(calc(style.id))).json;
    expect(before.figures.care.extras).not.toContain('no-iron-trim');
    // A trim carries its own version: the style's stays as it was.
    const trim = await designer.post(`/api/styles/${style.id}/trims`, {
      panelKind: 'front', name: 'Chest logo', kind: 'heat-transfer', method: 'heat-press', tempC: 150, box: { x: 100, y: 200, width: 60, height: 40 },
    });
    expect(trim.status).toBe(201);
    const withTrim = (await designer.get(calc(style.id))).json;
    expect(withTrim.style.version).toBe(before.style.version);
    expect(withTrim.figures.care.extras).toContain('no-iron-trim');
    expect((await designer.delete(`/api/styles/${style.id}/trims/${trim.json.trim.id}`)).status).toBe(200);
    expect((await designer.get(calc(style.id))).json.figures.care.extras).not.toContain('no-iron-trim');
    // A graded size spec grades the other sizes.
    expect(before.figures.grading.mode).toBe('base-only');
    const fit = (await designer.get(`/api/styles/${style.id}/fit`)).json.fit;
    const points = fit.spec.points.map((p: any) => (p.point === 'chest-half' ? { ...p, baseCm: 48 } : p.point === 'body-length-hps' ? { ...p, baseCm: 66 } : p));
    const { baseSize, girths, cutAndSew, baseTextureId, compressionTextureId, cylinderDiametersIn, target } = fit.spec;
    const spec = await designer.put(`/api/styles/${style.id}/fit`, { version: fit.version, baseSize, points, girths, cutAndSew, baseTextureId, compressionTextureId, cylinderDiametersIn, target });
    expect(spec.status).toBe(200);
    const graded = (await designer.get(calc(style.id))).json;
    expect(graded.figures.grading.mode).not.toBe('base-only');
    expect(grossGrams(graded, 'L')).toBeGreaterThan(grossGrams(graded, 'M'));
  });

  it('an outside account never gets the studio answer kept for the same style', async () => {
    const designer = await as('designer');
    const mill = await as('mill');
    const ridge = await styleByCode('HF27-101');
    expect(keysOf((await designer.get(calc(ridge.id, 'qty=M:3'))).json).has('pricePerKg')).toBe(true);
    expect(keysOf((await mill.get(calc(ridge.id, 'qty=M:3'))).json).has('pricePerKg')).toBe(false);
    expect(keysOf((await designer.get(calc(ridge.id, 'qty=M:3'))).json).has('pricePerKg')).toBe(true);
  });
});
