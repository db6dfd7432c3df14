import { paths } from '@shared/paths';

export { paths };

/**
 * A `?next=` value is only followed when it is a path on this site; anything else
 * (another origin, a protocol-relative `//host`) falls back to the builds list.
 */
export function safeNext(next: string | null | undefined): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) {
    return paths.builds.list.getHref();
  }
  if (next.startsWith(paths.auth.signIn.path) || next.startsWith(paths.auth.signUp.path)) {
    return paths.builds.list.getHref();
  }
  return next;
}
