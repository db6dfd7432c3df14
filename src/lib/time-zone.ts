import { isTimeZone } from '../../shared/dates';

/** This device's IANA time zone, when the browser names one Headroom accepts. */
export function browserTimeZone(): string | undefined {
  try {
    const zone = Intl.DateTimeFormat().resolvedOptions().timeZone;
    return zone && isTimeZone(zone) ? zone : undefined;
  } catch {
    return undefined;
  }
}
