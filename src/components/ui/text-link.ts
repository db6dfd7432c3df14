/** A plain text link with a touch-sized target (44 px tall), for secondary actions in forms. */
export const textLinkClasses =
  'inline-flex min-h-11 items-center font-semibold text-accent-700 underline';
