import { useState } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { DataTable, type DataTableColumn } from '../../../components/ui/data-table';
import { Panel } from '../../../components/ui/panel';
import { TextArea } from '../../../components/ui/text-area';
import { cx } from '../../../lib/class-names';
import { describeSubmitError } from '../../../lib/form-errors';
import { formatInstant } from '../../../lib/format-time';
import { runReviewStateLabels, type TestRun } from '../../../../shared/schemas/test-runs';
import { formatBytes, formatC, formatDeltaC, formatDuration } from '../../log-check/components/format-figures';
import { QaFlagList } from '../../log-check/components/qa-flag-list';
import { VerdictMark } from '../../log-check/components/verdict-mark';
import { useMarkRunOfRecord, useReanalyseRun, useReviewRun } from '../api/test-runs-api';
import { ReanalyseRun } from './reanalyse-run';

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

/** How many QA flags a run has, with a mark and in words (nothing when it has none). */
export function FlagCount({ count, className }: { count: number; className?: string }) {
  if (count === 0) return null;
  return (
    <span className={cx('text-amber', className)}>
      ! {count} flag{count > 1 ? 's' : ''}
    </span>
  );
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

/** A short account of the mapping an analysis was given: its VRM probes and ambient column. */
function mappingInWords(parameters: Record<string, unknown>): string {
  const mapping = (parameters.mapping ?? null) as { vrm?: unknown; ambient?: unknown } | null;
  const vrm = Array.isArray(mapping?.vrm) ? mapping.vrm.filter((name) => typeof name === 'string') : [];
  if (vrm.length === 0) return 'Mapping as read';
  const ambient = typeof mapping?.ambient === 'string' && mapping.ambient ? mapping.ambient : 'none';
  return `VRM: ${vrm.join(', ')} · ambient: ${ambient}`;
}

type AnalysisRow = TestRun['analyses'][number];

/** Every analysis of the run side by side, oldest first; the newest counts. Nothing here changes an analysis. */
function AnalysesTable({ run }: { run: TestRun }) {
  const countingId = run.analysis.id;
  const columns: DataTableColumn<AnalysisRow>[] = [
    {
      id: 'made',
      header: 'Made',
      rowHeader: true,
      cell: (entry) => (
        <>
          <span className="numeric">{formatInstant(entry.createdAt)}</span>
          <span className="block text-[0.8125rem] text-muted">
            {entry.createdBy.displayName} · engine {entry.engineVersion}
          </span>
          {entry.id === countingId && (
            <span className="block text-[0.8125rem] font-semibold text-ink">★ Counts for the run</span>
          )}
        </>
      ),
    },
    { id: 'mapping', header: 'Mapping', cell: (entry) => mappingInWords(entry.parameters) },
    { id: 'peak', header: 'Peak', numeric: true, cell: (entry) => formatC(entry.peakC) },
    { id: 'delta', header: 'Delta', numeric: true, cell: (entry) => formatDeltaC(entry.deltaOverAmbientC) },
    { id: 'verdict', header: 'Verdict', cell: (entry) => entry.verdictLabel ?? 'No verdict' },
    {
      id: 'flags',
      header: 'QA flags',
      cell: (entry) => (entry.flags.length === 0 ? 'None' : entry.flags.map((flag) => flag.label).join('; ')),
    },
  ];
  return (
    <section aria-labelledby={`analyses-${run.id}`}>
      <h3 id={`analyses-${run.id}`} className="mb-2 font-semibold text-ink">
        Analyses
      </h3>
      <p className="mb-2 text-sm text-muted">
        Each analysis of the stored file is kept as it was made. The newest one counts for the run.
      </p>
      <DataTable
        caption="Analyses of this run, oldest first"
        rows={run.analyses}
        columns={columns}
        noun={['analysis', 'analyses']}
      />
    </section>
  );
}

/** One run: its figures, QA flags in words, VRM load with its assumption, the evidence file and its review. */
export function RunDetail({ run }: { run: TestRun }) {
  const { analysis } = run;
  const markOfRecord = useMarkRunOfRecord();
  const reanalyse = useReanalyseRun();
  const [reanalysing, setReanalysing] = useState(false);
  const [storedAgain, setStoredAgain] = useState(false);
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
        {run.analyses.length > 1 && <AnalysesTable run={run} />}
        <ReviewForm key={run.id} run={run} />
        <div className="flex flex-wrap gap-2">
          {run.actions.includes('mark-of-record') && !run.isRunOfRecord && (
            <Button pending={markOfRecord.isPending} onClick={() => markOfRecord.mutate(run.id)}>
              Mark as run of record
            </Button>
          )}
          {run.actions.includes('reanalyse') && !reanalysing && (
            <>
              <Button variant="secondary" onClick={() => setReanalysing(true)}>
                Analyse again with another mapping
              </Button>
              <Button variant="quiet" pending={reanalyse.isPending} onClick={() => reanalyse.mutate({ runId: run.id })}>
                Run the engine again with the current rubric
              </Button>
            </>
          )}
        </div>
        {reanalysing && (
          <ReanalyseRun
            run={run}
            onClose={(stored) => {
              setReanalysing(false);
              setStoredAgain(stored);
            }}
          />
        )}
        {(markOfRecord.isError || reanalyse.isError) && (
          <Alert tone="danger" announce>
            {describeSubmitError(markOfRecord.error ?? reanalyse.error).message}
          </Alert>
        )}
        {(reanalyse.isSuccess || storedAgain) && (
          <p role="status" className="text-sm">
            A new analysis is stored beside the earlier ones; the file and earlier analyses are unchanged.
          </p>
        )}
      </div>
    </Panel>
  );
}
