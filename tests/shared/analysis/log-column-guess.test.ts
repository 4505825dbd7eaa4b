import { describe, expect, it } from 'vitest';
import {
  guessColumnMapping,
  guessColumnRole,
  unitFromColumnName,
} from '../../../shared/domain/analysis/log-column-guess';

describe('guessing column roles from header names', () => {
  it.each([
    ['Time [s]', 'time'],
    ['Timestamp', 'time'],
    ['VRM 1 [°C]', 'vrm'],
    ['MOS rear', 'vrm'],
    ['Power stage temp', 'vrm'],
    ['Ambient', 'ambient'],
    ['Room air', 'ambient'],
    ['CPU clock [MHz]', 'clock'],
    ['Core freq', 'clock'],
    ['Package power [W]', 'power'],
    ['CPU pkg (W)', 'power'],
    ['CJC', 'cold-junction'],
    ['Notes', 'other'],
  ] as const)('%s → %s', (name, role) => {
    expect(guessColumnRole(name)).toBe(role);
  });

  it.each([
    ['VRM 1 [°C]', 'C'],
    ['TC2 (mV)', 'mV'],
    ['Ambient degF', 'F'],
    ['Probe (K)', 'K'],
    ['VRM 3', null],
  ] as const)('unit of %s is %s', (name, unit) => {
    expect(unitFromColumnName(name)).toBe(unit);
  });

  it('offers a full mapping when the header names the roles', () => {
    expect(
      guessColumnMapping(['Time', 'VRM 1', 'VRM 2', 'Ambient', 'Clock (MHz)', 'Package power (W)'], 'Time'),
    ).toEqual({
      time: 'Time',
      vrm: ['VRM 1', 'VRM 2'],
      ambient: 'Ambient',
      clock: 'Clock (MHz)',
      power: 'Package power (W)',
    });
  });

  it('falls back to generic channels (CH1, TC2) for the VRM probes, leaving the ambient out', () => {
    expect(guessColumnMapping(['Time', 'CH1', 'CH2', 'Ambient'], 'Time')).toMatchObject({
      vrm: ['CH1', 'CH2'],
      ambient: 'Ambient',
      clock: null,
    });
  });

  it('guesses nothing when no column looks like a VRM probe', () => {
    expect(guessColumnMapping(['Time', 'Ambient', 'Notes'], 'Time')).toBeNull();
  });
});
