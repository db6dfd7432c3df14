/** The builds feature's public surface. */
export { get } from './builds.service';
