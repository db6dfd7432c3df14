/**
 * When a step may be signed off. Sign-off rule: a step is ready when every
 * position of every fastener has a current reading (the newest, not superseded)
 * that is in spec, and every checklist item is ticked. Anything else is a
 * blocker; only the build's owner may sign off over blockers, and must give a
 * reason, which is kept with the sign-off together with the blockers it overrode.
 * Re-torque readings do not count here: they come after the engine has run, and neither
 * do stage readings: the final torque is what the fastener is left at.
 */
import { positionLabel, positionList } from './positions';
import { formatTorque, verdictLabels, type TorqueUnit, type Verdict } from './torque';

export type SignOffBlocker =
  | {
      kind: 'out-of-spec';
      specId: string;
      specName: string;
      position: number;
      verdict: Exclude<Verdict, 'in-spec'>;
      message: string;
    }
  | {
      kind: 'missing-readings';
      specId: string;
      specName: string;
      positions: number[];
      message: string;
    }
  | { kind: 'unticked'; itemId: string; label: string; message: string };

export type SignOffInput = {
  fasteners: {
    id: string;
    name: string;
    count: number;
    /** Names of the positions ("Cyl 1" …), or empty for #1 … #n. */
    positionNames?: readonly string[];
    positions: {
      position: number;
      current: { verdict: Verdict; value: number; unit: TorqueUnit } | null;
    }[];
  }[];
  checklist: { id: string; label: string; done: boolean }[];
};

export function signOffBlockers(step: SignOffInput): SignOffBlocker[] {
  const blockers: SignOffBlocker[] = [];
  for (const f of step.fasteners) {
    const names = f.positionNames ?? [];
    const missing: number[] = [];
    for (let position = 1; position <= f.count; position++) {
      const current = f.positions.find((p) => p.position === position)?.current ?? null;
      if (!current) {
        missing.push(position);
      } else if (current.verdict !== 'in-spec') {
        blockers.push({
          kind: 'out-of-spec',
          specId: f.id,
          specName: f.name,
          position,
          verdict: current.verdict,
          message: `${f.name} ${positionLabel(names, position)}: ${verdictLabels[current.verdict].toLowerCase()} (${formatTorque(current.value, current.unit)})`,
        });
      }
    }
    if (missing.length) {
      blockers.push({
        kind: 'missing-readings',
        specId: f.id,
        specName: f.name,
        positions: missing,
        message: `${f.name}: no reading for ${positionList(names, missing)}`,
      });
    }
  }
  for (const item of step.checklist) {
    if (!item.done) {
      blockers.push({
        kind: 'unticked',
        itemId: item.id,
        label: item.label,
        message: `Not ticked: ${item.label}`,
      });
    }
  }
  return blockers;
}
