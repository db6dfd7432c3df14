import { useCallback, useSyncExternalStore } from 'react';

/** True while the CSS media query matches (e.g. '(min-width: 768px)'); re-renders on change. */
export function useMediaQuery(query: string, serverFallback = true): boolean {
  const subscribe = useCallback(
    (notify: () => void) => {
      const list = window.matchMedia(query);
      list.addEventListener('change', notify);
      return () => list.removeEventListener('change', notify);
    },
    [query],
  );
  return useSyncExternalStore(
    subscribe,
    () => window.matchMedia(query).matches,
    () => serverFallback,
  );
}
