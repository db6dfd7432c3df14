/**
 * How a fastener's positions are named. A spec may name them ("Cyl 1" … "Cyl 8" for
 * injector hold-downs, one per cylinder); without names they are #1 … #n.
 */

/** "Cyl 3" when the spec names its positions, otherwise "#3". */
export function positionLabel(names: readonly string[], position: number): string {
  return names[position - 1] || `#${position}`;
}

/** "#1, #3" or "Cyl 1, Cyl 3". */
export function positionList(names: readonly string[], positions: readonly number[]): string {
  return positions.map((p) => positionLabel(names, p)).join(', ');
}

/** "Cyl 1" … "Cyl n": names for a fastener with one position per cylinder. */
export function cylinderNames(count: number): string[] {
  return Array.from({ length: count }, (_, i) => `Cyl ${i + 1}`);
}
