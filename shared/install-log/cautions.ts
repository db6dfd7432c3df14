/**
 * The cautions a step shows. The texts are the product's own (product.md, "Cautions shown
 * in the product"); the server returns the ids and texts with each step, and the client
 * imports them from here too, so both say the same words.
 *
 * The step's author ticks the cautions that apply; Headroom suggests them from the parts
 * linked to the step and the words it uses, and a ticked caution always shows. A step
 * nobody has ticked cautions for shows the suggestions.
 */
import { partCategoryLabels, type PartCategory } from '@shared/schemas/parts';

export const cautionIds = [
  'service-information',
  'high-pressure-fuel',
  'lifting',
  'critical-fastener',
] as const;
export type CautionId = (typeof cautionIds)[number];

/** The cautions an author ticks; the service-information one comes with any torque spec. */
export const choosableCautionIds = ['high-pressure-fuel', 'lifting', 'critical-fastener'] as const;
export type ChoosableCautionId = (typeof choosableCautionIds)[number];

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
  'critical-fastener': {
    title: 'Critical fasteners',
    text:
      'Head, main, rod, flexplate and similar fasteners hold the engine together. Use the exact torque, ' +
      "sequence, stages and thread condition in the maker's service information, a calibrated wrench, " +
      'and new fasteners where it says they are single-use.',
  },
};

/** What the author picks from, in the step form: a short name for each choosable caution. */
export const cautionChoiceLabels: Record<ChoosableCautionId, string> = {
  'high-pressure-fuel': 'High-pressure fuel',
  lifting: 'Truck or cab off the ground',
  'critical-fastener': 'Critical fasteners',
};

/** Part categories that suggest each caution. */
const categoriesFor: Record<ChoosableCautionId, readonly PartCategory[]> = {
  'high-pressure-fuel': ['fuel-injection'],
  lifting: [],
  'critical-fastener': ['head-and-studs', 'bottom-end', 'torque-converter'],
};

/**
 * Words that suggest each caution. High-pressure fuel is the injection side (not the
 * low-pressure lift pump); lifting is the truck or cab off the ground ("lift pump" is not).
 */
const wordsFor: Record<ChoosableCautionId, RegExp> = {
  'high-pressure-fuel':
    /\b(injectors?|nozzles?|fuel rails?|common[- ]rail|rail pressure|high[- ]pressure (fuel )?(pump|lines?|fuel|side|system)|hp (fuel )?(pump|lines?)|cp[34](\.\d)?|injection (pump|lines?|system)|injector (lines?|tubes?)|(fuel )?injection lines?)\b/i,
  lifting:
    /\b(cab[- ]off|(pull|pulling|lift|lifting|raise|raising|remove|removing|drop|dropping) (off )?(the )?cab|(lift|lifting|raise|raising|jack|jacking) (up )?(the )?(truck|vehicle|body|front|rear)|on (a|the) (lift|hoist|rack)|(two|2|four|4)[- ]post lift|jack(ing)? (it )?up|jack stands?|axle stands?|on stands|hoist|under the (truck|vehicle|cab))\b/i,
  'critical-fastener':
    /\b(head (studs?|bolts?|gaskets?)|rod (bolts?|caps?|nuts?)|connecting rods?|main (studs?|bolts?|caps?|bearings?|girdle)|flywheel|flex ?plate|flexplate|converter (bolts?|nuts?)|torque[- ]to[- ]yield|tty|crank(shaft)? (bolt|pulley|damper)|harmonic (balancer|damper))\b/i,
};

export type CautionSuggestion = { id: ChoosableCautionId; reasons: string[] };

/**
 * The cautions a step's parts and words suggest, each with why ("Linked part in Fuel
 * injection", "Says “injection lines”"), in the order of choosableCautionIds.
 */
export function suggestCautions(step: {
  title: string;
  description: string;
  partCategories: readonly string[];
}): CautionSuggestion[] {
  const text = `${step.title}\n${step.description}`;
  const out: CautionSuggestion[] = [];
  for (const id of choosableCautionIds) {
    const reasons: string[] = [];
    const category = categoriesFor[id].find((c) => step.partCategories.includes(c));
    if (category) reasons.push(`Linked part in ${partCategoryLabels[category]}`);
    const words = wordsFor[id].exec(text);
    if (words) reasons.push(`Says “${words[0]}”`);
    if (reasons.length) out.push({ id, reasons });
  }
  return out;
}

/**
 * Cautions for a step, in a fixed order:
 * - the ones its author ticked (`chosen`), or — when nobody has chosen — the suggested
 *   ones, plus lifting when the step is marked as raising the truck (liftsVehicle);
 * - service information whenever the step has a fastener spec.
 */
export function cautionsForStep(step: {
  title: string;
  description: string;
  partCategories: readonly string[];
  liftsVehicle: boolean;
  fastenerCount: number;
  /** What the author ticked; null or left out when nobody has chosen. */
  chosen?: readonly ChoosableCautionId[] | null;
}): Caution[] {
  const on = new Set<CautionId>(
    step.chosen ?? [
      ...suggestCautions(step).map((s) => s.id),
      ...(step.liftsVehicle ? (['lifting'] as const) : []),
    ],
  );
  if (step.fastenerCount > 0) on.add('service-information');
  const order: CautionId[] = [
    'high-pressure-fuel',
    'lifting',
    'critical-fastener',
    'service-information',
  ];
  return order.filter((id) => on.has(id)).map((id) => ({ id, ...cautionTexts[id] }));
}
