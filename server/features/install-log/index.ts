/** The install log's public surface: step visibility, for photos and notices of steps. */
export { loadStep as getVisibleStep, visibleSteps } from './install-log.service';
