/**
 * What has happened lately on a build, for its overview: parts moving (ordered, arrived,
 * out to a shop, back, installed), steps signed off, photos added, bench sheets entered.
 * Each member sees what their role may see (a shop: only its parts, their steps and its
 * own sheets), and no event carries money.
 */
import type { Person } from './install-log';

export const activityKinds = [
  'part-ordered',
  'part-arrived',
  'part-sent-out',
  'part-back',
  'part-installed',
  'step-signed-off',
  'photos-added',
  'bench-sheet-added',
] as const;
export type ActivityKind = (typeof activityKinds)[number];

export type ActivityEvent = {
  kind: ActivityKind;
  /** The calendar day it happened (YYYY-MM-DD); parts' dates have no time of day. */
  day: string;
  /** When it happened, where the moment is known (sign-offs, photos, sheets). */
  at: string | null;
  /** What it is about: a part or a step, by name, to link to. */
  subject: { type: 'part' | 'step'; id: string; name: string };
  /** Who did it, where known. */
  by: Person | null;
  /** The shop a part went to or came back from. */
  shopName?: string;
  /** Photos added at once. */
  count?: number;
  /** A sign-off over open items (the owner's override). */
  overridden?: boolean;
  /** A bench sheet's occasion, e.g. "As received". */
  occasion?: string;
};

/** How many events the overview shows. */
export const activityLimit = 20;
