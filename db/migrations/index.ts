import type { Knex } from 'knex';
import * as m0001 from './20261202000100_create_users_and_sessions';
import * as m0002 from './20261202000200_create_builds_and_members';
import * as m0003 from './20261202000300_create_rate_limit_hits';
import * as m0010 from './20261202001000_create_parts';
import * as m0020 from './20261202002000_create_build_assumptions';
import * as m0030 from './20261202003000_create_mail_outbox';
import * as m0031 from './20261202003100_create_build_invitations';
import * as m0032 from './20261202003200_create_password_resets';
import * as m0033 from './20261202003300_create_notice_preferences';
import * as m0040 from './20261202004000_create_install_log';
import * as m0041 from './20261202004100_create_photos';
import * as m0050 from './20261202005000_create_file_deletions';
import * as m0051 from './20261202005100_create_invitation_sends';
import * as m0060 from './20261202006000_create_bench_sheets';
import * as m0070 from './20261202007000_create_dyno_sessions';
import * as m0080 from './20261202008000_add_reading_stages_and_position_names';
import * as m0081 from './20261202008100_create_torque_wrenches';
import * as m0082 from './20261202008200_add_step_caution_choices';
import * as m0083 from './20261202008300_create_part_overdue_notices';
import * as m0084 from './20261202008400_create_email_changes';
import * as m0090 from './20261202009000_create_timeline';
import * as m0095 from './20261202009500_create_build_shares';
import * as m0096 from './20261202009600_add_public_to_photos';
import * as m0100 from './20261203010000_create_idempotency_keys';
import * as m0101 from './20261203010100_add_reading_taken_at';

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
  '20261202002000_create_build_assumptions': m0020,
  '20261202003000_create_mail_outbox': m0030,
  '20261202003100_create_build_invitations': m0031,
  '20261202003200_create_password_resets': m0032,
  '20261202003300_create_notice_preferences': m0033,
  '20261202004000_create_install_log': m0040,
  '20261202004100_create_photos': m0041,
  '20261202005000_create_file_deletions': m0050,
  '20261202005100_create_invitation_sends': m0051,
  '20261202006000_create_bench_sheets': m0060,
  '20261202007000_create_dyno_sessions': m0070,
  '20261202008000_add_reading_stages_and_position_names': m0080,
  '20261202008100_create_torque_wrenches': m0081,
  '20261202008200_add_step_caution_choices': m0082,
  '20261202008300_create_part_overdue_notices': m0083,
  '20261202008400_create_email_changes': m0084,
  '20261202009000_create_timeline': m0090,
  '20261202009500_create_build_shares': m0095,
  '20261202009600_add_public_to_photos': m0096,
  '20261203010000_create_idempotency_keys': m0100,
  '20261203010100_add_reading_taken_at': m0101,
};

export const migrationSource: Knex.MigrationSource<string> = {
  getMigrations: async () => Object.keys(migrations),
  getMigrationName: (name) => name,
  getMigration: async (name) => migrations[name],
};
