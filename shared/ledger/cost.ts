/** The money fields of a part, in cents. */
export type PartMoney = {
  quantity: number;
  unitPriceCents: number;
  labourCents: number;
  shippingCents: number;
  taxCents: number;
  coreChargeCents: number;
  coreRefundCents: number;
};

/**
 * What a part costs the build: price × quantity + labour + shipping + tax, plus
 * the core charge paid up front less whatever core refund has come back.
 */
export function partTotalCents(p: PartMoney): number {
  return (
    p.unitPriceCents * p.quantity +
    p.labourCents +
    p.shippingCents +
    p.taxCents +
    p.coreChargeCents -
    p.coreRefundCents
  );
}

/** Core charge not yet refunded: money that should come back when the old core goes in. */
export function coreOwedCents(p: PartMoney): number {
  return Math.max(0, p.coreChargeCents - p.coreRefundCents);
}
