/** The estimate feature's public surface: a build's estimate and its assumptions, for dyno results. */
export { estimateBuild, getAssumptions } from './estimate.service';
