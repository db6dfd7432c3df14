/**
 * The bench's notice: the owner hears when a shop adds, changes or removes one
 * of its sheets, or attaches its original — checking the shop's sheet is the
 * owner's main way to judge its work. Called inside the transaction of the
 * change; only for a shop's own actions (owner and crew entries send nothing).
 * No money is ever in a notice.
 */
import type { Knex } from 'knex';
import { quoted } from '@server/features/mail';
import { actorName, notify } from '@server/features/notices';
import { paths } from '@shared/paths';

export type SheetChange =
  'added' | 'changed' | 'original-attached' | 'original-removed' | 'removed';

const verbs: Record<SheetChange, { subject: string; text: string }> = {
  added: { subject: 'added', text: 'added the bench sheet' },
  changed: { subject: 'changed', text: 'changed the bench sheet' },
  'original-attached': {
    subject: 'original attached',
    text: 'attached its original of the bench sheet',
  },
  'original-removed': {
    subject: 'original removed',
    text: 'removed its original of the bench sheet',
  },
  removed: { subject: 'removed', text: 'removed the bench sheet' },
};

export async function notifyShopSheetChange(
  trx: Knex,
  n: {
    buildId: string;
    sheet: {
      id: string;
      occasion: string;
      testedOn: string;
      partName: string;
      shopUserId: string | null;
    };
    change: SheetChange;
    actorUserId: string;
    /** The set verdict after the change, in words; absent when the sheet is gone. */
    verdict?: string;
  },
) {
  const who = await actorName(trx, n.actorUserId);
  const { sheet } = n;
  const gone = n.change === 'removed';
  const paragraphs = [
    `${who} ${verbs[n.change].text} ${quoted(sheet.occasion)} (tested on ${sheet.testedOn}) for ${quoted(sheet.partName)}.`,
  ];
  if (n.verdict) paragraphs.push(`What the sheet says now: ${n.verdict}.`);
  paragraphs.push(
    gone
      ? 'The sheet and its original are no longer in Headroom.'
      : "Check it against the shop's original and compare it with the set's other sheets in Headroom.",
  );
  await notify(
    trx,
    n.buildId,
    'bench-sheet-from-shop',
    {
      subject: `Bench sheet ${quoted(sheet.occasion)} ${verbs[n.change].subject} by ${who}`,
      text: paragraphs.join('\n\n'),
      link: gone
        ? paths.builds.bench.getHref(n.buildId)
        : paths.builds.benchSheet.getHref(n.buildId, sheet.id),
      linkLabel: gone ? 'Open the bench results' : 'Open the bench sheet',
    },
    // Owner only (the kind's audience); the shop that acted is the actor and hears nothing.
    { actorUserId: n.actorUserId },
  );
}
