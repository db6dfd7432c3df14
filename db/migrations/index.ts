import type { Knex } from 'knex';
import * as m0001 from './20261202000100_create_users_and_sessions';
import * as m0002 from './20261202000200_create_builds_and_members';
import * as m0003 from './20261202000300_create_rate_limit_hits';
import * as m0010 from './20261202001000_create_parts';

type Migration = { up: (knex: Knex) => Promise<void>; down: (knex: Knex) => Promise<void> };

/**
 * Every migration, in order. Listed explicitly (not read from the folder) so the
 * same source works under tsx, Vitest and the knex CLI. Add new files at the end.
 */
const migrations: Record<string, Migration> = {
  '20261202000100_create_users_and_sessions': m0001,
  '20261202000200_create_builds_and_members': m0002,
  '20261202000300_create_rate_limit_hits': m0003,
  '20261202001000_create_parts': m0010,
};

export const migrationSource: Knex.MigrationSource<string> = {
  getMigrations: async () => Object.keys(migrations),
  getMigrationName: (name) => name,
  getMigration: async (name) => migrations[name],
};
