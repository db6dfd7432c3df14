/** The builds feature's public surface. */
export { calendar, get, update, type KnownBuild } from './builds.service';
