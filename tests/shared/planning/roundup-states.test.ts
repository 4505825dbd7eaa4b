import { describe, expect, it } from 'vitest';
import {
  nextRoundupState,
  roundupStateLabels,
  roundupTransitionProblems,
  type RoundupFacts,
} from '../../../shared/domain/planning/roundup-states';

const ready: RoundupFacts = {
  state: 'planning',
  hasBenchProfile: true,
  loadConfigurationCount: 3,
  testedEntryCount: 7,
  cellCount: 21,
  acceptedCellCount: 0,
};

// Benchwire's own workflow (product rules, no external source).
describe('roundup states', () => {
  it('go forward Planning → On the bench → Writing → In review → Scheduled → Live → Updated', () => {
    const order: string[] = [];
    for (let state: keyof typeof roundupStateLabels | null = 'planning'; state; state = nextRoundupState(state)) {
      order.push(roundupStateLabels[state]);
    }
    expect(order).toEqual(['Planning', 'On the bench', 'Writing', 'In review', 'Scheduled', 'Live', 'Updated']);
  });

  it('a planned roundup goes on the bench once it has a profile, configurations and products', () => {
    expect(roundupTransitionProblems(ready, 'on-the-bench')).toEqual([]);
    expect(
      roundupTransitionProblems(
        { ...ready, hasBenchProfile: false, loadConfigurationCount: 0, testedEntryCount: 0 },
        'on-the-bench',
      ),
    ).toEqual([
      'Choose a bench profile for the test plan.',
      'Add at least one load configuration.',
      'Add at least one product to test.',
    ]);
  });

  it('writing starts when every cell is accepted; no skipping and no going back', () => {
    const bench = { ...ready, state: 'on-the-bench' as const };
    expect(roundupTransitionProblems({ ...bench, acceptedCellCount: 20 }, 'writing')).toEqual([
      '1 matrix cell(s) are not accepted yet.',
    ]);
    expect(roundupTransitionProblems({ ...bench, acceptedCellCount: 21 }, 'writing')).toEqual([]);
    expect(roundupTransitionProblems(ready, 'writing')[0]).toMatch(/only move forward to On the bench/);
    expect(roundupTransitionProblems(bench, 'planning')[0]).toMatch(/only move forward to Writing/);
    expect(roundupTransitionProblems({ ...ready, state: 'writing' }, 'in-review')).toEqual([]);
    // Scheduling, going live and updates are made under Publishing, which says where.
    expect(roundupTransitionProblems({ ...ready, state: 'in-review' }, 'scheduled')).toEqual([
      'Schedule it under Publishing: choose the date, time and time zone of the embargo.',
    ]);
  });
});
