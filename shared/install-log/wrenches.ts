/**
 * Torque wrench calibration. A reading taken with a wrench whose last calibration is older
 * than the build's interval is kept but flagged: the wrench may read wrong, so the torque
 * it recorded is worth checking with a calibrated one.
 *
 * The default interval, 12 months, is the usual interval ISO 6789-2:2017 gives for hand
 * torque tools when the user sets none (it also counts 5000 cycles, which Headroom does
 * not track). Quoted from memory of the standard, not from its text: the owner sets the
 * interval the build follows.
 */
export const defaultCalibrationMonths = 12;
export const minCalibrationMonths = 1;
export const maxCalibrationMonths = 60;

/**
 * The date a calibration falls due: `months` calendar months after it, on the same day of
 * the month, or the month's last day when it has no such day (Aug 31 + 6 months = Feb 28).
 */
export function calibrationDueOn(calibratedOn: string, months: number): string {
  const [y, m, d] = calibratedOn.split('-').map(Number);
  const monthIndex = m - 1 + months;
  const year = y + Math.floor(monthIndex / 12);
  const month = ((monthIndex % 12) + 12) % 12;
  const lastDay = new Date(Date.UTC(year, month + 1, 0)).getUTCDate();
  const day = Math.min(d, lastDay);
  return `${String(year).padStart(4, '0')}-${String(month + 1).padStart(2, '0')}-${String(day).padStart(2, '0')}`;
}

export type Calibration = {
  /** When the wrench was last calibrated, as its owner recorded it; null if not known. */
  calibratedOn: string | null;
  /** When that calibration fell due under the build's interval; null if not known. */
  dueOn: string | null;
  /** The reading was taken after dueOn. */
  overdue: boolean;
};

/** A wrench's calibration on a given day (YYYY-MM-DD), under an interval in months. */
export function calibrationOn(
  calibratedOn: string | null,
  months: number,
  on: string,
): Calibration {
  if (!calibratedOn) return { calibratedOn: null, dueOn: null, overdue: false };
  const dueOn = calibrationDueOn(calibratedOn, months);
  return { calibratedOn, dueOn, overdue: on > dueOn };
}
