import { describe, expect, it } from 'vitest';
import {
  ToleranceRangeError,
  thermocoupleToleranceC,
  thermocoupleToleranceClasses,
} from '../../../shared/domain/analysis/thermocouple-tolerance';

describe('type K tolerance bands: the larger of the fixed and the proportional value', () => {
  it.each([
    // IEC 60584-1:2013 Class 1: ±1.5 °C or ±0.004·|t|, −40…1000 °C.
    ['iec-60584-1-class-1', 80, 1.5],
    ['iec-60584-1-class-1', 375, 1.5],
    ['iec-60584-1-class-1', 500, 2.0],
    ['iec-60584-1-class-1', -40, 1.5],
    // IEC 60584-1:2013 Class 2: ±2.5 °C or ±0.0075·|t|, −40…1200 °C.
    ['iec-60584-1-class-2', 80, 2.5],
    ['iec-60584-1-class-2', 333.3, 2.5],
    ['iec-60584-1-class-2', 400, 3.0],
    ['iec-60584-1-class-2', 1200, 9.0],
    // ASTM E230 standard limits: ±2.2 °C or ±0.75 %, 0…1260 °C.
    ['astm-e230-standard', 100, 2.2],
    ['astm-e230-standard', 400, 3.0],
    // ASTM E230 special limits: ±1.1 °C or ±0.4 %, 0…1260 °C.
    ['astm-e230-special', 100, 1.1],
    ['astm-e230-special', 500, 2.0],
  ] as const)('%s at %s °C is ±%s °C', (toleranceClass, celsius, expected) => {
    expect(thermocoupleToleranceC(celsius, toleranceClass)).toBeCloseTo(expected, 6);
  });

  it('names each standard so the report can cite it', () => {
    expect(thermocoupleToleranceClasses['iec-60584-1-class-2'].standard).toBe('IEC 60584-1:2013 Class 2');
    expect(thermocoupleToleranceClasses['astm-e230-special'].standard).toBe('ASTM E230 special limits');
  });

  it('refuses a reading outside the class range (IEC 60584-1 Class 1 ends at 1000 °C; ASTM E230 starts at 0 °C)', () => {
    expect(() => thermocoupleToleranceC(1100, 'iec-60584-1-class-1')).toThrow(ToleranceRangeError);
    expect(() => thermocoupleToleranceC(-5, 'astm-e230-standard')).toThrow(/covers 0…1260 °C/);
  });
});
