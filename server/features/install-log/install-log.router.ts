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
} from '../../../shared/schemas/install-log';
import type { AppDeps } from '../../app';
import { ValidationError } from '../../lib/errors';
import { buildAccess } from '../../middleware/build-access';
import { validate } from '../../middleware/validate';
import * as service from './install-log.service';

/** Mounted at /api/builds/:buildId (jobs, steps, checklist, fasteners, readings, sign-off, re-torque checks). */
export function installLogRouter(deps: AppDeps) {
  const router = Router({ mergeParams: true });
  const knex = deps.db.knex;
  const read = buildAccess(knex, 'install:read');
  const write = buildAccess(knex, 'install:write');
  const remove = buildAccess(knex, 'install:delete');
  const owner = buildAccess(knex, 'install:override');
  const caller = (req: Request): service.Caller => ({
    userId: req.user!.id,
    role: req.membership!.role,
  });
  const build = (req: Request) => req.membership!.buildId;
  const param = (req: Request, name: string) => String(req.params[name]);

  // Jobs
  router.get('/jobs', read, async (req, res) => {
    res.json({ jobs: await service.listJobs(knex, build(req), caller(req)) });
  });
  router.post('/jobs', write, validate({ body: createJobInputSchema }), async (req, res) => {
    res.status(201).json({ job: await service.createJob(knex, build(req), caller(req), req.body) });
  });
  router.get('/jobs/:jobId', read, async (req, res) => {
    res.json({ job: await service.getJob(knex, build(req), param(req, 'jobId'), caller(req)) });
  });
  router.patch(
    '/jobs/:jobId',
    write,
    validate({ body: updateJobInputSchema }),
    async (req, res) => {
      res.json({
        job: await service.updateJob(knex, build(req), param(req, 'jobId'), caller(req), req.body),
      });
    },
  );
  router.delete('/jobs/:jobId', remove, async (req, res) => {
    await service.deleteJob(knex, deps, build(req), param(req, 'jobId'));
    res.status(204).end();
  });

  // Steps
  router.post(
    '/jobs/:jobId/steps',
    write,
    validate({ body: createStepInputSchema }),
    async (req, res) => {
      res.status(201).json({
        step: await service.createStep(
          knex,
          build(req),
          param(req, 'jobId'),
          caller(req),
          req.body,
        ),
      });
    },
  );
  router.get('/steps/:stepId', read, async (req, res) => {
    res.json({ step: await service.getStep(knex, build(req), param(req, 'stepId'), caller(req)) });
  });
  router.patch(
    '/steps/:stepId',
    write,
    validate({ body: updateStepInputSchema }),
    async (req, res) => {
      res.json({
        step: await service.updateStep(
          knex,
          build(req),
          param(req, 'stepId'),
          caller(req),
          req.body,
        ),
      });
    },
  );
  router.delete('/steps/:stepId', remove, async (req, res) => {
    await service.deleteStep(knex, deps, build(req), param(req, 'stepId'), caller(req));
    res.status(204).end();
  });

  // Sign-off: owner and crew sign off; only the owner overrides blockers or reopens.
  router.post(
    '/steps/:stepId/sign-off',
    write,
    validate({ body: signOffInputSchema }),
    async (req, res) => {
      res.json({
        step: await service.signOff(knex, build(req), param(req, 'stepId'), caller(req), req.body),
      });
    },
  );
  router.delete('/steps/:stepId/sign-off', owner, async (req, res) => {
    res.json({ step: await service.reopen(knex, build(req), param(req, 'stepId'), caller(req)) });
  });

  // Checklist
  router.post(
    '/steps/:stepId/checklist',
    write,
    validate({ body: createChecklistItemInputSchema }),
    async (req, res) => {
      res.status(201).json({
        item: await service.addChecklistItem(
          knex,
          build(req),
          param(req, 'stepId'),
          caller(req),
          req.body,
        ),
      });
    },
  );
  router.patch(
    '/checklist/:itemId',
    write,
    validate({ body: updateChecklistItemInputSchema }),
    async (req, res) => {
      res.json({
        item: await service.updateChecklistItem(
          knex,
          build(req),
          param(req, 'itemId'),
          caller(req),
          req.body,
        ),
      });
    },
  );
  router.delete('/checklist/:itemId', remove, async (req, res) => {
    await service.deleteChecklistItem(knex, build(req), param(req, 'itemId'), caller(req));
    res.status(204).end();
  });

  // Fastener specs
  router.post(
    '/steps/:stepId/fasteners',
    write,
    validate({ body: createFastenerSpecInputSchema }),
    async (req, res) => {
      res.status(201).json({
        fastener: await service.addFastener(
          knex,
          build(req),
          param(req, 'stepId'),
          caller(req),
          req.body,
        ),
      });
    },
  );
  router.patch(
    '/fasteners/:specId',
    write,
    validate({ body: updateFastenerSpecInputSchema }),
    async (req, res) => {
      res.json({
        fastener: await service.updateFastener(
          knex,
          build(req),
          param(req, 'specId'),
          caller(req),
          req.body,
        ),
      });
    },
  );
  router.delete('/fasteners/:specId', remove, async (req, res) => {
    await service.deleteFastener(knex, build(req), param(req, 'specId'), caller(req));
    res.status(204).end();
  });

  // Readings: never edited; a new reading supersedes the current one for its position.
  router.get('/fasteners/:specId/readings', read, async (req, res) => {
    res.json(await service.listReadings(knex, build(req), param(req, 'specId'), caller(req)));
  });
  router.post(
    '/fasteners/:specId/readings',
    write,
    validate({ body: createReadingInputSchema }),
    async (req, res) => {
      res
        .status(201)
        .json(
          await service.recordReading(
            knex,
            build(req),
            param(req, 'specId'),
            caller(req),
            req.body,
          ),
        );
    },
  );

  // Re-torque checks
  router.get('/retorque-checks', read, async (req, res) => {
    const status = req.query.status ?? 'open';
    if (status !== 'open' && status !== 'all') {
      throw new ValidationError('Unknown filter', { status: 'Use open or all' });
    }
    res.json({ checks: await service.listRetorqueChecks(knex, build(req), caller(req), status) });
  });
  router.post(
    '/retorque-checks/:specId/close',
    write,
    validate({ body: closeRetorqueInputSchema }),
    async (req, res) => {
      res.json({
        check: await service.closeRetorqueCheck(
          knex,
          build(req),
          param(req, 'specId'),
          caller(req),
          req.body,
        ),
      });
    },
  );

  return router;
}
