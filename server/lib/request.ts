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
    }
  }
}

export {};
