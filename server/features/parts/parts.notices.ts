/**
 * The parts ledger's notices: "part received" (ordered → in hand) and "part
 * back from a shop" (at a shop → in hand, or its back date set). Called by
 * parts.service update() inside the transaction of the change.
 */
import type { Knex } from 'knex';
import { partCategoryLabels, type UpdatePartInput } from '@shared/schemas/parts';
import { quoted } from '@server/features/mail';
import { actorName, notify } from '@server/features/notices';
import type { PartRecord } from './parts.repository';
import { paths } from '@shared/paths';

/** Client path of a build's parts ledger. */

function describe(part: PartRecord) {
  const bits = [partCategoryLabels[part.category]];
  if (part.partNumber) bits.push(`part number ${part.partNumber}`);
  if (part.quantity > 1) bits.push(`quantity ${part.quantity}`);
  return `${quoted(part.name)} (${bits.join(', ')})`;
}

export async function notifyPartProgress(
  trx: Knex,
  buildId: string,
  before: PartRecord,
  input: UpdatePartInput,
  actorUserId: string,
) {
  const status = input.status ?? before.status;
  const received = before.status === 'ordered' && status === 'in-hand';
  const backFromShop =
    (before.status === 'at-shop' && status === 'in-hand') || (!before.backOn && !!input.backOn);
  if (!received && !backFromShop) return;

  const who = await actorName(trx, actorUserId);
  const after = { ...before, ...input } as PartRecord;
  if (received) {
    const on = after.receivedOn ? ` on ${after.receivedOn}` : '';
    await notify(
      trx,
      buildId,
      'part-received',
      {
        subject: `${before.name} received`,
        text: `${who} marked ${describe(after)} as received${on}. It is in the garage now.`,
        link: paths.builds.parts.getHref(buildId),
        linkLabel: 'Open the parts ledger',
      },
      { actorUserId, shopUserId: after.shopUserId },
    );
  }
  if (backFromShop) {
    const shop = before.shopName ? ` from ${before.shopName}` : ' from the shop';
    const on = after.backOn ? ` on ${after.backOn}` : '';
    const where = status === 'in-hand' ? ' It is in the garage now.' : '';
    await notify(
      trx,
      buildId,
      'part-back-from-shop',
      {
        subject: `${before.name} back${shop}`,
        text: `${who} recorded ${describe(after)} as back${shop}${on}.${where}`,
        link: paths.builds.parts.getHref(buildId),
        linkLabel: 'Open the parts ledger',
      },
      // The shop that had it hears too (unless the shop itself recorded it).
      { actorUserId, shopUserId: before.shopUserId },
    );
  }
}
