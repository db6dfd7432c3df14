/**
 * The weekly digest's words: the countdown, what threatens the target date (each with
 * by how much, linked to the timeline), and what falls due in the next two weeks. A
 * shop's digest is made from its own timeline, so it names only the parts sent to it.
 * No money: the timeline answer carries none.
 */
import { addDays, longDate, shortDate, type IsoDate } from '@shared/dates';
import { roleLabels, type Role } from '@shared/permissions';
import { noticeKindLabels } from '@shared/schemas/notices';
import type { Timeline } from '@shared/schemas/timeline';
import { quoted, type QueuedMail } from '@server/features/mail';
import { paths } from '@shared/paths';

const comingUpDays = 14;

/** "On track" → "on track" after a colon; "2 things …" stays as it is. */
const lowerFirst = (words: string) => words.charAt(0).toLowerCase() + words.slice(1);

function countdown(t: Timeline): string {
  const what = t.target.event || 'the target date';
  if (t.target.daysLeft === 0) return `Today is ${what}.`;
  const n = t.target.daysLeft!;
  return `${n} ${n === 1 ? 'day' : 'days'} to ${what}, on ${longDate(t.target.date!)}.`;
}

export function digestMail(o: {
  to: string;
  role: Role;
  buildId: string;
  buildName: string;
  weekOf: IsoDate;
  timeline: Timeline;
}): QueuedMail {
  const t = o.timeline;
  const paragraphs = [countdown(t)];
  if (t.target.cutoff && t.target.cutoff >= t.today && t.settings.bufferDays > 0) {
    paragraphs.push(
      `Parts and send-outs should be back by ${longDate(t.target.cutoff)}, ${t.settings.bufferDays} days before.`,
    );
  }
  if (t.threats.length) {
    paragraphs.push(
      [`${t.readiness.words}:`, ...t.threats.map((x) => `• ${x.title}: ${x.words}`)].join('\n'),
    );
  } else {
    paragraphs.push('Nothing threatens the date this week.');
  }
  const horizon = addDays(t.today, comingUpDays);
  const soon = t.items.filter(
    (i) => !i.done && i.kind !== 'target' && i.date >= t.today && i.date <= horizon,
  );
  if (soon.length) {
    paragraphs.push(
      [
        'In the next two weeks:',
        ...soon.map((i) => `• ${shortDate(i.date)}: ${i.title} (${i.detail.toLowerCase()})`),
      ].join('\n'),
    );
  }
  paragraphs.push(
    `Days are counted in ${t.timeZone}; this digest is for the week of ${longDate(o.weekOf)}.`,
  );
  const shopNote = o.role === 'shop' ? ' As a shop, you see only the parts sent to you.' : '';
  return {
    kind: 'digest:timeline',
    to: o.to,
    subject: `${o.buildName} this week: ${lowerFirst(t.readiness.words)}`,
    heading: `The week of ${shortDate(o.weekOf)}`,
    body: paragraphs.join('\n\n'),
    action: { label: 'Open the timeline', path: paths.builds.timeline.getHref(o.buildId) },
    footer: `You receive this each Monday as ${roleLabels[o.role].toLowerCase()} on ${quoted(o.buildName)} because the “${noticeKindLabels['timeline-digest']}” notice is on.${shopNote} Switch it off on the build's Notices page in Headroom.`,
  };
}
