import { useState } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Panel } from '../../../components/ui/panel';
import { TextArea } from '../../../components/ui/text-area';
import { describeSubmitError } from '../../../lib/form-errors';
import { formatInstant } from '../../../lib/format-time';
import { runReviewStateLabels, type TestRun } from '../../../../shared/schemas/test-runs';
import { formatBytes, formatC, formatDeltaC, formatDuration } from '../../log-check/components/format-figures';
import { QaFlagList } from '../../log-check/components/qa-flag-list';
import { VerdictMark } from '../../log-check/components/verdict-mark';
import { useMarkRunOfRecord, useReanalyseRun, useReviewRun } from '../api/test-runs-api';

function Figure({ label, value }: { label: string; value: string }) {
  return (
    <div>
      <dt className="text-[0.8125rem] text-muted">{label}</dt>
      <dd className="numeric font-semibold text-ink">{value}</dd>
    </div>
  );
}

const reviewTone = { pending: 'muted', accepted: 'positive', 'sent-back': 'caution' } as const;

export function ReviewStateBadge({ state }: { state: TestRun['reviewState'] }) {
  return <Badge tone={reviewTone[state]}>{runReviewStateLabels[state]}</Badge>;
}

export function ManualMark() {
  return <Badge tone="accent">Manual</Badge>;
}

/** Accept (a reason is required when the run is flagged) or send back (always with a reason). */
function ReviewForm({ run }: { run: TestRun }) {
  const [reason, setReason] = useState('');
  const [error, setError] = useState<{ field?: string; message: string } | null>(null);
  const review = useReviewRun();
  const flagged = run.analysis.flags.length > 0;
  const decide = (decision: 'accept' | 'send-back') => {
    setError(null);
    if (decision === 'send-back' && !reason.trim()) {
      setError({ field: 'Say what the tester should redo.', message: 'A run is sent back with a reason.' });
      return;
    }
    review.mutate(
      { runId: run.id, review: { decision, reason: reason.trim() || undefined } },
      {
        onSuccess: () => setReason(''),
        onError: (failure) => {
          const described = describeSubmitError(failure);
          setError({ field: described.fields.reason, message: described.message });
        },
      },
    );
  };
  const canAccept = run.actions.includes('accept');
  const canSendBack = run.actions.includes('send-back');
  if (!canAccept && !canSendBack) return null;
  return (
    <form noValidate onSubmit={(event) => event.preventDefault()} className="space-y-3" aria-label="Review">
      <TextArea
        id={`review-reason-${run.id}`}
        label="Reason"
        optional={!flagged}
        description={
          flagged
            ? 'This run has QA flags: accepting it needs a reason, kept with your name and the time.'
            : 'Needed to send the run back; the tester sees it in their queue.'
        }
        value={reason}
        onChange={(event) => setReason(event.target.value)}
        error={error?.field}
      />
      {error && !error.field && (
        <Alert tone="danger" announce>
          {error.message}
        </Alert>
      )}
      <div className="flex flex-wrap gap-2">
        {canAccept && (
          <Button
            type="button"
            variant="primary"
            pending={review.isPending && review.variables?.review.decision === 'accept'}
            onClick={() => decide('accept')}
          >
            Accept the run
          </Button>
        )}
        {canSendBack && (
          <Button
            type="button"
            pending={review.isPending && review.variables?.review.decision === 'send-back'}
            onClick={() => decide('send-back')}
          >
            Send back for retest
          </Button>
        )}
      </div>
    </form>
  );
}

/** One run: its figures, QA flags in words, VRM load with its assumption, the evidence file and its review. */
export function RunDetail({ run }: { run: TestRun }) {
  const { analysis } = run;
  const markOfRecord = useMarkRunOfRecord();
  const reanalyse = useReanalyseRun();
  return (
    <Panel
      title={`Run on firmware ${run.firmwareVersion}`}
      description={`Started ${formatInstant(run.startedAt)} · ${run.tester.displayName}${run.bench ? ` · ${run.bench.name}` : ''}`}
    >
      <div className="space-y-5">
        <div className="flex flex-wrap items-center gap-2">
          {run.source === 'manual' && <ManualMark />}
          <ReviewStateBadge state={run.reviewState} />
          {run.isRunOfRecord && <Badge tone="positive">★ Run of record</Badge>}
        </div>
        <VerdictMark
          code={analysis.verdict}
          label={analysis.verdictLabel ?? 'No verdict yet'}
          status={analysis.verdictStatus ?? undefined}
          size="lg"
        />
        {analysis.verdictRule && <p className="text-sm text-muted">{analysis.verdictRule}</p>}
        <dl className="grid grid-cols-2 gap-3 sm:grid-cols-3">
          <Figure label="Peak" value={formatC(analysis.peakC)} />
          <Figure label="Ambient" value={formatC(analysis.ambientC)} />
          <Figure label="Delta over ambient" value={formatDeltaC(analysis.deltaOverAmbientC)} />
          <Figure label="Normalised peak" value={formatC(analysis.normalisedPeakC)} />
          <Figure label="Throttled for" value={formatDuration(analysis.throttledS)} />
          <Figure label="Engine" value={analysis.engineVersion} />
        </dl>
        <section aria-label="QA flags">
          <h3 className="mb-2 font-semibold text-ink">QA flags</h3>
          <QaFlagList flags={analysis.flags} />
        </section>
        {run.vrmLoad && (
          <section aria-label="VRM electrical load">
            <h3 className="mb-2 font-semibold text-ink">VRM electrical load</h3>
            <dl className="grid grid-cols-2 gap-3 sm:grid-cols-3">
              <Figure label="Core current" value={`${run.vrmLoad.coreCurrentA.toFixed(1)}\u2009A`} />
              <Figure label="Per phase" value={`${run.vrmLoad.currentPerPhaseA.toFixed(1)}\u2009A`} />
              <Figure label="Per power stage" value={`${run.vrmLoad.currentPerStageA.toFixed(1)}\u2009A`} />
              <Figure label="Share of stage rating" value={`${run.vrmLoad.stageLoadPercent.toFixed(0)}\u2009%`} />
            </dl>
            <p className="mt-2 text-sm text-muted">{run.vrmLoad.assumption}</p>
          </section>
        )}
        {run.notes && <p className="text-sm">Notes: {run.notes}</p>}
        {run.outsideBookingReason && <p className="text-sm">Outside the bookings: {run.outsideBookingReason}</p>}
        {run.loggerFile && (
          <p className="text-sm">
            <a href={run.loggerFile.downloadUrl} download className="text-copper underline underline-offset-2">
              Download the logger file
            </a>{' '}
            <span className="text-muted">
              ({run.loggerFile.originalName}, {formatBytes(run.loggerFile.byteSize)}, SHA-256{' '}
              <span className="font-mono break-all">{run.loggerFile.sha256}</span>)
            </span>
          </p>
        )}
        {run.reviewReason && (
          <p className="text-sm">
            Review: {run.reviewReason}
            {run.reviewedBy && ` — ${run.reviewedBy.displayName}`}
            {run.reviewedAt && `, ${formatInstant(run.reviewedAt)}`}
          </p>
        )}
        {run.analyses.length > 1 && (
          <section aria-label="Earlier analyses">
            <h3 className="mb-2 font-semibold text-ink">Analyses</h3>
            <ul className="space-y-1 text-sm">
              {run.analyses.map((entry) => (
                <li key={entry.id} className="numeric">
                  {formatInstant(entry.createdAt)} · engine {entry.engineVersion} · peak {formatC(entry.peakC)}
                </li>
              ))}
            </ul>
          </section>
        )}
        <ReviewForm key={run.id} run={run} />
        <div className="flex flex-wrap gap-2">
          {run.actions.includes('mark-of-record') && !run.isRunOfRecord && (
            <Button pending={markOfRecord.isPending} onClick={() => markOfRecord.mutate(run.id)}>
              Mark as run of record
            </Button>
          )}
          {run.actions.includes('reanalyse') && (
            <Button variant="quiet" pending={reanalyse.isPending} onClick={() => reanalyse.mutate(run.id)}>
              Run the engine again with the current rubric
            </Button>
          )}
        </div>
        {(markOfRecord.isError || reanalyse.isError) && (
          <Alert tone="danger" announce>
            {describeSubmitError(markOfRecord.error ?? reanalyse.error).message}
          </Alert>
        )}
        {reanalyse.isSuccess && (
          <p role="status" className="text-sm">
            A new analysis is stored beside the earlier ones; the file and earlier analyses are unchanged.
          </p>
        )}
      </div>
    </Panel>
  );
}
