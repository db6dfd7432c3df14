/** The install log's public surface: step visibility, for photos and notices of steps. */
import type { Knex } from 'knex';
import type { Caller } from '@server/lib/scope';
import { loadStep, visibleSteps as visibleIn } from './access';

/** Steps a caller may read: all of them (null), or for a shop only those linked to its parts. */
export const visibleSteps = (knex: Knex, buildId: string, caller: Caller) =>
  visibleIn({ knex, buildId, caller });

/** A step the caller may see, or 404 (a malformed id, another build's step, or hidden from a shop). */
export const getVisibleStep = (knex: Knex, buildId: string, rawStepId: string, caller: Caller) =>
  loadStep({ knex, buildId, caller }, rawStepId);

/** The whole log in full, for the build sheet. */
export { installRecord } from './record';
/** Each job's steps done and left, and the parts unfinished steps need: for the timeline. */
export {
  listJobProgress,
  listPartsNeededByOpenSteps,
  type JobProgress,
} from './progress.repository';
