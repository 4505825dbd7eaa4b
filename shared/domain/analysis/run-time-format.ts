/** Seconds into a run as m:ss or h:mm:ss, the way a tester reads a logger's clock. */
export function formatRunTime(seconds: number): string {
  const whole = Math.max(0, Math.round(seconds));
  const hours = Math.floor(whole / 3600);
  const minutes = Math.floor((whole % 3600) / 60);
  const secs = String(whole % 60).padStart(2, '0');
  return hours > 0 ? `${hours}:${String(minutes).padStart(2, '0')}:${secs}` : `${minutes}:${secs}`;
}

/** A temperature with one decimal and a thin space before the unit, as Benchwire prints them. */
export function formatCelsius(celsius: number): string {
  return `${celsius.toFixed(1)}\u2009°C`;
}
