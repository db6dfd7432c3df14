/**
 * A fastener spec as the API shows it: its tolerance band, its target in the
 * other unit system, and each position's current fitting and re-torque reading,
 * judged against the spec (shared/install-log, so the client judges alike).
 */
import { asksRetorque, describeRetorque } from '../../../shared/install-log/retorque';
import {
  judgeTorque,
  otherSystemUnit,
  restateTarget,
  toleranceBand,
} from '../../../shared/install-log/torque';
import type { FastenerSpec, TorqueReading } from '../../../shared/schemas/install-log';
import type { SpecRecord } from './fasteners.repository';
import type { ReadingRecord } from './readings.repository';

export function presentReading(r: ReadingRecord, spec: SpecRecord): TorqueReading {
  return { ...r, ...judgeTorque(r, spec) };
}

export function presentSpec(spec: SpecRecord, readings: ReadingRecord[]): FastenerSpec {
  const judged = readings.filter((r) => r.specId === spec.id).map((r) => presentReading(r, spec));
  const positions = [];
  for (let position = 1; position <= spec.count; position++) {
    const here = judged.filter((r) => r.position === position);
    positions.push({
      position,
      current: here.find((r) => r.kind === 'install' && !r.supersededAt) ?? null,
      retorque: here.find((r) => r.kind === 'retorque' && !r.supersededAt) ?? null,
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
