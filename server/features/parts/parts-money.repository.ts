/** The budget's read of the parts: their money, stage and dates, and nothing else. */
import type { Knex } from 'knex';
import { namedRows } from '@server/lib/named-query';
import type { BudgetPart } from '@shared/ledger/budget';
import { isoUtc } from './parts.repository';

/**
 * The budget's read: only the columns it sums and orders by, created_at already as the
 * ISO text toISOString() writes (UTC, milliseconds), so no row is turned into a Date and back.
 * In the ledger's order, as the shared page's budget reads them: the budget's sorts are
 * stable, so parts that tie (a CSV import's share one created_at) keep this order.
 */
const moneySql = `select p.id, p.name, p.category, p.status, p.quantity,
    p.unit_price_cents as "unitPriceCents", p.labour_cents as "labourCents",
    p.shipping_cents as "shippingCents", p.tax_cents as "taxCents",
    p.core_charge_cents as "coreChargeCents", p.core_refund_cents as "coreRefundCents",
    p.ordered_on as "orderedOn", p.received_on as "receivedOn",
    ${isoUtc('p.created_at')} as "createdAt"
  from parts p where p.build_id = ?
  order by p.category, p.created_at, p.name, p.id`;

export async function listPartMoney(knex: Knex, buildId: string) {
  return namedRows<BudgetPart>(knex, 'parts-money', moneySql, [buildId]);
}
