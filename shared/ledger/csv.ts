/**
 * The parts CSV's money columns: each holds a plain decimal amount in the build's currency,
 * read into (and written from) the part's cents field named here. The server's export and
 * import use it; the import dialog uses it to name the column of a field the server refused.
 */
export const csvMoneyColumns = {
  unitPrice: 'unitPriceCents',
  labour: 'labourCents',
  shipping: 'shippingCents',
  tax: 'taxCents',
  coreCharge: 'coreChargeCents',
  coreRefund: 'coreRefundCents',
} as const;
export type CsvMoneyColumn = keyof typeof csvMoneyColumns;

/** The CSV column a part field comes from, where the two names differ (else the field's own). */
export function csvColumnOfField(field: string): string {
  if (field === 'shopUserId') return 'shopEmail';
  const money = Object.entries(csvMoneyColumns).find(([, cents]) => cents === field);
  return money ? money[0] : field;
}
