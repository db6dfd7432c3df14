/**
 * The correction standards and their words on screen, apart from the zod schemas
 * (which re-export them), so a page that only shows a dyno figure never loads zod.
 */
/**
 * Standards a run can be corrected to. `uncorrected` is the figure as measured
 * (factor 1). See shared/dyno/correction.ts for each formula and its source.
 */
export const correctionStandards = [
  'uncorrected',
  'sae-j1349',
  'ece-r85',
  'sae-j607',
  'din-70020',
] as const;
export type CorrectionStandard = (typeof correctionStandards)[number];
export const correctionStandardLabels: Record<CorrectionStandard, string> = {
  uncorrected: 'As measured (no correction)',
  'sae-j1349': 'SAE J1349 (2004), 25 °C and 99 kPa dry air',
  'ece-r85': 'UN ECE R85 / ISO 1585, diesel engines',
  'sae-j607': 'SAE J607, older records (60 °F, 29.92 inHg)',
  'din-70020': 'DIN 70020, older records (20 °C, 1013 mbar)',
};
/** Short names for pickers and badges; the long label says the reference conditions. */
export const standardShortLabels: Record<CorrectionStandard, string> = {
  uncorrected: 'As measured',
  'sae-j1349': 'SAE J1349',
  'ece-r85': 'UN ECE R85 / ISO 1585',
  'sae-j607': 'SAE J607',
  'din-70020': 'DIN 70020',
};

/** The standard a page opens in when none is chosen: the one chassis dynos most often report. */
export const DEFAULT_CORRECTION_STANDARD: CorrectionStandard = 'sae-j1349';
