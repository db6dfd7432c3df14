/**
 * The server's clock as the device last saw it. A reading carries the time it was taken
 * (takenAt); a phone whose clock runs fast or slow would otherwise date it wrongly (or be
 * refused as dated in the future), so the time is the device's clock moved by how far it
 * was off from the server's at the last answer (the Date header). Kept on the device for
 * readings taken without signal.
 */
const offsetKey = 'headroom-server-clock-offset';

let offsetMs: number | null = null;

function readSaved(): number {
  try {
    const saved = Number(localStorage.getItem(offsetKey));
    return Number.isFinite(saved) ? saved : 0;
  } catch {
    return 0;
  }
}

/** Notes how far the device's clock is from the server's, from an answer's Date header. */
export function noteServerDate(dateHeader: string | null) {
  const server = dateHeader ? Date.parse(dateHeader) : NaN;
  if (Number.isNaN(server)) return;
  // The header is to the second: within two seconds the device's own clock is kept as is.
  const off = server - Date.now();
  offsetMs = Math.abs(off) < 2000 ? 0 : off;
  try {
    localStorage.setItem(offsetKey, String(offsetMs));
  } catch {
    // No storage (private mode): the offset lasts as long as the page.
  }
}

/** Now, by the server's clock as far as the device knows it, as an ISO time. */
export function serverNow(): string {
  offsetMs ??= readSaved();
  return new Date(Date.now() + offsetMs).toISOString();
}
