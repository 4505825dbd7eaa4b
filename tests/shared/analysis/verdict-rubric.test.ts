import { describe, expect, it } from 'vitest';
import { judgeRun, type VerdictFacts } from '../../../shared/domain/analysis/verdict-rubric';
import { defaultVerdictRubric, verdictRubricSchema } from '../../../shared/schemas/analysis';

const cool: VerdictFacts = {
  peakC: 72,
  normalizedPeakC: null,
  referenceRoomC: 21,
  useNormalizedPeak: false,
  throttled: false,
  throttleSource: 'clock',
  firstThrottleAtS: null,
  unstable: false,
};

describe('verdict rubric (defaults: common practice in VRM thermal reviews, no published source)', () => {
  it('has defaults a roundup can store: below 80 °C comfortable, up to 100 °C warm', () => {
    expect(defaultVerdictRubric).toEqual({
      comfortableBelowC: 80,
      warmUpToC: 100,
      labels: { comfortable: 'Comfortable', warm: 'Warm', 'hot-but-held': 'Hot but held', throttled: 'Throttled' },
    });
    expect(verdictRubricSchema.parse({ comfortableBelowC: 75 }).warmUpToC).toBe(100);
    expect(verdictRubricSchema.safeParse({ comfortableBelowC: 90, warmUpToC: 85 }).success).toBe(false);
  });

  it.each([
    [79.9, 'comfortable', 'Comfortable'],
    [80, 'warm', 'Warm'],
    [100, 'warm', 'Warm'],
    [100.1, 'hot-but-held', 'Hot but held'],
  ] as const)('a peak of %s °C without throttling is %s', (peakC, code, label) => {
    const verdict = judgeRun({ ...cool, peakC }, defaultVerdictRubric);
    expect(verdict).toMatchObject({ code, label, basis: 'absolute', judgedC: peakC });
  });

  it('fails a throttled run whatever its peak, and says when and why', () => {
    const verdict = judgeRun({ ...cool, throttled: true, firstThrottleAtS: 1800 }, defaultVerdictRubric);
    expect(verdict.code).toBe('throttled');
    expect(verdict.rule).toBe('The CPU clock fell and stayed down from 30\u2009min. A run that throttles fails.');
  });

  it('fails a run the tester marked unstable', () => {
    expect(judgeRun({ ...cool, unstable: true }, defaultVerdictRubric)).toMatchObject({
      code: 'throttled',
      rule: 'The tester marked the system unstable during the soak. An unstable run fails.',
    });
  });

  it('judges the normalised peak when the bench profile says so, and explains it', () => {
    const verdict = judgeRun(
      { ...cool, peakC: 84, normalizedPeakC: 78, useNormalizedPeak: true },
      defaultVerdictRubric,
    );
    expect(verdict).toMatchObject({ code: 'comfortable', basis: 'normalized', judgedC: 78 });
    expect(verdict.rule).toContain('normalised to a 21.0\u2009°C room');
  });

  it('falls back to the absolute peak when no ambient was logged, and says so', () => {
    const verdict = judgeRun({ ...cool, peakC: 84, useNormalizedPeak: true }, defaultVerdictRubric);
    expect(verdict).toMatchObject({ code: 'warm', basis: 'absolute' });
    expect(verdict.rule).toContain('absolute: no ambient was logged');
  });

  it("uses a roundup's own thresholds and labels", () => {
    const rubric = verdictRubricSchema.parse({ comfortableBelowC: 70, warmUpToC: 90, labels: { warm: 'Toasty' } });
    expect(judgeRun({ ...cool, peakC: 75 }, rubric)).toMatchObject({ code: 'warm', label: 'Toasty' });
  });
});
