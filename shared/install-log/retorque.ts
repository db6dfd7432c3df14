/**
 * Re-torque checks. A spec may ask for its fasteners to be re-checked after a
 * number of heat cycles or miles. The check is:
 * - waiting: the step is not signed off yet (the fastener is not finally fitted);
 * - open: signed off, and not every position has a current re-torque reading in spec;
 * - done: every position has a current re-torque reading in spec, or someone
 *   closed the check with a note (e.g. "re-checked at the shop, sheet attached").
 */
import type { Verdict } from './torque';

export const retorqueStates = ['waiting', 'open', 'done'] as const;
export type RetorqueState = (typeof retorqueStates)[number];

export const retorqueStateLabels: Record<RetorqueState, string> = {
  waiting: 'After sign-off',
  open: 'Due',
  done: 'Re-checked',
};

export function asksRetorque(spec: {
  retorqueAfterHeatCycles: number | null;
  retorqueAfterMiles: number | null;
}): boolean {
  return spec.retorqueAfterHeatCycles != null || spec.retorqueAfterMiles != null;
}

export function retorqueState(input: {
  signedOff: boolean;
  closed: boolean;
  count: number;
  /** Verdict of the current re-torque reading per position (index 0 = position 1), null if none. */
  currentRetorque: (Verdict | null)[];
}): RetorqueState {
  let complete = true;
  for (let i = 0; i < input.count; i++)
    if (input.currentRetorque[i] !== 'in-spec') complete = false;
  if (input.closed || complete) return 'done';
  return input.signedOff ? 'open' : 'waiting';
}

/** "after 3 heat cycles or 500 miles, whichever comes first". */
export function describeRetorque(spec: {
  retorqueAfterHeatCycles: number | null;
  retorqueAfterMiles: number | null;
}): string {
  const parts: string[] = [];
  const n = spec.retorqueAfterHeatCycles;
  const m = spec.retorqueAfterMiles;
  if (n != null) parts.push(`${n} heat cycle${n === 1 ? '' : 's'}`);
  if (m != null) parts.push(`${m} mile${m === 1 ? '' : 's'}`);
  if (!parts.length) return '';
  return `after ${parts.join(' or ')}${parts.length > 1 ? ', whichever comes first' : ''}`;
}

/** A torque reading is a fitting reading or a re-torque check. */
export const readingKinds = ['install', 'retorque'] as const;
export type ReadingKind = (typeof readingKinds)[number];

/**
 * Reading-kind rule: fitting readings only while the step is open (a signed-off step is
 * reopened to change it); re-torque checks only after sign-off, and only for a spec that asks
 * for one. Why a reading of this kind is refused now, or null when it is allowed.
 */
export function readingKindRefusal(
  kind: ReadingKind,
  now: { signedOff: boolean; retorqueAsked: boolean },
): 'no-retorque' | 'step-signed-off' | 'step-not-signed-off' | null {
  if (kind === 'install') return now.signedOff ? 'step-signed-off' : null;
  if (!now.retorqueAsked) return 'no-retorque';
  return now.signedOff ? null : 'step-not-signed-off';
}

/** The kind of reading a fastener takes now, or null when it takes none. */
export function openReadingKind(now: {
  signedOff: boolean;
  retorqueAsked: boolean;
}): ReadingKind | null {
  return readingKinds.find((kind) => readingKindRefusal(kind, now) === null) ?? null;
}
