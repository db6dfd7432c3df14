/** The element id of a part's row or card, for links that pick one part out of the ledger. */
export function partElementId(partId: string): string {
  return `part-${partId}`;
}
