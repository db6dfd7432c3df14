/**
 * Install log: jobs made of ordered steps, each with a checklist, fastener
 * specs and the torque readings the crew records. Input schemas are shared by
 * the client forms and the server; response types describe what the API returns.
 */
import { z } from 'zod';
import {
  choosableCautionIds,
  type Caution,
  type ChoosableCautionId,
} from '@shared/install-log/cautions';
import type { RetorqueState } from '@shared/install-log/retorque';
import type { SignOffBlocker } from '@shared/install-log/sign-off';
import type { Calibration } from '@shared/install-log/wrenches';
import {
  toleranceTypes,
  torqueUnits,
  type TorqueUnit,
  type Verdict,
} from '@shared/install-log/torque';
import { idSchema, trimmed } from './common';

/** Headroom's own words for where a step is. */
export const stepStatuses = ['not-started', 'under-way', 'signed-off'] as const;
export type StepStatus = (typeof stepStatuses)[number];
export const stepStatusLabels: Record<StepStatus, string> = {
  'not-started': 'Not started',
  'under-way': 'Under way',
  'signed-off': 'Signed off',
};
/** Statuses a step can be set to by hand; signed-off only through the sign-off route. */
export const settableStepStatuses = ['not-started', 'under-way'] as const;

export const threadConditions = ['dry', 'oiled', 'anti-seize', 'sealant'] as const;
export type ThreadCondition = (typeof threadConditions)[number];
export const threadConditionLabels: Record<ThreadCondition, string> = {
  dry: 'Dry',
  oiled: 'Oiled',
  'anti-seize': 'Anti-seize',
  sealant: 'Thread sealant',
};

export const toleranceTypeLabels: Record<(typeof toleranceTypes)[number], string> = {
  value: '± amount',
  percent: '± %',
};

const position = z
  .number({ message: 'Enter a position number' })
  .int({ message: 'Position is a whole number' })
  .min(1, { message: 'Positions start at 1' })
  .max(1000, { message: 'At most 1000' });

// ---- jobs -------------------------------------------------------------------

export const createJobInputSchema = z
  .object({
    title: trimmed(160, 'Title').min(1, { message: 'Name the job' }),
    notes: trimmed(4000, 'Notes').optional(),
  })
  .strict();
export type CreateJobInput = z.infer<typeof createJobInputSchema>;

export const updateJobInputSchema = createJobInputSchema
  .extend({ position: position.optional() })
  .partial()
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change' });
export type UpdateJobInput = z.infer<typeof updateJobInputSchema>;

// ---- steps ------------------------------------------------------------------

const stepFields = {
  title: trimmed(160, 'Title').min(1, { message: 'Name the step' }),
  description: trimmed(8000, 'Description').optional(),
  /** Parts of the same build this step fits. */
  partIds: z
    .array(idSchema, { message: 'A list of part ids' })
    .max(50, { message: 'At most 50 parts' })
    .optional(),
  /**
   * The truck or its cab is off the ground for this step (shows the stands caution). Kept
   * for older callers: `cautions` with or without 'lifting' says the same and wins.
   */
  liftsVehicle: z.boolean({ message: 'Yes or no' }).optional(),
  /**
   * The cautions the author ticked; shown on the step whatever its words. Left out on a new
   * step, the step shows the cautions its parts and words suggest (suggestCautions).
   */
  cautions: z
    .array(
      z.enum(choosableCautionIds, {
        message: 'Choose high-pressure fuel, lifting or critical fasteners',
      }),
      { message: 'A list of cautions' },
    )
    .max(choosableCautionIds.length, { message: 'Each caution once' })
    .refine((ids) => new Set(ids).size === ids.length, { message: 'Each caution once' })
    .optional(),
  /** 1-based place in the job; the others move to make room. Default: last. */
  position: position.optional(),
};

export const createStepInputSchema = z.object(stepFields).strict();
export type CreateStepInput = z.infer<typeof createStepInputSchema>;

export const updateStepInputSchema = z
  .object({
    ...stepFields,
    status: z.enum(settableStepStatuses, { message: 'Use the sign-off to finish a step' }),
  })
  .partial()
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change' });
export type UpdateStepInput = z.infer<typeof updateStepInputSchema>;

// ---- checklist --------------------------------------------------------------

export const createChecklistItemInputSchema = z
  .object({ label: trimmed(300, 'Check').min(1, { message: 'Say what to check' }) })
  .strict();
export type CreateChecklistItemInput = z.infer<typeof createChecklistItemInputSchema>;

export const updateChecklistItemInputSchema = z
  .object({
    label: trimmed(300, 'Check').min(1, { message: 'Say what to check' }),
    done: z.boolean({ message: 'Ticked is yes or no' }),
  })
  .partial()
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change' });
export type UpdateChecklistItemInput = z.infer<typeof updateChecklistItemInputSchema>;

// ---- fastener specs ---------------------------------------------------------

const torqueValue = (label: string) =>
  z
    .number({ message: `Enter ${label}` })
    .positive({ message: 'Torque is above zero' })
    .max(100_000, { message: 'That torque is too large' });

export const fastenerSpecFieldsSchema = z.object({
  name: trimmed(160, 'Name').min(1, {
    message: 'Name the fastener, e.g. "Injector hold-down bolts"',
  }),
  count: z
    .number({ message: 'Enter how many' })
    .int({ message: 'A whole number' })
    .min(1, { message: 'At least 1' })
    .max(100, { message: 'At most 100' }),
  targetValue: torqueValue('the target torque'),
  targetUnit: z.enum(torqueUnits, { message: 'Choose lbf·ft, lbf·in or N·m' }),
  toleranceType: z.enum(toleranceTypes, { message: 'Choose ± amount or ± %' }),
  toleranceValue: z
    .number({ message: 'Enter the tolerance' })
    .min(0, { message: 'Tolerance cannot be negative' })
    .max(100_000, { message: 'That tolerance is too large' }),
  /** Torque stages before the final value, in the spec's unit, in order. */
  stages: z
    .array(torqueValue('a stage torque'), { message: 'A list of torques' })
    .max(10, { message: 'At most 10 stages' })
    .optional(),
  finalAngleDeg: z
    .number({ message: 'Enter degrees' })
    .positive({ message: 'An angle is above zero' })
    .max(1080, { message: 'At most 1080°' })
    .nullable()
    .optional(),
  threadCondition: z.enum(threadConditions, {
    message: 'Choose dry, oiled, anti-seize or sealant',
  }),
  sequenceNote: trimmed(2000, 'Sequence').optional(),
  /**
   * Names of the positions in order ("Cyl 1" … "Cyl 8"), one per fastener, when they have
   * names; empty or left out, they are #1 … #n.
   */
  positionNames: z
    .array(trimmed(24, 'A position name').min(1, { message: 'Name every position, or none' }), {
      message: 'A list of names',
    })
    .max(100, { message: 'At most 100 names' })
    .optional(),
  /** Where the spec came from, e.g. "maker's service manual, fuel system, injector installation". */
  specSource: trimmed(500, 'Source').min(1, {
    message: "Say where this spec comes from, e.g. the maker's service manual section",
  }),
  retorqueAfterHeatCycles: z
    .number({ message: 'Enter heat cycles' })
    .int({ message: 'A whole number' })
    .min(1, { message: 'At least 1' })
    .max(1000, { message: 'At most 1000' })
    .nullable()
    .optional(),
  retorqueAfterMiles: z
    .number({ message: 'Enter miles' })
    .int({ message: 'A whole number' })
    .min(1, { message: 'At least 1' })
    .max(100_000, { message: 'At most 100000' })
    .nullable()
    .optional(),
});
export type FastenerSpecFields = z.infer<typeof fastenerSpecFieldsSchema>;

/** Contradictions in a whole spec (after an edit is merged onto it). */
export function fastenerSpecIssues(s: Partial<FastenerSpecFields>): Record<string, string> {
  const issues: Record<string, string> = {};
  if (s.toleranceType === 'percent' && s.toleranceValue != null && s.toleranceValue >= 100) {
    issues.toleranceValue = 'A percentage tolerance is below 100 %';
  }
  if (
    s.toleranceType === 'value' &&
    s.toleranceValue != null &&
    s.targetValue != null &&
    s.toleranceValue >= s.targetValue
  ) {
    issues.toleranceValue = 'The tolerance must be smaller than the target';
  }
  if (s.stages && s.targetValue != null && s.stages.some((v) => v > s.targetValue!)) {
    issues.stages = 'A stage is above the final torque';
  }
  const names = s.positionNames ?? [];
  if (names.length > 0 && s.count != null && names.length !== s.count) {
    issues.positionNames = `Give ${s.count} names, one per position, or none`;
  } else if (new Set(names.map((n) => n.toLowerCase())).size !== names.length) {
    issues.positionNames = 'Give each position its own name';
  }
  return issues;
}

export const createFastenerSpecInputSchema = fastenerSpecFieldsSchema
  .extend({ position: position.optional() })
  .strict();
export type CreateFastenerSpecInput = z.infer<typeof createFastenerSpecInputSchema>;

export const updateFastenerSpecInputSchema = fastenerSpecFieldsSchema
  .partial()
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change' });
export type UpdateFastenerSpecInput = z.infer<typeof updateFastenerSpecInputSchema>;

/** The fields that decide a reading's verdict; only the owner may change them once readings exist. */
export const torqueDefiningFields = [
  'targetValue',
  'targetUnit',
  'toleranceType',
  'toleranceValue',
] as const;

// ---- readings ---------------------------------------------------------------

export const createReadingInputSchema = z
  .object({
    position,
    value: torqueValue('the torque read'),
    unit: z.enum(torqueUnits, { message: 'Choose lbf·ft, lbf·in or N·m' }),
    /** One of the caller's own wrenches (GET /api/me/wrenches): its name and calibration are kept. */
    wrenchId: idSchema.optional(),
    /** A wrench not on the list, in words (older callers); ignored when wrenchId is given. */
    wrench: trimmed(160, 'Wrench').optional(),
    note: trimmed(1000, 'Note').optional(),
    /** A re-check after heat cycles or miles, not the fitting torque. */
    retorque: z.boolean({ message: 'Yes or no' }).optional(),
    /** The stage this reading was taken at (1 = the spec's first stage); left out: the final torque. */
    stage: z
      .number({ message: 'Choose a stage' })
      .int({ message: 'A stage is a whole number' })
      .min(1, { message: 'Stages start at 1' })
      .max(10, { message: 'At most 10 stages' })
      .optional(),
    /**
     * When the reading was taken on the device, for one sent late from the offline queue:
     * at most a couple of minutes ahead of the server's clock and no older than a queued
     * write may wait (the service checks both). Left out: taken as it arrives.
     */
    takenAt: z.iso.datetime({ offset: true, message: 'A date and time' }).optional(),
    /**
     * The fastener's target as the device saw it when the reading was taken: a reading
     * sent late is refused (409) when the target has changed since, rather than judged
     * against a target the crew never saw.
     */
    expectedTarget: z
      .object({
        targetValue: z.number({ message: 'A number' }),
        targetUnit: z.enum(torqueUnits, { message: 'Choose lbf·ft, lbf·in or N·m' }),
        toleranceType: z.enum(toleranceTypes, { message: 'Choose ± amount or ± %' }),
        toleranceValue: z.number({ message: 'A number' }),
      })
      .strict()
      .optional(),
  })
  .strict();
export type CreateReadingInput = z.infer<typeof createReadingInputSchema>;

// ---- sign-off and re-torque -------------------------------------------------

export const signOffInputSchema = z
  .object({
    /** Owner only: sign off although blockers remain, saying why. */
    overrideReason: trimmed(1000, 'Reason')
      .min(1, { message: 'Say why the step is signed off anyway' })
      .optional(),
  })
  .strict();
export type SignOffInput = z.infer<typeof signOffInputSchema>;

export const closeRetorqueInputSchema = z
  .object({ note: trimmed(1000, 'Note').min(1, { message: 'Say how the re-check was done' }) })
  .strict();
export type CloseRetorqueInput = z.infer<typeof closeRetorqueInputSchema>;

// ---- responses ----------------------------------------------------------------

export type Person = { id: string; name: string };

export type TorqueReading = {
  id: string;
  specId: string;
  position: number;
  kind: 'install' | 'retorque';
  value: number;
  unit: TorqueUnit;
  /** The reading in the spec's unit, and its verdict against the spec as it stands. */
  valueInSpecUnit: number;
  verdict: Verdict;
  deviation: number;
  deviationPercent: number;
  /** Null for the final torque, else the stage (1 = the spec's first). */
  stage: number | null;
  /** The wrench by name, as it was called when the reading was taken. */
  wrench: string;
  /** The member's registered wrench used, if any (null when typed in or since deleted). */
  wrenchId: string | null;
  /**
   * The wrench's calibration when the reading was taken (null when no registered wrench
   * was used); `overdue` when the reading came after its calibration fell due.
   */
  calibration: Calibration | null;
  note: string;
  recordedBy: Person | null;
  /** When it reached the server. */
  recordedAt: string;
  /** When it was taken on the device (the same as recordedAt unless it was sent late). */
  takenAt: string;
  /** Set when a later reading for the same position replaced this one. */
  supersededById: string | null;
  supersededAt: string | null;
};

export type FastenerPosition = {
  position: number;
  /** The newest fitting reading, or null. */
  current: TorqueReading | null;
  /** The newest re-torque reading, or null. */
  retorque: TorqueReading | null;
  /** The current reading at each of the spec's stages, in order (null where none). */
  stages: (TorqueReading | null)[];
  /** How many older readings this position has (kept, marked superseded). */
  supersededCount: number;
};

export type FastenerSpec = FastenerSpecFields & {
  id: string;
  stepId: string;
  position: number;
  stages: number[];
  finalAngleDeg: number | null;
  sequenceNote: string;
  positionNames: string[];
  retorqueAfterHeatCycles: number | null;
  retorqueAfterMiles: number | null;
  /** The band in the spec's unit. */
  band: { low: number; high: number; unit: TorqueUnit };
  /** Target and band in the other unit system, unrounded. */
  alt: { unit: TorqueUnit; target: number; low: number; high: number };
  positions: FastenerPosition[];
  retorque: {
    asked: boolean;
    description: string;
    closedAt: string | null;
    closedBy: Person | null;
    closeNote: string;
  };
  createdAt: string;
  updatedAt: string;
};

export type ChecklistItem = {
  id: string;
  stepId: string;
  position: number;
  label: string;
  done: boolean;
  doneBy: Person | null;
  doneAt: string | null;
};

export type StepPart = { id: string; name: string; category: string; status: string };

export type StepProgress = {
  checklistDone: number;
  checklistTotal: number;
  positionsRecorded: number;
  positionsTotal: number;
  outOfSpec: number;
};

export type SignOff = {
  by: Person | null;
  at: string;
  /** Present when the owner signed off over blockers. */
  override: { reason: string; blockers: SignOffBlocker[] } | null;
};

export type StepSummary = {
  id: string;
  jobId: string;
  /**
   * The step's place among the steps the caller sees in its job, from 1. For a shop, which
   * sees only the steps linked to its parts, that is not the step's place in the whole job.
   */
  position: number;
  title: string;
  status: StepStatus;
  signedOffAt: string | null;
  /** Who signed off, when, and — when the owner signed off over open items — why. */
  signOff: SignOff | null;
  progress: StepProgress;
};

export type Step = Omit<StepSummary, 'signedOffAt'> & {
  buildId: string;
  description: string;
  liftsVehicle: boolean;
  /** The cautions the author ticked, or null when nobody has chosen (then suggestions show). */
  cautionChoice: ChoosableCautionId[] | null;
  parts: StepPart[];
  checklist: ChecklistItem[];
  fasteners: FastenerSpec[];
  cautions: Caution[];
  /** What stands between the step and a plain sign-off (empty when ready). */
  signOffBlockers: SignOffBlocker[];
  photoCount: number;
  createdAt: string;
  updatedAt: string;
};

export type Job = {
  id: string;
  buildId: string;
  position: number;
  title: string;
  notes: string;
  createdBy: Person | null;
  steps: StepSummary[];
  createdAt: string;
  updatedAt: string;
};

export type RetorqueCheck = {
  specId: string;
  specName: string;
  count: number;
  stepId: string;
  stepTitle: string;
  jobId: string;
  jobTitle: string;
  state: RetorqueState;
  afterHeatCycles: number | null;
  afterMiles: number | null;
  description: string;
  /** When the step was signed off: the cycles or miles count from here. */
  since: string | null;
  /** Positions without a current in-spec re-torque reading. */
  positionsLeft: number[];
  /** The spec's position names ("Cyl 1" …), or empty for #1 … #n. */
  positionNames: string[];
  closedAt: string | null;
  closedBy: Person | null;
  closeNote: string;
};
