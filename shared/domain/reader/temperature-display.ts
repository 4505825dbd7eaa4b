import { celsiusTo } from '../analysis/temperature-units';

/** The reader's choice of unit for every temperature on the public site. */
export type DisplayUnit = 'C' | 'F';

export function parseDisplayUnit(value: unknown): DisplayUnit | null {
  return value === 'C' || value === 'F' ? value : null;
}

/**
 * A temperature (kind "absolute") or a temperature difference (kind "difference": a rise over ambient, a tolerance)
 * in the reader's unit. A difference scales by 9/5 without the 32 offset (ITS-90 definition °F = °C × 9/5 + 32).
 */
export function convertTemperature(celsius: number, unit: DisplayUnit, kind: 'absolute' | 'difference'): number {
  if (unit === 'C') return celsius;
  return kind === 'absolute' ? celsiusTo(celsius, 'F') : (celsius * 9) / 5;
}

/** "79.0 °C", "174.2 °F": one decimal, a thin space before the unit (the design notes). */
export function formatTemperature(celsius: number, unit: DisplayUnit, kind: 'absolute' | 'difference'): string {
  const value = convertTemperature(celsius, unit, kind);
  return `${value.toFixed(1)}\u2009°${unit}`;
}
