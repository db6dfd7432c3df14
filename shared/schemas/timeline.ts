/**
 * Timeline (module 8) and calendar (module 12): the target date, what threatens
 * it, milestones, the owner's timeline settings and each member's calendar
 * feed. The rules that judge threats are in shared/timeline; the dates they
 * count with in shared/dates.
 */
import { z } from 'zod';
import type { IsoDate } from '@shared/dates';
import { isoDateSchema, trimmed } from './common';
import { timeZoneSchema } from './time-zone';

export const defaultBufferDays = 7;
export const maxBufferDays = 365;
export const maxStepsPerWeek = 100;

/** PATCH /api/builds/:buildId/timeline/settings: the owner's buffer, pace and time zone. */
export const timelineSettingsInputSchema = z
  .object({
    timeZone: timeZoneSchema.optional(),
    bufferDays: z
      .number({ message: 'Enter a number of days' })
      .int({ message: 'Use whole days' })
      .min(0, { message: 'The buffer cannot be below 0 days' })
      .max(maxBufferDays, { message: `The buffer can be at most ${maxBufferDays} days` })
      .optional(),
    stepsPerWeek: z
      .number({ message: 'Enter steps per week' })
      .positive({ message: 'The pace must be more than 0 steps a week' })
      .max(maxStepsPerWeek, { message: `At most ${maxStepsPerWeek} steps a week` })
      .nullable()
      .optional(),
  })
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change' });
export type TimelineSettingsInput = z.infer<typeof timelineSettingsInputSchema>;

const milestoneFields = {
  title: trimmed(120, 'Title').min(1, { message: 'Give the milestone a title' }),
  dueOn: isoDateSchema,
  done: z.boolean({ message: 'Choose done or not done' }),
};

/** POST /api/builds/:buildId/milestones. */
export const createMilestoneInputSchema = z
  .object({ ...milestoneFields, done: milestoneFields.done.optional() })
  .strict();
export type CreateMilestoneInput = z.infer<typeof createMilestoneInputSchema>;

/** PATCH /api/builds/:buildId/milestones/:milestoneId. */
export const updateMilestoneInputSchema = z
  .object(milestoneFields)
  .partial()
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change' });
export type UpdateMilestoneInput = z.infer<typeof updateMilestoneInputSchema>;

export type Milestone = {
  id: string;
  buildId: string;
  title: string;
  dueOn: IsoDate;
  done: boolean;
  createdAt: string;
  updatedAt: string;
};

/** Where an item or a threat leads in the app. */
export type TimelineLink =
  | { to: 'target' }
  | { to: 'milestone'; milestoneId: string }
  | { to: 'part'; partId: string; name: string }
  | { to: 'send-out'; partId: string; name: string }
  | { to: 'step'; stepId: string }
  | { to: 'install' }
  | { to: 'dyno-session'; sessionId: string };

/** Kinds of dated item. A feature with dates of its own adds its kind here (and a source). */
export const timelineItemKinds = [
  'target',
  'milestone',
  'part-expected',
  'send-out-due',
  'job',
  'dyno-session',
] as const;
export type TimelineItemKind = (typeof timelineItemKinds)[number];

export const timelineItemKindLabels: Record<TimelineItemKind, string> = {
  target: 'Target date',
  milestone: 'Milestone',
  'part-expected': 'Part expected',
  'send-out-due': 'Due back from a shop',
  job: 'Install job',
  'dyno-session': 'Dyno day',
};

/** One dated thing on the timeline. `key` is stable: the calendar feed's UIDs are made from it. */
export type TimelineItem = {
  key: string;
  kind: TimelineItemKind;
  date: IsoDate;
  title: string;
  /** One line under the title: "Expected from Dustline Turbo Works", "3 steps left at your pace". */
  detail: string;
  done: boolean;
  /** A threat names this item (its key). */
  threatened: boolean;
  /** Whether the calendar feed carries it (projected dates such as a job's finish do not). */
  inCalendar: boolean;
  link: TimelineLink;
};

/** The rules, in the order the page lists them; each is explained in the README. */
export const threatRules = [
  'part-late',
  'part-no-date',
  'send-out-overdue',
  'send-out-late',
  'job-behind',
  'milestone-past-due',
] as const;
export type ThreatRule = (typeof threatRules)[number];

export type Threat = {
  /** The key of the item it concerns (part-no-date threats have no dated item: `part-no-date:<id>`). */
  key: string;
  rule: ThreatRule;
  /** What it is: the part's, job's or milestone's name. */
  title: string;
  /** What is wrong, in plain words, with its dates. */
  words: string;
  /** By how many days it misses; null when that cannot be told (no expected date). */
  missesByDays: number | null;
  /** The date that misses (expected, due back, projected finish, due); null when there is none. */
  date: IsoDate | null;
  link: TimelineLink;
};

export type Readiness = {
  state: 'on-track' | 'threatened' | 'no-target' | 'passed';
  /** "On track", "2 things threaten the date". */
  words: string;
};

/** GET /api/builds/:buildId/timeline. */
export type Timeline = {
  /** Today in the build's time zone. */
  today: IsoDate;
  timeZone: string;
  /** False until the owner chooses a zone; days are counted in UTC meanwhile. */
  timeZoneChosen: boolean;
  settings: { bufferDays: number; stepsPerWeek: number | null };
  target: {
    date: IsoDate | null;
    event: string;
    daysLeft: number | null;
    /** The date parts and send-outs must be back by: the target date less the buffer. */
    cutoff: IsoDate | null;
  };
  readiness: Readiness;
  threats: Threat[];
  /** Every dated item, earliest first. */
  items: TimelineItem[];
  /** The milestones with their controls' data; null for a role that does not see them (a shop). */
  milestones: Milestone[] | null;
};

/** GET/POST /api/builds/:buildId/calendar-feed. The URL is shown once, when it is made. */
export type CalendarFeed = {
  createdAt: string;
  url?: string;
  webcalUrl?: string;
};
