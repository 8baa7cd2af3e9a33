import { afterAll, describe, expect, inject, it } from 'vitest';
import knexFactory from 'knex';
import { chartLimits } from '@/lib/library/chart';

const knex = knexFactory({ client: 'pg', connection: inject('databaseUrl'), pool: { min: 0, max: 1 } });
afterAll(async () => { await knex.destroy(); });

/** Sets a stored texture's repeat to `needles` wide (cells all knit), inside a transaction that is rolled back. */
async function widen(needles: number, courses?: number): Promise<unknown> {
  const trx = await knex.transaction();
  try {
    const row = (await trx('textures').orderBy('name').first('id', 'repeat_courses', 'feeders')) as { id: string; repeat_courses: number; feeders: unknown[] };
    const c = courses ?? row.repeat_courses;
    const feeders = Array.from({ length: c }, (_, i) => row.feeders[i % row.feeders.length]);
    await trx('textures').where({ id: row.id }).update({
      repeat_needles: needles,
      repeat_courses: c,
      cells: Array.from({ length: c }, () => 'k'.repeat(needles)),
      feeders: JSON.stringify(feeders),
    });
    return null;
  } catch (err) {
    return err;
  } finally {
    await trx.rollback();
  }
}

describe('the textures table caps the repeat where the chart editor does', () => {
  it('accepts chartLimits and refuses one needle or course more by the repeat check', async () => {
    expect(await widen(chartLimits.maxNeedles)).toBeNull();
    expect(await widen(chartLimits.maxNeedles, chartLimits.maxCourses)).toBeNull();
    expect(await widen(chartLimits.maxNeedles + 1)).toMatchObject({ constraint: 'textures_repeat_check' });
    expect(await widen(4, chartLimits.maxCourses + 1)).toMatchObject({ constraint: 'textures_repeat_check' });
  });
});
