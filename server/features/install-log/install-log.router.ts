import { Router } from 'express';
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
} from '../../../shared/schemas/install-log';
import type { AppDeps } from '../../lib/deps';
import { ValidationError } from '../../lib/errors';
import { param, scoped } from '../../lib/scope';
import { validate } from '../../middleware/validate';
import * as service from './install-log.service';

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
    files: { storage: deps.storage, logger: deps.logger },
  };
}

/** Mounted at /api/builds/:buildId/jobs. */
export function jobsRouter(deps: AppDeps) {
  const router = Router({ mergeParams: true });
  const { read, write, remove, knex, files } = access(deps);
  router.get(
    '/',
    read,
    scoped(knex, async (s) => ({ jobs: await service.listJobs(s.knex, s.buildId, s.caller) })),
  );
  router.post(
    '/',
    write,
    validate({ body: createJobInputSchema }),
    scoped(
      knex,
      async (s, req) => ({ job: await service.createJob(s.knex, s.buildId, s.caller, req.body) }),
      201,
    ),
  );
  router.get(
    '/:jobId',
    read,
    scoped(knex, async (s, req) => ({
      job: await service.getJob(s.knex, s.buildId, param(req, 'jobId'), s.caller),
    })),
  );
  router.patch(
    '/:jobId',
    write,
    validate({ body: updateJobInputSchema }),
    scoped(knex, async (s, req) => ({
      job: await service.updateJob(s.knex, s.buildId, param(req, 'jobId'), s.caller, req.body),
    })),
  );
  router.delete(
    '/:jobId',
    remove,
    scoped(knex, (s, req) => service.deleteJob(s.knex, files, s.buildId, param(req, 'jobId'))),
  );
  router.post(
    '/:jobId/steps',
    write,
    validate({ body: createStepInputSchema }),
    scoped(
      knex,
      async (s, req) => ({
        step: await service.createStep(s.knex, s.buildId, param(req, 'jobId'), s.caller, req.body),
      }),
      201,
    ),
  );
  return router;
}

/** Mounted at /api/builds/:buildId/steps. Sign-off: owner and crew; only the owner overrides blockers or reopens. */
export function stepsRouter(deps: AppDeps) {
  const router = Router({ mergeParams: true });
  const { read, write, remove, owner, knex, files } = access(deps);
  router.get(
    '/:stepId',
    read,
    scoped(knex, async (s, req) => ({
      step: await service.getStep(s.knex, s.buildId, param(req, 'stepId'), s.caller),
    })),
  );
  router.patch(
    '/:stepId',
    write,
    validate({ body: updateStepInputSchema }),
    scoped(knex, async (s, req) => ({
      step: await service.updateStep(s.knex, s.buildId, param(req, 'stepId'), s.caller, req.body),
    })),
  );
  router.delete(
    '/:stepId',
    remove,
    scoped(knex, (s, req) =>
      service.deleteStep(s.knex, files, s.buildId, param(req, 'stepId'), s.caller),
    ),
  );
  router.post(
    '/:stepId/sign-off',
    write,
    validate({ body: signOffInputSchema }),
    scoped(knex, async (s, req) => ({
      step: await service.signOff(s.knex, s.buildId, param(req, 'stepId'), s.caller, req.body),
    })),
  );
  router.delete(
    '/:stepId/sign-off',
    owner,
    scoped(knex, async (s, req) => ({
      step: await service.reopen(s.knex, s.buildId, param(req, 'stepId'), s.caller),
    })),
  );
  router.post(
    '/:stepId/checklist',
    write,
    validate({ body: createChecklistItemInputSchema }),
    scoped(
      knex,
      async (s, req) => ({
        item: await service.addChecklistItem(
          s.knex,
          s.buildId,
          param(req, 'stepId'),
          s.caller,
          req.body,
        ),
      }),
      201,
    ),
  );
  router.post(
    '/:stepId/fasteners',
    write,
    validate({ body: createFastenerSpecInputSchema }),
    scoped(
      knex,
      async (s, req) => ({
        fastener: await service.addFastener(
          s.knex,
          s.buildId,
          param(req, 'stepId'),
          s.caller,
          req.body,
        ),
      }),
      201,
    ),
  );
  return router;
}

/** Mounted at /api/builds/:buildId/checklist. */
export function checklistRouter(deps: AppDeps) {
  const router = Router({ mergeParams: true });
  const { write, remove, knex } = access(deps);
  router.patch(
    '/:itemId',
    write,
    validate({ body: updateChecklistItemInputSchema }),
    scoped(knex, async (s, req) => ({
      item: await service.updateChecklistItem(
        s.knex,
        s.buildId,
        param(req, 'itemId'),
        s.caller,
        req.body,
      ),
    })),
  );
  router.delete(
    '/:itemId',
    remove,
    scoped(knex, (s, req) =>
      service.deleteChecklistItem(s.knex, s.buildId, param(req, 'itemId'), s.caller),
    ),
  );
  return router;
}

/** Mounted at /api/builds/:buildId/fasteners. Readings are never edited: a new one supersedes the current one. */
export function fastenersRouter(deps: AppDeps) {
  const router = Router({ mergeParams: true });
  const { read, write, remove, knex } = access(deps);
  router.patch(
    '/:specId',
    write,
    validate({ body: updateFastenerSpecInputSchema }),
    scoped(knex, async (s, req) => ({
      fastener: await service.updateFastener(
        s.knex,
        s.buildId,
        param(req, 'specId'),
        s.caller,
        req.body,
      ),
    })),
  );
  router.delete(
    '/:specId',
    remove,
    scoped(knex, (s, req) =>
      service.deleteFastener(s.knex, s.buildId, param(req, 'specId'), s.caller),
    ),
  );
  router.get(
    '/:specId/readings',
    read,
    scoped(knex, (s, req) =>
      service.listReadings(s.knex, s.buildId, param(req, 'specId'), s.caller),
    ),
  );
  router.post(
    '/:specId/readings',
    write,
    validate({ body: createReadingInputSchema }),
    scoped(
      knex,
      (s, req) =>
        service.recordReading(s.knex, s.buildId, param(req, 'specId'), s.caller, req.body),
      201,
    ),
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
      return { checks: await service.listRetorqueChecks(s.knex, s.buildId, s.caller, status) };
    }),
  );
  router.post(
    '/:specId/close',
    write,
    validate({ body: closeRetorqueInputSchema }),
    scoped(knex, async (s, req) => ({
      check: await service.closeRetorqueCheck(
        s.knex,
        s.buildId,
        param(req, 'specId'),
        s.caller,
        req.body,
      ),
    })),
  );
  return router;
}
