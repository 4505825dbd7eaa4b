// A write-up section's review, in Benchwire's words: the writer drafts, hands it to the editor, the editor signs it
// off or hands it back. Changing the text of a signed-off section hands it back to drafting, so what was signed off
// is always what will be published.

export const sectionReviewStates = ['drafting', 'with-editor', 'signed-off'] as const;
export type SectionReviewState = (typeof sectionReviewStates)[number];

export const sectionReviewStateLabels: Record<SectionReviewState, string> = {
  drafting: 'Drafting',
  'with-editor': 'With the editor',
  'signed-off': 'Signed off',
};

export const sectionKinds = ['introduction', 'methodology', 'product', 'conclusion'] as const;
export type SectionKind = (typeof sectionKinds)[number];

export const sectionKindLabels: Record<SectionKind, string> = {
  introduction: 'Introduction',
  methodology: 'How we tested',
  product: 'Product',
  conclusion: 'Conclusion',
};

/** The review moves a person can make on a section. */
export const sectionReviewMoves = ['hand-to-editor', 'sign-off', 'hand-back'] as const;
export type SectionReviewMove = (typeof sectionReviewMoves)[number];

export const sectionReviewMoveLabels: Record<SectionReviewMove, string> = {
  'hand-to-editor': 'Ask for review',
  'sign-off': 'Sign off',
  'hand-back': 'Hand back to the writer',
};

const moveTargets: Record<SectionReviewMove, { from: readonly SectionReviewState[]; to: SectionReviewState }> = {
  'hand-to-editor': { from: ['drafting'], to: 'with-editor' },
  // An editor may sign off a section they drafted themselves without handing it to themselves first.
  'sign-off': { from: ['drafting', 'with-editor'], to: 'signed-off' },
  'hand-back': { from: ['with-editor', 'signed-off'], to: 'drafting' },
};

/** The state a move leads to, or the reason it cannot be made from `state`. */
export function sectionReviewMove(
  state: SectionReviewState,
  move: SectionReviewMove,
): { ok: true; to: SectionReviewState } | { ok: false; reason: string } {
  const target = moveTargets[move];
  if (target.from.includes(state)) return { ok: true, to: target.to };
  return {
    ok: false,
    reason: `A section that is ${sectionReviewStateLabels[state]} cannot be moved with “${sectionReviewMoveLabels[move]}”.`,
  };
}

/** The review state after the section's text changed: a signed-off section goes back to drafting. */
export function reviewStateAfterEdit(state: SectionReviewState): SectionReviewState {
  return state === 'signed-off' ? 'drafting' : state;
}

export interface SectionReviewFacts {
  title: string;
  reviewState: SectionReviewState;
  openThreadCount: number;
}

/**
 * What keeps a write-up from being ready, in plain sentences, each with the section it is about (none when the
 * write-up was never started); an empty list means every section is signed off and no comment thread is left open.
 */
export function writeUpBlockers<Section extends SectionReviewFacts>(
  sections: readonly Section[],
): { reason: string; section: Section | null }[] {
  if (sections.length === 0) {
    return [{ reason: 'The write-up has not been started: open Write-up to create its sections.', section: null }];
  }
  const blockers: { reason: string; section: Section }[] = [];
  for (const section of sections) {
    if (section.reviewState !== 'signed-off') {
      blockers.push({
        reason: `Write-up section “${section.title}” is ${sectionReviewStateLabels[section.reviewState]}, not signed off.`,
        section,
      });
    }
    if (section.openThreadCount > 0) {
      blockers.push({
        reason: `Write-up section “${section.title}” has ${section.openThreadCount} open comment thread${section.openThreadCount === 1 ? '' : 's'}.`,
        section,
      });
    }
  }
  return blockers;
}

/** The blockers' sentences alone (the write-up overview lists them). */
export function writeUpBlockingReasons(sections: readonly SectionReviewFacts[]): string[] {
  return writeUpBlockers(sections).map((blocker) => blocker.reason);
}

/** True when every section is signed off (and there is at least one). */
export function allSectionsSignedOff(sections: readonly Pick<SectionReviewFacts, 'reviewState'>[]): boolean {
  return sections.length > 0 && sections.every((section) => section.reviewState === 'signed-off');
}
