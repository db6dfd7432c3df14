/**
 * Dyno sessions. Owner and crew record them and may assign one to a shop
 * member (the dyno shop); a shop records sessions at its own dyno — assigned
 * to itself — and sees only the sessions assigned to it; a viewer reads.
 * Lists and pages are read under a correction the caller chooses; the stored
 * figures are never corrected.
 */
import { buildReport, sessionReport, withoutCurves, type SessionReport } from '@shared/dyno';
import type {
  CorrectionChoice,
  CreateDynoSessionInput,
  DynoRun,
  DynoSessionSummary,
  UpdateDynoSessionInput,
} from '@shared/schemas/dyno';
import { can } from '@shared/permissions';
import { ForbiddenError, NotFoundError, ValidationError } from '@server/lib/errors';
import type { BuildScope } from '@server/lib/scope';
import * as files from '@server/features/files';
import * as members from '@server/features/members';
import { loadSession, sessionFilter } from './access';
import { loadPlan } from './plan';
import * as runsRepo from './runs.repository';
import * as repo from './sessions.repository';

/** The shop a session is assigned to: for a shop, itself; for owner and crew, a shop member of the build or none. */
async function assignee(
  scope: BuildScope,
  requested: string | null | undefined,
  current: string | null,
): Promise<string | null | undefined> {
  const { knex, buildId, caller } = scope;
  if (!can(caller.role, 'dyno:assign')) {
    // A shop: its sessions are its own dyno's.
    if (requested !== undefined && requested !== caller.userId) {
      throw new ForbiddenError('A shop records sessions at its own dyno; it cannot assign them');
    }
    return current === null ? caller.userId : undefined;
  }
  if (requested == null) return requested;
  const role = await members.findRole(knex, buildId, requested);
  if (role !== 'shop') {
    throw new ValidationError('Choose a shop on this build', {
      shopUserId: 'Choose a member of this build whose role is shop',
    });
  }
  return requested;
}

/** The build's sessions (a shop: its own), each with its best run, and the build's results against the plan. */
export async function listSessions(scope: BuildScope, choice: CorrectionChoice) {
  const { knex, buildId } = scope;
  const [sessions, plan] = await Promise.all([
    repo.listSessions(knex, buildId, sessionFilter(scope)),
    loadPlan(scope),
  ]);
  const runs = await runsRepo.listRuns(
    knex,
    buildId,
    sessions.map((s) => s.id),
  );
  const result = buildReport(
    sessions.map((s) => ({
      ...s,
      runs: runs.filter((r) => r.sessionId === s.id),
    })),
    choice,
    plan,
  );
  const reports = new Map(result.sessions.map((s) => [s.id, s.report]));
  return {
    sessions: sessions.map((s) => ({ ...s, best: bestSummary(reports.get(s.id)!, runs) })),
    summary: result.report,
    plan,
  };
}

/** A session's best run in a line: corrected peaks, rpm and the factor used. */
function bestSummary(report: SessionReport, runs: DynoRun[]): DynoSessionSummary['best'] {
  if (!report.best) return null;
  const entry = report.runs.find((r) => r.id === report.best!.id)!;
  const c = entry.corrected;
  return {
    runId: entry.id,
    runNumber: runs.find((r) => r.id === entry.id)?.runNumber ?? null,
    basis: c.basis,
    powerUnit: c.powerUnit,
    torqueUnit: c.torqueUnit,
    peakPower: c.corrected.power,
    peakPowerRpm: c.corrected.powerRpm,
    peakPowerHp: report.best.peakPowerHp,
    peakTorque: c.corrected.torque,
    peakTorqueRpm: c.corrected.torqueRpm,
    factor: c.correction.factor,
    applied: c.correction.applied,
    valid: c.correction.valid,
  };
}

/**
 * One session with its runs as stored (curves included, uncorrected), what
 * the build's plan says, and the report under `choice` — the page recomputes
 * the report itself when the owner switches standards, with the same code.
 */
export async function getSession(
  scope: BuildScope,
  rawSessionId: string,
  choice: CorrectionChoice,
) {
  const session = await loadSession(scope, rawSessionId);
  const [runs, plan] = await Promise.all([
    runsRepo.listRuns(scope.knex, scope.buildId, [session.id]),
    loadPlan(scope),
  ]);
  const shown = runs.map(runsRepo.present);
  return {
    session,
    runs: shown,
    plan,
    // Corrected curves are the stored curve × the factor: left out here to halve the answer.
    report: withoutCurves(sessionReport(session, shown, choice, plan)),
  };
}

export async function createSession(scope: BuildScope, input: CreateDynoSessionInput) {
  const shopUserId = await assignee(scope, input.shopUserId, null);
  const id = await repo.insertSession(scope.knex, scope.buildId, {
    ...input,
    place: input.place ?? '',
    runBy: input.runBy ?? '',
    notes: input.notes ?? '',
    weather: input.weather ?? null,
    shopUserId: shopUserId ?? null,
    createdBy: scope.caller.userId,
  });
  return loadSession(scope, id);
}

export async function updateSession(
  scope: BuildScope,
  rawSessionId: string,
  input: UpdateDynoSessionInput,
) {
  const session = await loadSession(scope, rawSessionId);
  const shopUserId = await assignee(scope, input.shopUserId, session.shop?.id ?? null);
  await repo.updateSession(scope.knex, session.id, {
    ...input,
    shopUserId: can(scope.caller.role, 'dyno:assign') ? shopUserId : undefined,
  });
  return loadSession(scope, session.id);
}

/** The session and its runs; their attachments are queued in the same statement and removed after. */
export async function deleteSession(
  scope: BuildScope,
  store: Omit<files.FilesCtx, 'knex'>,
  rawSessionId: string,
) {
  const session = await loadSession(scope, rawSessionId);
  const deleted = await repo.deleteSession(scope.knex, session.id);
  if (!deleted) throw new NotFoundError('Dyno session not found');
  await files.purgeSoon({ knex: scope.knex, ...store });
}
