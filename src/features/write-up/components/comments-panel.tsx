import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { DateTime } from '../../../components/ui/date-time';
import { LoadingState } from '../../../components/ui/loading-state';
import { Panel } from '../../../components/ui/panel';
import { TextArea } from '../../../components/ui/text-area';
import { useZodForm } from '../../../lib/use-zod-form';
import { addCommentRequestSchema, type CommentThread } from '../../../../shared/schemas/write-ups';
import { useAddComment, useCommentThreads, useResolveThread } from '../api/comments';

function CommentForm({
  sectionId,
  parentId,
  label,
  submitLabel,
}: {
  sectionId: number;
  parentId: number | null;
  label: string;
  submitLabel: string;
}) {
  const add = useAddComment(sectionId);
  const form = useZodForm({
    schema: addCommentRequestSchema,
    initialValues: { body: '' },
    labels: { body: label },
    issueMessage: (issue) => (issue.code === 'too_small' ? 'Write the comment first.' : issue.message),
  });
  return (
    <form
      className="space-y-2"
      onSubmit={form.handleSubmit(({ body }) =>
        // What was typed stays in the box when the server refuses it.
        add.mutate({ body, parentId }, { onSuccess: () => form.reset(), onError: form.fail }),
      )}
    >
      {/* A refusal that names no field is still about the comment: it shows beside it. */}
      <TextArea {...form.field('body')} error={form.errors.body ?? form.formError} rows={2} />
      <Button type="submit" size="sm" pending={add.isPending}>
        {submitLabel}
      </Button>
    </form>
  );
}

function Thread({ thread, canComment }: { thread: CommentThread; canComment: boolean }) {
  const resolve = useResolveThread();
  const resolved = thread.resolvedAt !== null;
  const [replyOpen, setReplyOpen] = useState(false);
  return (
    <li className="rounded-[3px] border border-rule p-2.5" data-thread-resolved={resolved}>
      <p className="text-xs text-muted">
        <span className="font-semibold text-ink">{thread.author.displayName}</span> ·{' '}
        <DateTime value={thread.createdAt} />
        {resolved && thread.resolvedBy && <> · resolved by {thread.resolvedBy.displayName}</>}
      </p>
      <p className={resolved ? 'text-sm whitespace-pre-wrap text-muted' : 'text-sm whitespace-pre-wrap'}>
        {thread.body}
      </p>
      {thread.replies.length > 0 && (
        <ul className="mt-2 space-y-1.5 border-l-2 border-rule pl-2.5" aria-label="Replies">
          {thread.replies.map((reply) => (
            <li key={reply.id}>
              <p className="text-xs text-muted">
                <span className="font-semibold text-ink">{reply.author.displayName}</span> ·{' '}
                <DateTime value={reply.createdAt} />
              </p>
              <p className="text-sm whitespace-pre-wrap">{reply.body}</p>
            </li>
          ))}
        </ul>
      )}
      {canComment && (
        <div className="mt-2 flex flex-wrap gap-2">
          <Button
            size="sm"
            pending={resolve.isPending}
            onClick={() => resolve.mutate({ commentId: thread.id, resolved: !resolved })}
          >
            {resolved ? 'Reopen' : 'Resolve'}
          </Button>
          <Button size="sm" variant="quiet" aria-expanded={replyOpen} onClick={() => setReplyOpen((o) => !o)}>
            Reply
          </Button>
        </div>
      )}
      {canComment && replyOpen && (
        <div className="mt-2">
          <CommentForm sectionId={thread.sectionId} parentId={thread.id} label="Your reply" submitLabel="Send reply" />
        </div>
      )}
    </li>
  );
}

/** Comment threads on the section: open ones first, resolved ones after, folded into a count. */
export function CommentsPanel({ sectionId, canComment }: { sectionId: number; canComment: boolean }) {
  const threads = useCommentThreads(sectionId);
  const open = threads.data?.filter((t) => t.resolvedAt === null) ?? [];
  const resolved = threads.data?.filter((t) => t.resolvedAt !== null) ?? [];
  return (
    <Panel title="Comments" description={threads.data ? `${open.length} open, ${resolved.length} resolved` : undefined}>
      {threads.isPending ? (
        <LoadingState label="Loading comments…" />
      ) : (
        <div className="space-y-3">
          {open.length > 0 && (
            <ul className="space-y-2" aria-label="Open threads">
              {open.map((thread) => (
                <Thread key={thread.id} thread={thread} canComment={canComment} />
              ))}
            </ul>
          )}
          {open.length === 0 && <p className="text-sm text-muted">No open comments.</p>}
          {resolved.length > 0 && (
            <details>
              <summary className="cursor-pointer text-sm font-medium">Resolved threads ({resolved.length})</summary>
              <ul className="mt-2 space-y-2" aria-label="Resolved threads">
                {resolved.map((thread) => (
                  <Thread key={thread.id} thread={thread} canComment={canComment} />
                ))}
              </ul>
            </details>
          )}
          {canComment && (
            <CommentForm sectionId={sectionId} parentId={null} label="New comment" submitLabel="Add comment" />
          )}
        </div>
      )}
    </Panel>
  );
}
