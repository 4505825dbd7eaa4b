const thinSpace = '\u2009';

/**
 * Benchwire's one way to write a duration or a time into a run, on every analysis screen, message and CLI line:
 * "45 s", "16 min 40 s", "60 min". Minutes are not rolled into hours, because soaks are configured in minutes.
 * Sample intervals under 10 s keep their fraction ("0.50 s", "2.5 s").
 */
export function formatDuration(seconds: number): string {
  if (!Number.isFinite(seconds)) return '—';
  const sign = seconds < 0 ? '−' : '';
  const size = Math.abs(seconds);
  if (size < 10 && Math.abs(size - Math.round(size)) > 1e-9) {
    return `${sign}${size >= 1 ? size.toFixed(1) : size.toPrecision(2)}${thinSpace}s`;
  }
  const whole = Math.round(size);
  if (whole < 60) return `${sign}${whole}${thinSpace}s`;
  const minutes = Math.floor(whole / 60);
  const secs = whole % 60;
  return `${sign}${minutes}${thinSpace}min${secs === 0 ? '' : ` ${secs}${thinSpace}s`}`;
}

/** A temperature with one decimal and a thin space before the unit, as Benchwire prints them. */
export function formatCelsius(celsius: number): string {
  return `${celsius.toFixed(1)}${thinSpace}°C`;
}
