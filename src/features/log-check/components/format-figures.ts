import { formatDuration as formatSharedDuration } from '../../../../shared/domain/analysis/run-time-format';
import { temperatureUnitLabels } from '../../../../shared/domain/analysis/temperature-units';
import type { TemperatureUnit } from '../../../../shared/schemas/analysis';

/** Benchwire prints a unit after a thin space: 79.0 °C, 12.4 MB. */
export const thinSpace = '\u2009';

export function withUnit(value: string, unit: string): string {
  return `${value}${thinSpace}${unit}`;
}

export function formatC(celsius: number | null | undefined, digits = 1): string {
  return celsius === null || celsius === undefined ? '—' : withUnit(celsius.toFixed(digits), '°C');
}

/** A difference of temperatures, signed where it matters (drift). */
export function formatDeltaC(celsius: number | null | undefined, signed = false): string {
  if (celsius === null || celsius === undefined) return '—';
  const text = celsius.toFixed(1);
  return withUnit(signed && celsius > 0 ? `+${text}` : text, '°C');
}

/** Durations and times into a run, written the one Benchwire way (shared with the engine's messages and the CLI). */
export function formatDuration(seconds: number | null | undefined): string {
  return seconds === null || seconds === undefined ? '—' : formatSharedDuration(seconds);
}

export function formatHertz(hertz: number): string {
  return withUnit(hertz >= 1 ? hertz.toFixed(1) : hertz.toPrecision(2), 'Hz');
}

export function formatPercent(share: number | null | undefined): string {
  return share === null || share === undefined ? '—' : withUnit((share * 100).toFixed(1), '%');
}

export function formatBytes(bytes: number): string {
  if (bytes < 1024) return withUnit(String(bytes), 'B');
  if (bytes < 1024 * 1024) return withUnit((bytes / 1024).toFixed(1), 'KB');
  return withUnit((bytes / (1024 * 1024)).toFixed(1), 'MB');
}

export function formatCount(count: number): string {
  return count.toLocaleString('en-GB');
}

export function unitLabel(unit: TemperatureUnit): string {
  return temperatureUnitLabels[unit];
}
