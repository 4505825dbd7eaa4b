import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { DateTime } from '../../../components/ui/date-time';
import { isApiError } from '../../../lib/api-client';
import type { RevisionSummary } from '../../../../shared/schemas/write-ups';
import { useRestoreRevision, useRevision, useRevisions } from '../api/revisions';

const kindLabels: Record<RevisionSummary['kind'], string> = {
  prefill: 'First draft',
  save: 'Saved',
  restore: 'Restored',
  'refused-copy': 'Copy kept from a refused save',
};

/** The section's history: every saved version, restores and refused copies; any of them can become current again. */
export function RevisionsPanel({
  sectionId,
  currentVersion,
  canRestore,
  onRestored,
}: {
  sectionId: number;
  currentVersion: () => number;
  canRestore: boolean;
  onRestored: () => void;
}) {
  const [open, setOpen] = useState(false);
  const [shown, setShown] = useState<number | null>(null);
  const revisions = useRevisions(sectionId, open);
  const revision = useRevision(sectionId, shown);
  const restore = useRestoreRevision();
  const [error, setError] = useState<string | null>(null);

  return (
    <details
      className="rounded-[3px] border border-rule bg-surface"
      onToggle={(event) => setOpen((event.target as HTMLDetailsElement).open)}
    >
      <summary className="cursor-pointer px-4 py-3 text-base font-semibold">History</summary>
      <div className="space-y-2 px-4 pb-4">
        {error && (
          <p role="alert" className="text-sm text-red">
            {error}
          </p>
        )}
        {revisions.data && (
          <ol className="space-y-1.5">
            {revisions.data.map((row) => (
              <li key={row.id} className="text-sm">
                <div className="flex flex-wrap items-center justify-between gap-1">
                  <span>
                    <span className="font-medium">{kindLabels[row.kind]}</span>
                    {row.version !== null && <span className="numeric text-muted"> · v{row.version}</span>}
                    <br />
                    <span className="text-xs text-muted">
                      {row.author?.displayName ?? 'Benchwire'} · <DateTime value={row.updatedAt} />
                    </span>
                  </span>
                  <span className="flex gap-1">
                    <Button size="sm" variant="quiet" onClick={() => setShown(shown === row.id ? null : row.id)}>
                      {shown === row.id ? 'Hide' : 'Show'}
                    </Button>
                    {canRestore && row.version !== currentVersion() && (
                      <Button
                        size="sm"
                        pending={restore.isPending && restore.variables?.revisionId === row.id}
                        onClick={() =>
                          restore.mutate(
                            { sectionId, revisionId: row.id, baseVersion: currentVersion() },
                            {
                              onSuccess: () => {
                                setError(null);
                                onRestored();
                              },
                              onError: (caught) =>
                                setError(isApiError(caught) ? caught.message : 'The revision was not restored.'),
                            },
                          )
                        }
                      >
                        Restore
                      </Button>
                    )}
                  </span>
                </div>
                {shown === row.id && revision.data && (
                  <div
                    className="write-up-rendered mt-1 max-h-72 overflow-auto rounded-[3px] border border-rule bg-paper p-2"
                    // Rendered and sanitised by the server renderer.
                    dangerouslySetInnerHTML={{ __html: revision.data.html }}
                  />
                )}
              </li>
            ))}
          </ol>
        )}
      </div>
    </details>
  );
}
