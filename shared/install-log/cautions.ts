/**
 * The cautions a step shows, chosen from what it touches. The texts are the
 * product's own (product.md, "Cautions shown in the product"); the server
 * returns the ids and texts with each step, and the client may import them from
 * here too, so both say the same words.
 */
export const cautionIds = ['service-information', 'high-pressure-fuel', 'lifting'] as const;
export type CautionId = (typeof cautionIds)[number];

export type Caution = { id: CautionId; title: string; text: string };

export const cautionTexts: Record<CautionId, Omit<Caution, 'id'>> = {
  'service-information': {
    title: 'Specs come from the service information',
    text:
      "Torque values, sequences and procedures come from the vehicle maker's service information; " +
      'Headroom records them and checks readings against them, it does not supply them. ' +
      'Defer to the service manual and licensed practice.',
  },
  'high-pressure-fuel': {
    title: 'High-pressure fuel',
    text:
      'Fuel systems run at very high pressure: a leak can inject fuel through skin, which is a medical ' +
      'emergency. Never feel for leaks by hand; relieve pressure before opening lines.',
  },
  lifting: {
    title: 'Lifting and stands',
    text: 'Lifting a cab or working under a vehicle needs rated stands and blocking.',
  },
};

/** Words that mean the fuel-injection side of the system (not the low-pressure lift pump). */
const highPressureWords =
  /\b(injectors?|nozzles?|fuel rail|common rail|rail pressure|high[- ]pressure (pump|lines?|fuel)|injection pump|injector lines?)\b/i;
/** Words that mean the truck or its cab is off the ground ("lift pump" is not lifting). */
const liftingWords =
  /\b(cab[- ]off|(lift|raise|lifting|raising) (the )?(cab|truck|vehicle|body)|jack(ing)? (it )?up|jack stands?|axle stands?|on stands|hoist|under the (truck|vehicle))\b/i;

/**
 * Cautions for a step, in a fixed order:
 * - high-pressure fuel when a linked part is in the fuel-injection category or
 *   the step's text names injectors, the rail or high-pressure lines;
 * - lifting when the step says the vehicle or cab is raised (liftsVehicle) or
 *   its text says so;
 * - service information whenever the step has a fastener spec.
 */
export function cautionsForStep(step: {
  title: string;
  description: string;
  partCategories: readonly string[];
  liftsVehicle: boolean;
  fastenerCount: number;
}): Caution[] {
  const text = `${step.title}\n${step.description}`;
  const ids: CautionId[] = [];
  if (step.partCategories.includes('fuel-injection') || highPressureWords.test(text)) {
    ids.push('high-pressure-fuel');
  }
  if (step.liftsVehicle || liftingWords.test(text)) ids.push('lifting');
  if (step.fastenerCount > 0) ids.push('service-information');
  return ids.map((id) => ({ id, ...cautionTexts[id] }));
}
