import { afterAll, describe, expect, it } from 'vitest';
import { as } from './helpers';

const path = '/api/settings/machine-limits';
// The product defaults of lib/rules/types.ts (common practice, no published source).
const defaults = { maxFloatMm: 6, maxTuckStack: 4 };

afterAll(async () => {
  await (await as('admin')).put(path, { limits: { maxFloatMm: null, maxTuckStack: null } });
});

describe('studio machine limits', () => {
  it('reads the defaults with their source until the admin sets the studio own; the designer reads, never writes', async () => {
    const admin = await as('admin');
    const designer = await as('designer');
    await admin.put(path, { limits: { maxFloatMm: null, maxTuckStack: null } });

    const before = await designer.get(path);
    expect(before.status).toBe(200);
    expect(before.json.machineLimits).toEqual({ limits: defaults, source: { maxFloatMm: 'default', maxTuckStack: 'default' } });

    expect((await designer.put(path, { limits: { maxFloatMm: 9, maxTuckStack: null } })).status).toBe(403);
    expect((await (await as('colour-lead')).put(path, { limits: { maxFloatMm: 9, maxTuckStack: null } })).status).toBe(403);

    const set = await admin.put(path, { limits: { maxFloatMm: 7.5, maxTuckStack: null } });
    expect(set.status).toBe(200);
    expect(set.json.machineLimits).toEqual({ limits: { maxFloatMm: 7.5, maxTuckStack: 4 }, source: { maxFloatMm: 'studio', maxTuckStack: 'default' } });

    const after = await designer.get(path);
    expect(after.json.machineLimits.limits.maxFloatMm).toBe(7.5);
    expect(after.json.machineLimits.source.maxFloatMm).toBe('studio');

    // Another studio keeps its own (here: the defaults).
    const other = await (await as('otherStudioAdmin')).get(path);
    expect(other.json.machineLimits.source).toEqual({ maxFloatMm: 'default', maxTuckStack: 'default' });

    // Blank goes back to the default.
    const reset = await admin.put(path, { limits: { maxFloatMm: null, maxTuckStack: 3 } });
    expect(reset.json.machineLimits).toEqual({ limits: { maxFloatMm: 6, maxTuckStack: 3 }, source: { maxFloatMm: 'default', maxTuckStack: 'studio' } });
  });

  it('answers 400 with field errors for bad limits and changes nothing', async () => {
    const admin = await as('admin');
    await admin.put(path, { limits: { maxFloatMm: 8, maxTuckStack: 5 } });
    const cases: [unknown, string][] = [
      [{ limits: { maxFloatMm: 'long', maxTuckStack: null } }, 'limits.maxFloatMm'],
      [{ limits: { maxFloatMm: 0, maxTuckStack: null } }, 'limits.maxFloatMm'],
      [{ limits: { maxFloatMm: 500, maxTuckStack: null } }, 'limits.maxFloatMm'],
      [{ limits: { maxFloatMm: null, maxTuckStack: 2.5 } }, 'limits.maxTuckStack'],
      [{ limits: { maxFloatMm: null, maxTuckStack: 0 } }, 'limits.maxTuckStack'],
    ];
    for (const [body, field] of cases) {
      const res = await admin.put(path, body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(res.json.fieldErrors[field], JSON.stringify(body)).toBeDefined();
    }
    expect((await admin.put(path, { limits: { maxFloatMm: 8, maxTuckStack: 5, maxYarns: 3 } })).status).toBe(400);
    expect((await admin.put(path, 'not json')).status).toBe(400);
    const now = (await admin.get(path)).json.machineLimits;
    expect(now.limits).toEqual({ maxFloatMm: 8, maxTuckStack: 5 });
  });

  it('client and mill accounts may not read them', async () => {
    for (const who of ['client', 'mill'] as const) expect((await (await as(who)).get(path)).status).toBe(403);
  });
});
