/** The builds feature's public surface. */
export { calendar, get, update } from './builds.service';
