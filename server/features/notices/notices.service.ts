/**
 * Notices: short mails to a build's members when something they care about
 * happens. Any feature calls notify() inside the transaction of the change, so
 * the notice is queued exactly when the change is committed.
 *
 * Rules kept here: each member receives only the kinds they have left on
 * (default: all but the weekly digest); the person who acted hears nothing of their own action; a
 * shop hears only about what concerns its own parts, when the caller names it; and a
 * notice never carries money — callers must not put any in subject or text.
 */
import type { Knex } from 'knex';
import { roleLabels } from '@shared/permissions';
import {
  noticeAudience,
  noticeKindDefaults,
  noticeKindLabels,
  noticeKinds,
  type NoticeKind,
  type NoticePreferences,
  type NoticePreferencesInput,
} from '@shared/schemas/notices';
import { enqueueMail, quoted } from '@server/features/mail';
import * as repo from './notices.repository';

export type Notice = {
  /** One line, e.g. "Injector set received"; the build's name is put in front of it. */
  subject: string;
  /** Plain text; paragraphs separated by a blank line. No money, ever. */
  text: string;
  /** A client path, e.g. /builds/<id>/parts; the worker makes it absolute with APP_URL. */
  link: string;
  /** The button's words; default "Open the build". */
  linkLabel?: string;
};

export type NoticeAudience = {
  /** Who acted: they get no notice of their own action. Null for the system. */
  actorUserId: string | null;
  /** The shop member the notice concerns (a part sent to it); shops hear of nothing else. */
  shopUserId?: string | null;
};

/**
 * Queues one mail per member who should hear about this; returns how many.
 * Pass the transaction of the change that caused it.
 */
export async function notify(
  trx: Knex,
  buildId: string,
  kind: NoticeKind,
  notice: Notice,
  who: NoticeAudience,
): Promise<number> {
  const buildName = await repo.buildName(trx, buildId);
  if (!buildName) return 0;
  const people = await repo.recipients(trx, buildId, kind, { roles: noticeAudience[kind], ...who });
  await enqueueMail(
    trx,
    people.map((p) => ({
      kind: `notice:${kind}`,
      to: p.email,
      subject: `${buildName}: ${notice.subject}`,
      heading: notice.subject,
      body: notice.text,
      action: { label: notice.linkLabel ?? 'Open the build', path: notice.link },
      footer: `You receive this as ${roleLabels[p.role].toLowerCase()} on ${quoted(buildName)} because “${noticeKindLabels[kind]}” notices are on. Choose which notices you get on the build's Notices page in Headroom.`,
    })),
  );
  return people.length;
}

/** Members who have a kind on, with their build: for notices sent on a schedule. */
export async function subscribers(knex: Knex, kind: NoticeKind) {
  return (await repo.subscribers(knex, kind, noticeAudience[kind])).map((s) => ({
    buildId: s.build_id,
    userId: s.user_id,
    email: s.email,
    role: s.role,
  }));
}

/** The name of whoever acted, for a notice's text. */
export async function actorName(knex: Knex, userId: string | null): Promise<string> {
  return (userId && (await repo.displayName(knex, userId))) || 'Someone';
}

export async function getPreferences(
  knex: Knex,
  buildId: string,
  userId: string,
): Promise<NoticePreferences> {
  const prefs = { ...noticeKindDefaults } as NoticePreferences;
  for (const row of await repo.preferences(knex, buildId, userId)) {
    if ((noticeKinds as readonly string[]).includes(row.kind))
      prefs[row.kind as NoticeKind] = row.enabled;
  }
  return prefs;
}

/** Replaces the member's choices; a kind left out goes back to its default. */
export async function setPreferences(
  knex: Knex,
  buildId: string,
  userId: string,
  input: NoticePreferencesInput,
) {
  const choices = noticeKinds.map((kind) => ({
    kind,
    enabled: input[kind] ?? noticeKindDefaults[kind],
  }));
  await repo.savePreferences(knex, buildId, userId, choices);
  return getPreferences(knex, buildId, userId);
}
