import { describe, expect, it } from 'vitest';
import {
  allSectionsSignedOff,
  reviewStateAfterEdit,
  sectionReviewMove,
  writeUpBlockingReasons,
} from '../../../shared/domain/editorial/section-states';
import { writeUpLockedReason } from '../../../shared/domain/editorial/write-up-availability';

// Benchwire's own editorial rules (issue 9), no outside source: the checks state the rules as the product defines them.
describe('write-up section review', () => {
  it.each([
    { from: 'drafting', move: 'hand-to-editor', to: 'with-editor' },
    { from: 'with-editor', move: 'sign-off', to: 'signed-off' },
    { from: 'with-editor', move: 'hand-back', to: 'drafting' },
    { from: 'signed-off', move: 'hand-back', to: 'drafting' },
  ] as const)(
    'a writer hands a draft to the editor; the editor signs off or hands back: $from, $move → $to',
    ({ from, move, to }) => {
      expect(sectionReviewMove(from, move)).toEqual({ ok: true, to });
    },
  );

  it.each([
    ['with-editor', 'hand-to-editor'],
    ['signed-off', 'sign-off'],
    ['drafting', 'hand-back'],
  ] as const)('nothing skips backwards silently: %s refuses %s', (from, move) => {
    expect(sectionReviewMove(from, move).ok).toBe(false);
  });

  it.each([
    ['signed-off', 'drafting'],
    ['with-editor', 'with-editor'],
    ['drafting', 'drafting'],
  ] as const)(
    'changing a signed-off section sends it back to drafting; other states keep theirs: %s → %s',
    (from, to) => {
      expect(reviewStateAfterEdit(from)).toBe(to);
    },
  );

  it('says what blocks readiness: unsigned sections and open threads, or a write-up never started', () => {
    expect(writeUpBlockingReasons([])).toEqual([
      'The write-up has not been started: open Write-up to create its sections.',
    ]);
    expect(
      writeUpBlockingReasons([
        { title: 'Introduction', reviewState: 'signed-off', openThreadCount: 0 },
        { title: 'Conclusion', reviewState: 'with-editor', openThreadCount: 2 },
      ]),
    ).toEqual([
      'Write-up section “Conclusion” is With the editor, not signed off.',
      'Write-up section “Conclusion” has 2 open comment threads.',
    ]);
    expect(allSectionsSignedOff([{ reviewState: 'signed-off' }])).toBe(true);
    expect(allSectionsSignedOff([])).toBe(false);
  });

  it('the write-up is editable in Writing and In review only', () => {
    expect(writeUpLockedReason('writing')).toBeNull();
    expect(writeUpLockedReason('in-review')).toBeNull();
    expect(writeUpLockedReason('on-the-bench')).toMatch(/opens when the roundup reaches Writing/);
    expect(writeUpLockedReason('scheduled')).toMatch(/can no longer change/);
  });
});
