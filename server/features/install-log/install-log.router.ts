import { Router, type Request } from 'express';
import {
  closeRetorqueInputSchema,
  createChecklistItemInputSchema,
  createFastenerSpecInputSchema,
  createJobInputSchema,
  createReadingInputSchema,
  createStepInputSchema,
  signOffInputSchema,
  updateChecklistItemInputSchema,
  updateFastenerSpecInputSchema,
  updateJobInputSchema,
  updateStepInputSchema,
} from '@shared/schemas/install-log';
import type { AppDeps } from '@server/lib/deps';
import { ValidationError } from '@server/lib/errors';
import { idempotentScoped } from '@server/lib/idempotency';
import { param, scoped } from '@server/lib/scope';
import { validate } from '@server/middleware/validate';
import * as checklist from './checklist.service';
import * as fasteners from './fasteners.service';
import * as jobs from './jobs.service';
import * as retorque from './retorque.service';
import * as steps from './steps.service';

/**
 * The install log's routers, one per entity, each mounted once in server/routes.ts:
 * jobs, steps (with sign-off, checklist and fastener creation), checklist items,
 * fasteners (with readings) and re-torque checks.
 */
function access(deps: AppDeps) {
  return {
    read: deps.access('install:read'),
    write: deps.access('install:write'),
    remove: deps.access('install:delete'),
    owner: deps.access('install:override'),
    knex: deps.db.knex,
    store: { storage: deps.storage, logger: deps.logger },
  };
}

/** Mounted at /api/builds/:buildId/jobs. */
export function jobsRouter(deps: AppDeps) {
  const router = Router({ mergeParams: true });
  const { read, write, remove, knex, store } = access(deps);
  const body = { create: createJobInputSchema, update: updateJobInputSchema };
  router.get(
    '/',
    read,
    scoped(knex, async (s) => ({ jobs: await jobs.listJobs(s) })),
  );
  router.post(
    '/',
    write,
    validate({ body: body.create }),
    scoped(knex, async (s, req) => ({ job: await jobs.createJob(s, req.body) }), 201),
  );
  router.get(
    '/:jobId',
    read,
    scoped(knex, async (s, req) => ({ job: await jobs.getJob(s, param(req, 'jobId')) })),
  );
  router.patch(
    '/:jobId',
    write,
    validate({ body: body.update }),
    scoped(knex, async (s, req) => ({
      job: await jobs.updateJob(s, param(req, 'jobId'), req.body),
    })),
  );
  router.delete(
    '/:jobId',
    remove,
    scoped(knex, (s, req) => jobs.deleteJob(s, store, param(req, 'jobId'))),
  );
  router.post(
    '/:jobId/steps',
    write,
    validate({ body: createStepInputSchema }),
    scoped(
      knex,
      async (s, req) => ({ step: await steps.createStep(s, param(req, 'jobId'), req.body) }),
      201,
    ),
  );
  return router;
}

/** Mounted at /api/builds/:buildId/steps. Sign-off: owner and crew; only the owner overrides blockers or reopens. */
export function stepsRouter(deps: AppDeps) {
  const router = Router({ mergeParams: true });
  const { read, write, remove, owner, knex, store } = access(deps);
  const id = (req: Request) => param(req, 'stepId');
  router.get(
    '/:stepId',
    read,
    scoped(knex, async (s, req) => ({ step: await steps.getStep(s, id(req)) })),
  );
  router.patch(
    '/:stepId',
    write,
    validate({ body: updateStepInputSchema }),
    scoped(knex, async (s, req) => ({ step: await steps.updateStep(s, id(req), req.body) })),
  );
  router.delete(
    '/:stepId',
    remove,
    scoped(knex, (s, req) => steps.deleteStep(s, store, id(req))),
  );
  router.post(
    '/:stepId/sign-off',
    write,
    validate({ body: signOffInputSchema }),
    scoped(knex, async (s, req) => ({ step: await steps.signOff(s, id(req), req.body) })),
  );
  router.delete(
    '/:stepId/sign-off',
    owner,
    scoped(knex, async (s, req) => ({ step: await steps.reopen(s, id(req)) })),
  );
  router.post(
    '/:stepId/checklist',
    write,
    validate({ body: createChecklistItemInputSchema }),
    scoped(
      knex,
      async (s, req) => ({ item: await checklist.addChecklistItem(s, id(req), req.body) }),
      201,
    ),
  );
  router.post(
    '/:stepId/fasteners',
    write,
    validate({ body: createFastenerSpecInputSchema }),
    scoped(
      knex,
      async (s, req) => ({ fastener: await fasteners.addFastener(s, id(req), req.body) }),
      201,
    ),
  );
  return router;
}

/** Mounted at /api/builds/:buildId/checklist. */
export function checklistRouter(deps: AppDeps) {
  const router = Router({ mergeParams: true });
  const { write, remove, knex } = access(deps);
  const id = (req: Request) => param(req, 'itemId');
  router.patch(
    '/:itemId',
    write,
    validate({ body: updateChecklistItemInputSchema }),
    scoped(knex, async (s, req) => ({
      item: await checklist.updateChecklistItem(s, id(req), req.body),
    })),
  );
  router.delete(
    '/:itemId',
    remove,
    scoped(knex, (s, req) => checklist.deleteChecklistItem(s, id(req))),
  );
  return router;
}

/**
 * Mounted at /api/builds/:buildId/fasteners. Readings are never edited: a new one supersedes
 * the current one. Recording one takes an Idempotency-Key (the offline queue sends it).
 */
export function fastenersRouter(deps: AppDeps) {
  const router = Router({ mergeParams: true });
  const { read, write, remove, knex } = access(deps);
  const id = (req: Request) => param(req, 'specId');
  router.patch(
    '/:specId',
    write,
    validate({ body: updateFastenerSpecInputSchema }),
    scoped(knex, async (s, req) => ({
      fastener: await fasteners.updateFastener(s, id(req), req.body),
    })),
  );
  router.delete(
    '/:specId',
    remove,
    scoped(knex, (s, req) => fasteners.deleteFastener(s, id(req))),
  );
  router.get(
    '/:specId/readings',
    read,
    scoped(knex, (s, req) => fasteners.listReadings(s, id(req))),
  );
  router.post(
    '/:specId/readings',
    write,
    validate({ body: createReadingInputSchema }),
    idempotentScoped(knex, (s, req) => fasteners.recordReading(s, id(req), req.body)),
  );
  return router;
}

/** Mounted at /api/builds/:buildId/retorque-checks. */
export function retorqueRouter(deps: AppDeps) {
  const router = Router({ mergeParams: true });
  const { read, write, knex } = access(deps);
  router.get(
    '/',
    read,
    scoped(knex, async (s, req) => {
      const status = req.query.status ?? 'open';
      if (status !== 'open' && status !== 'all') {
        throw new ValidationError('Unknown filter', { status: 'Use open or all' });
      }
      return { checks: await retorque.listRetorqueChecks(s, status) };
    }),
  );
  router.post(
    '/:specId/close',
    write,
    validate({ body: closeRetorqueInputSchema }),
    scoped(knex, async (s, req) => ({
      check: await retorque.closeRetorqueCheck(s, param(req, 'specId'), req.body),
    })),
  );
  return router;
}
