/**
 * The session lookup every signed-in request makes, in one statement: the
 * session, its user and — when the request is about a build — the user's role
 * on that build and, for a member, the build's row (most build reads start from
 * it, so they need not ask again). Sessions are lucia's table (user_sessions);
 * lucia still creates and ends them (lib/auth.ts), this only reads and extends them.
 *
 * A named statement: PostgreSQL plans it once per connection instead of on
 * every request.
 */
import type pg from 'pg';
import type { Role } from '@shared/permissions';

export type SessionRow = {
  id: string;
  expires_at: Date;
  user_id: string;
  email: string;
  display_name: string;
  /** The user's role on the build asked about; null when not a member or none asked. */
  role: Role | null;
  /** With a role: the build's row as JSON (timestamps as ISO strings) and its member count. */
  build: BuildRowJson | null;
};

/** A builds row as to_jsonb gives it, plus member_count; the builds feature reads it. */
export type BuildRowJson = Record<string, unknown> & { id: string; member_count: number };

export async function findSession(
  pool: pg.Pool,
  sessionId: string,
  buildId: string | null,
): Promise<SessionRow | undefined> {
  const { rows } = await pool.query<SessionRow>({
    name: 'session-with-build',
    text: `select s.id, s.expires_at, u.id as user_id, u.email, u.display_name, m.role,
       case when m.role is not null then to_jsonb(b) || jsonb_build_object('member_count',
         (select count(*) from build_members c where c.build_id = b.id)) end as build
     from user_sessions s
     join users u on u.id = s.user_id
     left join build_members m on m.user_id = u.id and m.build_id = $2::uuid
     left join builds b on b.id = m.build_id
     where s.id = $1`,
    values: [sessionId, buildId],
  });
  return rows[0];
}

export async function extendSession(pool: pg.Pool, sessionId: string, expiresAt: Date) {
  await pool.query('update user_sessions set expires_at = $1 where id = $2', [
    expiresAt,
    sessionId,
  ]);
}

export async function deleteSession(pool: pg.Pool, sessionId: string) {
  await pool.query('delete from user_sessions where id = $1', [sessionId]);
}
