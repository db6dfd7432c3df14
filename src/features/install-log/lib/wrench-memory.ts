import { useCallback, useSyncExternalStore } from 'react';

const key = 'headroom.install.wrench-id';
const event = 'headroom:wrench';

function read(): string {
  try {
    return window.localStorage.getItem(key) ?? '';
  } catch {
    return '';
  }
}

function subscribe(onChange: () => void) {
  window.addEventListener('storage', onChange);
  window.addEventListener(event, onChange);
  return () => {
    window.removeEventListener('storage', onChange);
    window.removeEventListener(event, onChange);
  };
}

/**
 * Which of my wrenches I last used on this device, kept in localStorage so it is chosen
 * once per session in the garage, not once per bolt. Every fastener on the page shares it.
 */
export function useRememberedWrench(): [string, (wrenchId: string) => void] {
  const wrenchId = useSyncExternalStore(subscribe, read, () => '');
  const set = useCallback((next: string) => {
    try {
      window.localStorage.setItem(key, next);
    } catch {
      // Private mode or storage full: the wrench is simply not remembered.
    }
    window.dispatchEvent(new Event(event));
  }, []);
  return [wrenchId, set];
}
