// Prints "empty" when the database has no studio yet, "seeded" otherwise (used by db/demo.sh).
import knexFactory from 'knex';
import config from '../knexfile';

const knex = knexFactory(config);
try {
  const row = await knex('studios').count<{ count: string }[]>('* as count').first();
  process.stdout.write(Number(row?.count ?? 0) === 0 ? 'empty' : 'seeded');
} finally {
  await knex.destroy();
}
