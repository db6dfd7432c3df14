/**
 * A test file's own migrated database, for tests that run a worker over a
 * queue every app shares (the file-removal queue): with the shared test
 * database, another file's app could claim its rows.
 */
import { randomUUID } from 'node:crypto';
import knexFactory from 'knex';
import { knexConfig } from '@db/knexfile';

async function adminQuery(baseUrl: string, sql: string) {
  const admin = knexFactory(knexConfig(baseUrl));
  try {
    await admin.raw(sql);
  } finally {
    await admin.destroy();
  }
}

export async function createOwnDatabase(baseUrl: string) {
  const name = `hr_own_${randomUUID().replace(/-/g, '').slice(0, 16)}`;
  await adminQuery(baseUrl, `create database "${name}"`);
  const url = new URL(baseUrl);
  url.pathname = `/${name}`;
  const databaseUrl = url.toString();
  const migrator = knexFactory(knexConfig(databaseUrl));
  try {
    await migrator.migrate.latest();
  } finally {
    await migrator.destroy();
  }
  return {
    databaseUrl,
    /** After every pool on it is closed. */
    drop: () => adminQuery(baseUrl, `drop database if exists "${name}" with (force)`),
  };
}
