/** The install log and the dyno days as BuildView shows them (see sharing.view.ts). */
import { formatNumber } from '@shared/format';
import { torqueUnitLabels } from '@shared/install-log/torque';
import { DEFAULT_CORRECTION_STANDARD } from '@shared/schemas/dyno';
import { threadConditionLabels } from '@shared/schemas/install-log';
import type { FastenerSpec, Step } from '@shared/schemas/install-log';
import type { ViewFastener } from '@shared/schemas/sharing';
import type { BuildScope } from '@server/lib/scope';
import * as dyno from '@server/features/dyno';

type Options = { kind: 'public' | 'member'; showNames: boolean };

function toleranceText(f: FastenerSpec) {
  const unit = torqueUnitLabels[f.targetUnit];
  return f.toleranceType === 'percent'
    ? `± ${formatNumber(f.toleranceValue, 1)} %`
    : `± ${formatNumber(f.toleranceValue, 1)} ${unit}`;
}

function viewFastener(f: FastenerSpec, kind: Options['kind']): ViewFastener {
  const current = f.positions.map((p) => p.current).filter((c) => c !== null);
  const out = f.positions.filter((p) => p.current && p.current.verdict !== 'in-spec');
  return {
    name: f.name,
    count: f.count,
    target: { value: f.targetValue, unit: torqueUnitLabels[f.targetUnit] },
    tolerance: toleranceText(f),
    threadCondition: threadConditionLabels[f.threadCondition],
    finalAngleDeg: f.finalAngleDeg,
    ...(kind === 'member' ? { specSource: f.specSource } : {}),
    recorded: current.length,
    inSpec: current.length - out.length,
    outOfSpec: out.length,
    outOfSpecPositions: out.map((p) => p.position),
    retorque: {
      asked: f.retorque.asked,
      description: f.retorque.asked ? f.retorque.description : null,
      closed: f.retorque.closedAt !== null,
    },
  };
}

export function viewInstall(jobs: { title: string; steps: Step[] }[], opts: Options) {
  const steps = jobs.flatMap((j) => j.steps);
  const fasteners = jobs.flatMap((j) => j.steps.flatMap((s) => s.fasteners));
  const viewJobs = jobs.map((j) => ({
    title: j.title,
    steps: j.steps.map((s) => ({
      title: s.title,
      status: s.status,
      checklist: { done: s.progress.checklistDone, total: s.progress.checklistTotal },
      signOff: s.signOff
        ? {
            on: s.signOff.at.slice(0, 10),
            by: opts.showNames ? (s.signOff.by?.name ?? null) : null,
            override: s.signOff.override !== null,
          }
        : null,
      fasteners: s.fasteners.map((f) => viewFastener(f, opts.kind)),
    })),
  }));
  const all = viewJobs.flatMap((j) => j.steps.flatMap((s) => s.fasteners));
  return {
    jobs: viewJobs,
    totals: {
      steps: steps.length,
      signedOff: steps.filter((s) => s.status === 'signed-off').length,
      underWay: steps.filter((s) => s.status === 'under-way').length,
      fasteners: fasteners.length,
      positionsTotal: fasteners.reduce((n, f) => n + f.count, 0),
      positionsRecorded: all.reduce((n, f) => n + f.recorded, 0),
      inSpec: all.reduce((n, f) => n + f.inSpec, 0),
      outOfSpec: all.reduce((n, f) => n + f.outOfSpec, 0),
    },
  };
}

export async function viewDyno(scope: BuildScope) {
  const standard = DEFAULT_CORRECTION_STANDARD;
  const { sessions, summary } = await dyno.listSessions(scope, { standard });
  const best = (b: (typeof sessions)[number]['best']) =>
    b && {
      basis: b.basis,
      peakPower: b.peakPower,
      powerUnit: b.powerUnit,
      peakPowerRpm: b.peakPowerRpm,
      peakTorque: b.peakTorque,
      torqueUnit: b.torqueUnit,
      peakTorqueRpm: b.peakTorqueRpm,
    };
  const top = summary.best ? sessions.find((s) => s.id === summary.best!.sessionId) : undefined;
  return {
    standard,
    best:
      top?.best && summary.best
        ? { ...best(top.best)!, date: top.date, peakPowerHp: Math.round(top.best.peakPowerHp) }
        : null,
    vsTarget: summary.vsTarget
      ? {
          progressPct: summary.vsTarget.progressPct.value,
          reached: summary.vsTarget.reached,
          achievedHp: summary.vsTarget.achieved.value,
          basis: top?.best?.basis ?? 'crank',
        }
      : null,
    sessions: sessions.map((s) => ({
      date: s.date,
      dynoKind: s.dynoKind,
      runCount: s.runCount,
      best: best(s.best),
    })),
  };
}
