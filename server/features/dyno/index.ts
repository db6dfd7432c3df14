/** The dyno feature's public surface: sessions with their best runs, for the build sheet. */
export { listSessions } from './sessions.service';
