import type { FieldValues, Resolver } from 'react-hook-form';

/**
 * A react-hook-form resolver whose zod schema — and zod itself, about 28 kB —
 * loads when the form is first used instead of with the page: the sign-in page
 * and the build overview stay inside their size budget (e2e/bundle-size.spec.ts).
 * The schema is still the server's own (shared/schemas). Call `preload` when the
 * person starts typing (not on focus: a field may take focus by itself), so the
 * first check rarely waits.
 */
export function lazyResolver<I extends FieldValues, O>(
  load: () => Promise<Resolver<I, unknown, O>>,
): Resolver<I, unknown, O> & { preload: () => void } {
  let loaded: Promise<Resolver<I, unknown, O>> | undefined;
  const get = () => (loaded ??= load());
  const resolver = (async (values, context, options) =>
    (await get())(values, context, options)) as Resolver<I, unknown, O>;
  return Object.assign(resolver, { preload: () => void get() });
}
