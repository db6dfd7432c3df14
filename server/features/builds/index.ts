/** The builds feature's public surface. */
export { get, update } from './builds.service';
