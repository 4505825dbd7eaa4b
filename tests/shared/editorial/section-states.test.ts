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
  it('a writer hands a draft to the editor; the editor signs off or hands back; nothing skips backwards silently', () => {
    expect(sectionReviewMove('drafting', 'hand-to-editor')).toEqual({ ok: true, to: 'with-editor' });
    expect(sectionReviewMove('with-editor', 'sign-off')).toEqual({ ok: true, to: 'signed-off' });
    expect(sectionReviewMove('with-editor', 'hand-back')).toEqual({ ok: true, to: 'drafting' });
    expect(sectionReviewMove('signed-off', 'hand-back')).toEqual({ ok: true, to: 'drafting' });
    expect(sectionReviewMove('with-editor', 'hand-to-editor').ok).toBe(false);
    expect(sectionReviewMove('signed-off', 'sign-off').ok).toBe(false);
    expect(sectionReviewMove('drafting', 'hand-back').ok).toBe(false);
  });

  it('changing a signed-off section sends it back to drafting; other states keep theirs', () => {
    expect(reviewStateAfterEdit('signed-off')).toBe('drafting');
    expect(reviewStateAfterEdit('with-editor')).toBe('with-editor');
    expect(reviewStateAfterEdit('drafting')).toBe('drafting');
  });

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
