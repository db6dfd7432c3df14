/**
 * What a build's public page can show, and its words on screen. Apart from the
 * zod schemas (shared/schemas/sharing.ts re-exports them), so the public page
 * never loads zod.
 */

/** What the public page can show, in the order it shows them. */
export const shareSections = [
  'summary',
  'parts',
  'estimate',
  'install',
  'bench',
  'dyno',
  'photos',
] as const;
export type ShareSection = (typeof shareSections)[number];

export const shareSectionLabels: Record<ShareSection, string> = {
  summary: 'Truck and target',
  parts: 'Parts list: status and ratings',
  estimate: 'Weakest link and supported power',
  install: 'Install progress and torque record',
  bench: 'Injector bench results',
  dyno: 'Dyno results',
  photos: 'Photos you mark public',
};

export const shareSectionHints: Record<ShareSection, string> = {
  summary: 'Vehicle, engine, transmission, stock and target power, target date and event.',
  parts: 'Each part by category with its status and rating. Never prices, vendors or notes.',
  estimate: 'The part with the least headroom and the most power the build as planned supports.',
  install: 'Jobs and steps, sign-offs, and each torque spec with its readings in or out of spec.',
  bench: 'Each flow-bench sheet’s date and verdict.',
  dyno: 'Each dyno day’s best pull, corrected, against the target.',
  photos: 'Only the photos you mark public below.',
};

export type ShareSections = Record<ShareSection, boolean>;

/** A new share shows the build and its progress; photos only once the owner marks some. */
export const defaultShareSections: ShareSections = {
  summary: true,
  parts: true,
  estimate: true,
  install: true,
  bench: true,
  dyno: true,
  photos: true,
};
