import type { Role } from '@shared/permissions';
import type { SessionMembership, SessionUser } from './auth';
import type { BuildRowJson } from './sessions.repository';

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      user?: SessionUser;
      sessionId?: string;
      /**
       * Set by buildAccess(): the caller's role on the build in the path, and the
       * build's row when it came with the session (reads may start from it).
       */
      membership?: { buildId: string; role: Role; build?: BuildRowJson };
      /** Set by loadSession(): the role found with the session for the build in the path, if any. */
      sessionMembership?: SessionMembership | null;
    }
  }
}

export {};
