import { z } from 'zod';
import type { Role } from '@shared/permissions';

/** What a member can be told about by e-mail. */
export const noticeKinds = [
  'part-received',
  'part-back-from-shop',
  'part-overdue-at-shop',
  'step-signed-off',
  'torque-out-of-spec',
  'bench-sheet-from-shop',
  'timeline-digest',
] as const;
export type NoticeKind = (typeof noticeKinds)[number];

export const noticeKindLabels: Record<NoticeKind, string> = {
  'part-received': 'Part received',
  'part-back-from-shop': 'Part back from a shop',
  'part-overdue-at-shop': 'Part overdue at a shop',
  'step-signed-off': 'Install step signed off',
  'torque-out-of-spec': 'Torque reading out of spec',
  'bench-sheet-from-shop': 'Bench sheet from a shop',
  'timeline-digest': 'Weekly timeline digest',
};

export const noticeKindDescriptions: Record<NoticeKind, string> = {
  'part-received': 'An ordered part arrived and is in the garage',
  'part-back-from-shop': 'A part came back from a shop, or its back date was set',
  'part-overdue-at-shop':
    'A part at a shop is past its sent-out date plus the promised turnaround (once each time; the owner and that shop)',
  'step-signed-off': 'Someone signed off an install step',
  'torque-out-of-spec': 'A torque reading fell outside the spec’s tolerance',
  'bench-sheet-from-shop':
    'A shop added, changed or removed an injector bench sheet (sent to the owner only)',
  'timeline-digest':
    'Each Monday morning: the countdown to the target date and what threatens it. Off until you switch it on',
};

/** Whether a kind is on for a member who never chose: every notice but the weekly digest. */
export const noticeKindDefaults: Record<NoticeKind, boolean> = {
  'part-received': true,
  'part-back-from-shop': true,
  'part-overdue-at-shop': true,
  'step-signed-off': true,
  'torque-out-of-spec': true,
  'bench-sheet-from-shop': true,
  'timeline-digest': false,
};

/**
 * Roles that hear about each kind. A shop sees only what concerns its own
 * parts, so it hears only when the caller names it (a part sent to it, a step
 * linked to such a part).
 */
export const noticeAudience: Record<NoticeKind, readonly Role[]> = {
  'part-received': ['owner', 'crew', 'viewer'],
  'part-back-from-shop': ['owner', 'crew', 'viewer'],
  // The owner chases it; the shop that has the part hears too (named by the caller).
  'part-overdue-at-shop': ['owner'],
  'step-signed-off': ['owner', 'crew', 'viewer'],
  'torque-out-of-spec': ['owner', 'crew', 'viewer'],
  // The owner checks the shop's work; the shop that acted hears nothing of its own change.
  'bench-sheet-from-shop': ['owner'],
  // Every role; a shop's digest names only the parts sent to it.
  'timeline-digest': ['owner', 'crew', 'shop', 'viewer'],
};

const onOff = z.boolean({ message: 'Choose on or off' });

/**
 * PUT /api/builds/:buildId/notice-preferences: the whole set; a kind left out
 * goes back to its default (noticeKindDefaults).
 */
export const noticePreferencesInputSchema = z
  .object({
    'part-received': onOff.optional(),
    'part-back-from-shop': onOff.optional(),
    'part-overdue-at-shop': onOff.optional(),
    'step-signed-off': onOff.optional(),
    'torque-out-of-spec': onOff.optional(),
    'bench-sheet-from-shop': onOff.optional(),
    'timeline-digest': onOff.optional(),
  } satisfies Record<NoticeKind, z.ZodType>)
  .strict();
export type NoticePreferencesInput = z.infer<typeof noticePreferencesInputSchema>;

/** GET/PUT answer: every kind, on or off. */
export type NoticePreferences = Record<NoticeKind, boolean>;
