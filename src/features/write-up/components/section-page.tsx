import { lazy, Suspense, useCallback, useRef, useState } from 'react';
import { Link } from 'react-router';
import { useQueryClient } from '@tanstack/react-query';
import type { Editor } from '@tiptap/react';
import { Alert } from '../../../components/ui/alert';
import { Button, buttonStyles } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { LoadingState } from '../../../components/ui/loading-state';
import { PageHeader } from '../../../components/ui/page-header';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { TextArea } from '../../../components/ui/text-area';
import { TextField } from '../../../components/ui/text-field';
import { isApiError } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { countOf } from '../../../lib/plural';
import { invalidateAfter } from '../../../lib/stale-after';
import { useSession } from '../../auth/api/get-session';
import { may, writeUpWriters } from '../../../../shared/access/roles';
import {
  sectionKindLabels,
  sectionReviewMoveLabels,
  type SectionReviewMove,
} from '../../../../shared/domain/editorial/section-states';
import type { WriteUpDocument } from '../../../../shared/schemas/write-up-document';
import type { SectionSummary } from '../../../../shared/schemas/write-ups';
import { sectionQueryOptions, useSection } from '../api/get-section';
import { useCommentThreads } from '../api/comments';
import { useReviewSection } from '../api/review-section';
import { CommentsPanel } from './comments-panel';
import { RevisionsPanel } from './revisions-panel';
import { SaveStatusLine } from './save-status';
import { SectionStateBadge } from './section-state-badge';
import { useAutosave } from './use-autosave';

/** What is wrong with a section title as typed, or undefined when it can be saved (shared/schemas/write-ups.ts). */
function titleProblem(value: string): string | undefined {
  if (value.trim() === '') return 'Give the section a title; the text keeps saving meanwhile.';
  if (value.trim().length > 200) return 'Keep the title to 200 characters.';
  return undefined;
}

// The editor (and the editor library) loads with this screen only.
const SectionEditor = lazy(() => import('./section-editor'));

export function SectionPage({ roundupId, sectionId }: { roundupId: number; sectionId: number }) {
  const section = useSection(sectionId);
  const user = useSession();
  const queryClient = useQueryClient();
  const [summary, setSummary] = useState<SectionSummary>(section);
  const [editorKey, setEditorKey] = useState(0);
  const [content, setContent] = useState<WriteUpDocument>(section.content);
  const editorRef = useRef<Editor | null>(null);
  const review = useReviewSection();
  const [reviewError, setReviewError] = useState<string | null>(null);
  const [handBackOpen, setHandBackOpen] = useState(false);
  const [note, setNote] = useState('');
  const [title, setTitle] = useState(section.title);
  const titleRef = useRef(section.title);
  const titleError = titleProblem(title);
  const threads = useCommentThreads(sectionId);
  const [signOffWarning, setSignOffWarning] = useState<number | null>(null);

  const onSaved = useCallback(
    (saved: SectionSummary) => {
      setSummary(saved);
      void invalidateAfter(queryClient, 'writeUp');
    },
    [queryClient],
  );
  const autosave = useAutosave({
    sectionId,
    initialVersion: section.version,
    getContent: () => (editorRef.current?.getJSON() as WriteUpDocument | undefined) ?? content,
    getTitle: () => (titleProblem(titleRef.current) ? undefined : titleRef.current.trim()),
    onSaved,
  });

  const reloadFromServer = async () => {
    const fresh = await queryClient.fetchQuery({ ...sectionQueryOptions(sectionId), staleTime: 0 });
    setSummary(fresh);
    setContent(fresh.content);
    setTitle(fresh.title);
    titleRef.current = fresh.title;
    autosave.reset(fresh.version);
    setEditorKey((key) => key + 1);
  };

  const runMove = async (move: SectionReviewMove, moveNote?: string) => {
    setReviewError(null);
    // The editor sees what the writer sees: save first, then move.
    await autosave.flush();
    try {
      const moved = await review.mutateAsync({ sectionId, move, note: moveNote });
      setSummary(moved);
      setHandBackOpen(false);
      setSignOffWarning(null);
      setNote('');
    } catch (caught) {
      setReviewError(isApiError(caught) ? caught.message : 'The review step failed.');
    }
  };

  /** Signing off with open comment threads asks first: they still keep the roundup from being ready. */
  const askToSignOff = () => {
    const open = threads.data?.filter((thread) => thread.resolvedAt === null).length ?? summary.openThreadCount;
    if (open > 0) setSignOffWarning(open);
    else void runMove('sign-off');
  };

  if (!user) return null;
  const canWrite = section.editable && may(user.role, writeUpWriters);
  const label =
    section.kind === 'product' ? `Product section: ${section.title}` : `${sectionKindLabels[section.kind]} section`;

  return (
    <>
      <p className="mb-2 text-sm">
        <Link to={paths.writeUp(roundupId)} className="text-copper underline-offset-2 hover:underline">
          ← All sections of the write-up
        </Link>
      </p>
      <PageHeader
        eyebrow={section.kind === 'product' ? 'Write-up · product section' : 'Write-up'}
        title={summary.title}
        description={
          <span className="inline-flex flex-wrap items-center gap-2">
            <SectionStateBadge state={summary.reviewState} />
            {canWrite && <SaveStatusLine status={autosave.status} error={autosave.error} onRetry={autosave.flush} />}
          </span>
        }
        actions={
          <>
            {summary.moves.map((move) =>
              move === 'hand-back' ? (
                <Button key={move} onClick={() => setHandBackOpen(true)}>
                  {sectionReviewMoveLabels[move]}
                </Button>
              ) : (
                <Button
                  key={move}
                  variant={move === 'sign-off' ? 'primary' : 'secondary'}
                  pending={review.isPending && review.variables?.move === move}
                  onClick={() => (move === 'sign-off' ? askToSignOff() : void runMove(move))}
                >
                  {sectionReviewMoveLabels[move]}
                </Button>
              ),
            )}
            <a href={paths.writeUpPreview(roundupId)} target="_blank" rel="noopener" className={buttonStyles('quiet')}>
              Preview <span className="sr-only">the public page (opens in a new tab)</span>
            </a>
          </>
        }
      />
      {reviewError && (
        <Alert tone="danger" announce className="mb-4">
          {reviewError}
        </Alert>
      )}
      {section.lockedReason && (
        <Alert tone="info" className="mb-4">
          {section.lockedReason}
        </Alert>
      )}
      {summary.reviewState === 'signed-off' && canWrite && (
        <p className="mb-3 text-sm text-muted">
          This section is signed off. Changing its text hands it back to drafting for another review.
        </p>
      )}
      <div className="grid gap-5 lg:grid-cols-[minmax(0,1fr)_20rem]">
        <div className="min-w-0">
          {canWrite && (
            <TextField
              label="Section title"
              description="Shown as the section’s heading on the page; saved with the text."
              className="mb-3 max-w-[72ch]"
              value={title}
              maxLength={200}
              error={titleError}
              onChange={(event) => {
                setTitle(event.target.value);
                titleRef.current = event.target.value;
                autosave.markChanged();
              }}
            />
          )}
          <Suspense fallback={<LoadingState label="Opening the editor…" />}>
            <SectionEditor
              key={editorKey}
              initialContent={content}
              editable={canWrite}
              label={label}
              photos={section.photos}
              liveBlocks={section.liveBlocks}
              defaultEntryId={section.entryId}
              onReady={(editor) => {
                editorRef.current = editor;
              }}
              onChange={autosave.markChanged}
            />
          </Suspense>
        </div>
        <aside className="flex min-w-0 flex-col gap-4" aria-label="Comments and history">
          <CommentsPanel sectionId={sectionId} canComment={may(user.role, writeUpWriters)} />
          <RevisionsPanel
            sectionId={sectionId}
            currentVersion={() => autosave.version.current}
            canRestore={canWrite}
            onRestored={() => void reloadFromServer()}
          />
        </aside>
      </div>

      <Dialog
        open={autosave.conflict !== null}
        onClose={() => undefined}
        title="Someone else saved this section"
        description={autosave.error ?? undefined}
        footer={
          autosave.conflict && (
            <>
              <Button
                onClick={() => {
                  const theirs = autosave.conflict!.current;
                  editorRef.current?.commands.setContent(theirs.content, { emitUpdate: false });
                  setTitle(theirs.title);
                  titleRef.current = theirs.title;
                  autosave.acceptTheirs(theirs);
                  setSummary((current) => ({ ...current, version: theirs.version, title: theirs.title }));
                }}
              >
                Reload theirs
              </Button>
              <Button variant="primary" onClick={() => autosave.keepMine(autosave.conflict!.current)}>
                Keep my copy
              </Button>
            </>
          )
        }
      >
        {autosave.conflict && (
          <div className="space-y-2 text-sm">
            <p>
              Version {autosave.conflict.current.version} was saved by{' '}
              {autosave.conflict.current.updatedBy?.displayName ?? 'someone'} while you were typing. Nothing is lost
              either way: your text is already kept in the section’s history, and so is theirs.
            </p>
            <ul className="list-disc pl-5">
              <li>
                <strong>Reload theirs</strong> shows their version; restore yours from the history if you need it.
              </li>
              <li>
                <strong>Keep my copy</strong> saves your text on top of theirs; theirs stays in the history.
              </li>
            </ul>
          </div>
        )}
      </Dialog>

      <ConfirmDialog
        open={signOffWarning !== null}
        title={`Sign off with ${countOf(signOffWarning ?? 0, 'open comment thread', 'open comment threads')}?`}
        confirmLabel="Sign off anyway"
        cancelLabel="Go back to the comments"
        tone="primary"
        pending={review.isPending}
        error={reviewError ?? undefined}
        onCancel={() => setSignOffWarning(null)}
        onConfirm={() => void runMove('sign-off')}
      >
        <p>
          This section still has {countOf(signOffWarning ?? 0, 'open comment thread', 'open comment threads')}. Signing
          off does not resolve {signOffWarning === 1 ? 'it' : 'them'}: the roundup cannot be ready to schedule while a
          thread is open.
        </p>
      </ConfirmDialog>

      <Dialog
        open={handBackOpen}
        onClose={() => setHandBackOpen(false)}
        title="Hand back to the writer"
        footer={
          <>
            <Button onClick={() => setHandBackOpen(false)}>Cancel</Button>
            <Button
              variant="primary"
              pending={review.isPending}
              onClick={() => void runMove('hand-back', note.trim() || undefined)}
            >
              Hand back
            </Button>
          </>
        }
      >
        <TextArea
          label="What should change?"
          description="Optional. It opens a comment thread on the section."
          optional
          value={note}
          onChange={(event) => setNote(event.target.value)}
          rows={4}
        />
      </Dialog>
    </>
  );
}
