import type { Role } from '../../shared/permissions';
import type { SessionUser } from './auth';

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      user?: SessionUser;
      sessionId?: string;
      /** Set by buildAccess(): the caller's role on the build in the path. */
      membership?: { buildId: string; role: Role };
      /** Set by loadSession(): the role found with the session for the build in the path, if any. */
      sessionMembership?: { buildId: string; role: Role | null } | null;
    }
  }
}

export {};
