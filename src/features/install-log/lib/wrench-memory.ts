import { useCallback, useSyncExternalStore } from 'react';

const key = 'headroom.install.wrench';
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
 * The wrench last used on this device, kept in localStorage so it is typed once per
 * session in the garage, not once per bolt. Every entry form on the page shares it.
 */
export function useRememberedWrench(): [string, (wrench: string) => void] {
  const wrench = useSyncExternalStore(subscribe, read, () => '');
  const set = useCallback((next: string) => {
    try {
      window.localStorage.setItem(key, next);
    } catch {
      // Private mode or storage full: the wrench is simply not remembered.
    }
    window.dispatchEvent(new Event(event));
  }, []);
  return [wrench, set];
}
