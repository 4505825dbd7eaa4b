import { describe, expect, it } from 'vitest';
import { checkSteadyState } from '../../../shared/domain/analysis/steady-state';

function run(durationS: number, celsiusAt: (t: number) => number) {
  const timeS = Float64Array.from({ length: durationS }, (_, t) => t);
  return { timeS, valuesC: timeS.map(celsiusAt) };
}

describe('steady state: change over the final window (default after the rate of IEC 62368-1 B.1.6, ≤ 3 K in 30 min)', () => {
  it('is steady when the probe holds flat over the last 10 minutes', () => {
    const { timeS, valuesC } = run(3600, () => 72);
    const check = checkSteadyState(timeS, valuesC, 600, 1, 1);
    expect(check).toMatchObject({ reached: true, meanC: 72, windowStartIndex: 3000 });
    expect(check.changeC).toBeCloseTo(0, 12);
  });

  it('is not steady when the probe still climbs 1.5 °C over the last 10 minutes (first principles: 0.0025 °C/s × 600 s)', () => {
    const { timeS, valuesC } = run(3600, (t) => 60 + 0.0025 * t);
    const check = checkSteadyState(timeS, valuesC, 600, 1, 1);
    expect(check.changeC).toBeCloseTo(1.5, 9);
    expect(check.reached).toBe(false);
  });

  it('is steady at exactly the limit and judges a cooling probe by the size of its change', () => {
    const rising = run(3600, (t) => 60 + t / 600);
    expect(checkSteadyState(rising.timeS, rising.valuesC, 600, 1, 1).reached).toBe(true);
    const cooling = run(3600, (t) => 90 - (2 * t) / 600);
    expect(checkSteadyState(cooling.timeS, cooling.valuesC, 600, 1, 1).reached).toBe(false);
  });

  it('is not steady when the log is shorter than the window', () => {
    const { timeS, valuesC } = run(300, () => 70);
    expect(checkSteadyState(timeS, valuesC, 600, 1, 1).reached).toBe(false);
  });
});
