import { describe, expect, it } from 'vitest';
import { calibrationOverdue, nextCalibrationDue } from '../../../shared/domain/planning/calibration';

describe('next calibration due', () => {
  it('adds calendar months; a day the target month lacks becomes its last day', () => {
    // Expected dates counted by hand on a calendar (2028 is a leap year: divisible by 4, not by 100).
    expect(nextCalibrationDue('2026-03-15', 12)).toBe('2027-03-15');
    expect(nextCalibrationDue('2026-11-30', 3)).toBe('2027-02-28');
    expect(nextCalibrationDue('2027-08-31', 6)).toBe('2028-02-29');
    expect(nextCalibrationDue('2026-01-31', 1)).toBe('2026-02-28');
    expect(nextCalibrationDue('2026-12-01', 1)).toBe('2027-01-01');
    expect(nextCalibrationDue('2026-05-20', 60)).toBe('2031-05-20');
  });

  it('is overdue only once the due date has passed', () => {
    expect(calibrationOverdue('2026-12-03', '2026-12-03')).toBe(false);
    expect(calibrationOverdue('2026-12-02', '2026-12-03')).toBe(true);
    expect(calibrationOverdue(null, '2026-12-03')).toBe(false);
  });
});
