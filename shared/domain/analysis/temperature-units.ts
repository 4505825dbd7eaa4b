import type { TemperatureUnit } from '../../schemas/analysis';

export type ThermometricUnit = Exclude<TemperatureUnit, 'mV'>;

const kelvinOffset = 273.15;

/** Converts a reading in °C, °F or K to °C (ITS-90 definitions: K = °C + 273.15, °F = °C × 9/5 + 32). */
export function celsiusFrom(value: number, unit: ThermometricUnit): number {
  if (unit === 'C') return value;
  if (unit === 'F') return ((value - 32) * 5) / 9;
  return value - kelvinOffset;
}

export function celsiusTo(celsius: number, unit: ThermometricUnit): number {
  if (unit === 'C') return celsius;
  if (unit === 'F') return (celsius * 9) / 5 + 32;
  return celsius + kelvinOffset;
}

export const temperatureUnitLabels: Record<TemperatureUnit, string> = { C: '°C', F: '°F', K: 'K', mV: 'mV' };
