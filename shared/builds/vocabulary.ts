/**
 * A build's fixed choices and their words on screen. Apart from the zod schemas
 * (which re-export them), so a page that only shows a build never loads zod.
 */
export const aspirations = [
  'naturally-aspirated',
  'single-turbo',
  'twin-turbo',
  'compound-turbo',
  'supercharged',
] as const;
export const aspirationLabels: Record<(typeof aspirations)[number], string> = {
  'naturally-aspirated': 'Naturally aspirated',
  'single-turbo': 'Single turbo',
  'twin-turbo': 'Twin turbo (parallel)',
  'compound-turbo': 'Compound turbos',
  supercharged: 'Supercharged',
};

export const powerBases = ['crank', 'wheel'] as const;
export const powerBasisLabels: Record<(typeof powerBases)[number], string> = {
  crank: 'crank hp',
  wheel: 'wheel hp',
};
