/**
 * Sessions and password hashing — the only module that knows lucia exists, so
 * sessions can move to another library without touching routes or services.
 */
import { hash, verify } from '@node-rs/argon2';
import { NodePostgresAdapter } from '@lucia-auth/adapter-postgresql';
import { Lucia, TimeSpan } from 'lucia';
import type { Request, Response } from 'express';
import type pg from 'pg';
import type { Role } from '@shared/permissions';
import * as sessionsRepo from './sessions.repository';

export const SESSION_COOKIE = 'headroom_session';

declare module 'lucia' {
  interface Register {
    Lucia: Lucia<Record<never, never>, { email: string; displayName: string }>;
    DatabaseUserAttributes: { email: string; display_name: string };
  }
}

export type SessionUser = { id: string; email: string; displayName: string };

/** The caller's role on the build in the path, found with the session, and that build's row. */
export type SessionMembership = {
  buildId: string;
  role: Role | null;
  build: sessionsRepo.BuildRowJson | null;
};

const sessionTerm = new TimeSpan(30, 'd');

// OWASP's argon2id baseline (19 MiB, 2 passes, 1 lane); @node-rs/argon2 defaults to argon2id.
const hashOptions = { memoryCost: 19456, timeCost: 2, parallelism: 1 };

export async function hashPassword(password: string): Promise<string> {
  return hash(password, hashOptions);
}

// Checked when no account matches, so a wrong e-mail costs as long as a wrong
// password: the argon2 check runs either way. Made once, with the same options.
let dummyHash: Promise<string> | undefined;
const dummy = () => (dummyHash ??= hashPassword('not-a-real-password-for-timing'));

/** How many argon2 checks ran in this process: lets a test see the check run for an unknown address. */
export const passwordChecks = { count: 0 };

export async function verifyPassword(
  storedHash: string | null,
  password: string,
): Promise<boolean> {
  const hashToCheck = storedHash ?? (await dummy());
  passwordChecks.count++;
  const ok = await verify(hashToCheck, password).catch(() => false);
  return storedHash ? ok : false;
}

export function createSessions(pool: pg.Pool) {
  const adapter = new NodePostgresAdapter(pool, { user: 'users', session: 'user_sessions' });
  const lucia = new Lucia(adapter, {
    // Sessions last 30 days and are extended when used in their second half.
    sessionExpiresIn: sessionTerm,
    sessionCookie: { name: SESSION_COOKIE, attributes: { sameSite: 'lax' } },
    getUserAttributes: (a) => ({ email: a.email, displayName: a.display_name }),
  });

  function writeCookie(
    req: Request,
    res: Response,
    cookie: ReturnType<Lucia['createSessionCookie']>,
  ) {
    res.cookie(cookie.name, cookie.value, {
      httpOnly: true,
      sameSite: 'lax',
      path: '/',
      secure: req.secure,
      maxAge: (cookie.attributes.maxAge ?? 0) * 1000,
    });
  }

  return {
    async start(req: Request, res: Response, userId: string) {
      const session = await lucia.createSession(userId, {});
      writeCookie(req, res, lucia.createSessionCookie(session.id));
      return session;
    },

    /**
     * Signs this browser in as userId, ending the session it held before (if any),
     * so a shared computer never keeps the previous person's session alive.
     */
    async replace(req: Request, res: Response, userId: string) {
      if (req.sessionId) await lucia.invalidateSession(req.sessionId);
      const session = await lucia.createSession(userId, {});
      writeCookie(req, res, lucia.createSessionCookie(session.id));
      return session;
    },

    /**
     * Reads the cookie and validates the session with lucia's rules (expired:
     * deleted and the cookie cleared; in its second half: extended to a full
     * term and the cookie renewed), in one statement that also brings the
     * user's role on `buildId` when the request is about a build, and the build.
     */
    async resume(
      req: Request,
      res: Response,
      buildId: string | null = null,
    ): Promise<{
      user: SessionUser;
      sessionId: string;
      membership: SessionMembership | null;
    } | null> {
      const id = lucia.readSessionCookie(req.headers.cookie ?? '');
      if (!id) return null;
      const row = await sessionsRepo.findSession(pool, id, buildId);
      const now = Date.now();
      if (!row || row.expires_at.getTime() <= now) {
        if (row) await sessionsRepo.deleteSession(pool, id);
        writeCookie(req, res, lucia.createBlankSessionCookie());
        return null;
      }
      if (row.expires_at.getTime() - sessionTerm.milliseconds() / 2 <= now) {
        await sessionsRepo.extendSession(pool, id, new Date(now + sessionTerm.milliseconds()));
        writeCookie(req, res, lucia.createSessionCookie(id));
      }
      return {
        user: { id: row.user_id, email: row.email, displayName: row.display_name },
        sessionId: id,
        membership: buildId ? { buildId, role: row.role, build: row.build } : null,
      };
    },

    async end(req: Request, res: Response, sessionId: string) {
      await lucia.invalidateSession(sessionId);
      writeCookie(req, res, lucia.createBlankSessionCookie());
    },

    async endAllFor(userId: string) {
      await lucia.invalidateUserSessions(userId);
    },

    async deleteExpired() {
      await lucia.deleteExpiredSessions();
    },
  };
}
export type Sessions = ReturnType<typeof createSessions>;
