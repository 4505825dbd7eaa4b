// A roundup moves forward through Benchwire's states. This release implements planning and testing; the
// later steps (writing, review, scheduling, going live, updates) belong to the editorial and publishing
// issues, which extend `implementedTransitions`.

export const roundupStates = [
  'planning',
  'on-the-bench',
  'writing',
  'in-review',
  'scheduled',
  'live',
  'updated',
] as const;
export type RoundupState = (typeof roundupStates)[number];

export const roundupStateLabels: Record<RoundupState, string> = {
  planning: 'Planning',
  'on-the-bench': 'On the bench',
  writing: 'Writing',
  'in-review': 'In review',
  scheduled: 'Scheduled',
  live: 'Live',
  updated: 'Updated',
};

/** The next state forward (live → updated; updated stays updated on later revisions). */
export function nextRoundupState(state: RoundupState): RoundupState | null {
  if (state === 'updated') return null;
  return roundupStates[roundupStates.indexOf(state) + 1] ?? null;
}

/** States in which the test plan (entries, configurations, bench profile, band) may still change. */
export const planEditableStates: readonly RoundupState[] = ['planning', 'on-the-bench'];

/** Transitions this release can make. */
export const implementedTransitions: ReadonlyArray<{ from: RoundupState; to: RoundupState }> = [
  { from: 'planning', to: 'on-the-bench' },
  { from: 'on-the-bench', to: 'writing' },
  { from: 'writing', to: 'in-review' },
  // Publishing: scheduled with a date, time and zone; live when the job runner reaches that time; updated when an
  // editor publishes an update or correction. These go through Publishing, never through a plain state change.
  { from: 'in-review', to: 'scheduled' },
  { from: 'scheduled', to: 'live' },
  { from: 'live', to: 'updated' },
];

/** Why a plain state change cannot make the publishing moves, and where they are made instead. */
const publishingMoves: Partial<Record<RoundupState, string>> = {
  scheduled: 'Schedule it under Publishing: choose the date, time and time zone of the embargo.',
  live: 'It goes live by itself at its scheduled time.',
  updated: 'Publish an update or a correction with a note under Publishing.',
};

export interface RoundupFacts {
  state: RoundupState;
  hasBenchProfile: boolean;
  loadConfigurationCount: number;
  testedEntryCount: number;
  cellCount: number;
  acceptedCellCount: number;
}

/** What stands in the way of moving the roundup to `to`; an empty list means it may move. */
export function roundupTransitionProblems(facts: RoundupFacts, to: RoundupState): string[] {
  const next = nextRoundupState(facts.state);
  if (to !== next) {
    return [
      next
        ? `A roundup that is ${roundupStateLabels[facts.state]} can only move forward to ${roundupStateLabels[next]}.`
        : `A roundup that is ${roundupStateLabels[facts.state]} has no further state.`,
    ];
  }
  if (!implementedTransitions.some((t) => t.from === facts.state && t.to === to)) {
    return [`Moving to ${roundupStateLabels[to]} is not available yet.`];
  }
  const publishingMove = publishingMoves[to];
  if (publishingMove) return [publishingMove];
  const problems: string[] = [];
  if (to === 'on-the-bench') {
    if (!facts.hasBenchProfile) problems.push('Choose a bench profile for the test plan.');
    if (facts.loadConfigurationCount === 0) problems.push('Add at least one load configuration.');
    if (facts.testedEntryCount === 0) problems.push('Add at least one product to test.');
  }
  if (to === 'writing') {
    const open = facts.cellCount - facts.acceptedCellCount;
    if (facts.cellCount === 0) problems.push('The matrix has no cells to test.');
    else if (open > 0) problems.push(`${open} matrix cell(s) are not accepted yet.`);
  }
  return problems;
}
