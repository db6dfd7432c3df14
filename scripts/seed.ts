// Seeds the demo build when the database has no users yet; never touches real data.
import knexFactory from 'knex';
import { knexConfig } from '@db/knexfile';
import { seedDemo } from '@db/seeds/demo';
import { createStorage } from '@server/lib/stores';
import { objectStoreFromEnv } from '@server/storage-config';

const url = process.env.DATABASE_URL;
if (!url) {
  console.error('DATABASE_URL is not set');
  process.exit(1);
}
const knex = knexFactory(knexConfig(url));
try {
  const { count } = (await knex('users').count<{ count: string }[]>('* as count'))[0];
  if (Number(count) > 0 && !process.argv.includes('--force')) {
    console.log('database already has accounts: demo data not added');
  } else {
    // Demo photos go where the server will read them: STORAGE_DIR, or the object store with STORAGE=s3.
    const storage = createStorage({
      storageDir: process.env.STORAGE_DIR ?? '.data/uploads',
      objectStore: objectStoreFromEnv(),
    });
    try {
      await knex.transaction((trx) => seedDemo(trx, { storage }));
    } finally {
      storage.close?.();
    }
    console.log('demo data added');
  }
} finally {
  await knex.destroy();
}
