/**
 * A fastener spec as the API shows it: its tolerance band, its target in the
 * other unit system, and each position's current fitting, stage and re-torque
 * reading, judged against the spec (shared/install-log, so the client judges
 * alike). A stage reading is judged against its stage's torque with the spec's
 * tolerance (a percentage of the stage, or the same ± amount).
 */
import { asksRetorque, describeRetorque } from '@shared/install-log/retorque';
import {
  judgeTorque,
  otherSystemUnit,
  restateTarget,
  toleranceBand,
} from '@shared/install-log/torque';
import type { FastenerSpec, TorqueReading } from '@shared/schemas/install-log';
import type { SpecRecord } from './fasteners.repository';
import type { ReadingRecord } from './readings.repository';

/** The torque a reading is judged against: its stage's, or the final one. */
function targetFor(spec: SpecRecord, stage: number | null) {
  const stageValue = stage != null ? spec.stages[stage - 1] : undefined;
  return stageValue != null ? { ...spec, targetValue: stageValue } : spec;
}

export function presentReading(r: ReadingRecord, spec: SpecRecord): TorqueReading {
  return { ...r, ...judgeTorque(r, targetFor(spec, r.stage)) };
}

export function presentSpec(spec: SpecRecord, readings: ReadingRecord[]): FastenerSpec {
  const judged = readings.filter((r) => r.specId === spec.id).map((r) => presentReading(r, spec));
  const positions = [];
  for (let position = 1; position <= spec.count; position++) {
    const here = judged.filter((r) => r.position === position);
    const live = here.filter((r) => !r.supersededAt);
    positions.push({
      position,
      current: live.find((r) => r.kind === 'install' && r.stage == null) ?? null,
      retorque: live.find((r) => r.kind === 'retorque') ?? null,
      stages: spec.stages.map((_, i) => live.find((r) => r.stage === i + 1) ?? null),
      supersededCount: here.filter((r) => r.supersededAt).length,
    });
  }
  const { retorqueClosedAt, retorqueClosedBy, retorqueCloseNote, ...fields } = spec;
  return {
    ...fields,
    band: toleranceBand(spec),
    alt: restateTarget(spec, otherSystemUnit(spec.targetUnit)),
    positions,
    retorque: {
      asked: asksRetorque(spec),
      description: describeRetorque(spec),
      closedAt: retorqueClosedAt,
      closedBy: retorqueClosedBy,
      closeNote: retorqueCloseNote,
    },
  };
}
