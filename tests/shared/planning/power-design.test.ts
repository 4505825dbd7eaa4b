import { describe, expect, it } from 'vitest';
import {
  effectivePhaseCount,
  stagesPerPhaseProblem,
  vcoreRatedCurrentA,
  vcoreStageCount,
} from '../../../shared/domain/planning/power-design';

// First principles of a multiphase buck converter: doublers interleave two phases per controller phase;
// teamed stages switch together and add current capacity, not phases.
describe('V-core power design', () => {
  it.each([
    [8, 'direct', 1, 8, 8],
    [8, 'doubled', 1, 16, 16],
    [8, 'teamed', 2, 8, 16],
    [6, 'teamed', 3, 6, 18],
  ] as const)(
    '%i controller phases, %s, %i stage(s) per phase → %i effective phases, %i stages',
    (phases, mode, perPhase, effective, stages) => {
      expect(effectivePhaseCount(phases, mode)).toBe(effective);
      expect(vcoreStageCount(phases, mode, perPhase)).toBe(stages);
    },
  );

  it('rated current is the sum of the stage ratings: 16 × 62.5 A = 1000 A', () => {
    expect(vcoreRatedCurrentA(16, 62.5)).toBe(1000);
  });

  it('stages per phase must fit the multiplication', () => {
    expect(stagesPerPhaseProblem('teamed', 1)).toMatch(/two or more/);
    expect(stagesPerPhaseProblem('direct', 2)).toMatch(/means teamed/);
    expect(stagesPerPhaseProblem('doubled', 1)).toBeNull();
    expect(stagesPerPhaseProblem('teamed', 2)).toBeNull();
  });
});
