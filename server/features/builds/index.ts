/** The builds feature's public surface. */
export { get, update, type KnownBuild } from './builds.service';
