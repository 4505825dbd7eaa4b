/**
 * When an instrument's next calibration is due: the calibration date plus the interval in calendar months. A day
 * that the target month lacks falls back to its last day (31 Jan + 1 month = 28 Feb, or 29 Feb in a leap year), as
 * calendar month arithmetic usually does (common practice, no source).
 */
export function nextCalibrationDue(calibratedOn: string, intervalMonths: number): string {
  const [year, month, day] = calibratedOn.split('-').map(Number);
  const monthIndex = month - 1 + intervalMonths;
  const targetYear = year + Math.floor(monthIndex / 12);
  const targetMonth = ((monthIndex % 12) + 12) % 12;
  const lastDay = new Date(Date.UTC(targetYear, targetMonth + 1, 0)).getUTCDate();
  const date = new Date(Date.UTC(targetYear, targetMonth, Math.min(day, lastDay)));
  return date.toISOString().slice(0, 10);
}

/** Past due once the due date has passed: an instrument due today is still within its calibration. */
export function calibrationOverdue(dueOn: string | null, today: string): boolean {
  return dueOn !== null && dueOn < today;
}
