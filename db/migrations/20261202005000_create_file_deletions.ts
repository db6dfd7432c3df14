import type { Knex } from 'knex';

/**
 * Stored files whose rows are gone, waiting to be removed from the store. A
 * trigger queues a row's file keys in the same transaction that deletes the
 * row — directly or by cascade from a part, step or build — so no file is
 * forgotten and none is removed while its row still exists. A worker removes
 * the files and retries a failure later, like the mail outbox.
 *
 * `queue_file_deletions(col, …)` is generic: a table that holds file keys adds
 * `after delete … for each row execute function queue_file_deletions('key_col', …)`.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('file_deletions', (t) => {
    t.bigIncrements('id');
    t.text('key').notNullable().unique();
    t.integer('attempts').notNullable().defaultTo(0);
    t.timestamp('next_attempt_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.text('last_error');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['next_attempt_at']);
  });
  await knex.raw(`
    create function queue_file_deletions() returns trigger language plpgsql as $$
    declare
      col text;
      file_key text;
    begin
      foreach col in array TG_ARGV loop
        execute format('select ($1).%I::text', col) into file_key using old;
        if file_key is not null and file_key <> '' then
          insert into file_deletions (key) values (file_key) on conflict (key) do nothing;
        end if;
      end loop;
      return old;
    end $$`);
  await knex.raw(`
    create trigger photos_queue_file_deletions after delete on photos
    for each row execute function queue_file_deletions('web_key', 'thumb_key')`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('drop trigger if exists photos_queue_file_deletions on photos');
  await knex.raw('drop function if exists queue_file_deletions()');
  await knex.schema.dropTable('file_deletions');
}
