import { useState } from 'react';
import { Link } from 'react-router';
import { Alert } from '../../../components/ui/alert';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { CellStateBadge } from '../../../components/ui/cell-state-badge';
import { DataTable, type DataTableColumn } from '../../../components/ui/data-table';
import { numericColumn, textColumn } from '../../../components/ui/data-table-columns';
import { PageHeader } from '../../../components/ui/page-header';
import { Panel } from '../../../components/ui/panel';
import { describeSubmitError } from '../../../lib/form-errors';
import { formatInstant } from '../../../lib/format-time';
import { cellStateLabels, type CellAction } from '../../../../shared/domain/planning/matrix-cell-states';
import type { MatrixCell } from '../../../../shared/schemas/matrix';
import type { TestRun } from '../../../../shared/schemas/test-runs';
import { formatC, formatDeltaC } from '../../log-check/components/format-figures';
import { VerdictMark } from '../../log-check/components/verdict-mark';
import { useCellRuns } from '../api/test-runs-api';
import { ManualRunForm } from './manual-run-form';
import { RecordLoggerRun } from './record-run';
import { FlagCount, ManualMark, ReviewStateBadge, RunDetail } from './run-detail';

export interface CellRunsPageProps {
  cellId: number;
  /** The cell as the matrix shows it (state, the editor's retest reason, the moves open to the user). */
  matrixCell: MatrixCell | null;
  /** Sends one of the cell's moves (the page wires in the matrix's one transition request). */
  moveCell: (action: CellAction) => Promise<MatrixCell>;
  /** The photos page of the cell's product in this roundup. */
  photosPath: (entryId: number) => string;
  /** Link back to the roundup's matrix. */
  matrixPath: string;
  signInPath: string;
  /** Testers record runs; editors review them. */
  canRecord: boolean;
}

function RunsTable({
  runs,
  selectedId,
  onSelect,
}: {
  runs: TestRun[];
  selectedId: number | null;
  onSelect: (id: number) => void;
}) {
  const columns: DataTableColumn<TestRun>[] = [
    textColumn('firmware', 'Firmware', (run) => run.firmwareVersion, {
      rowHeader: true,
      cell: (run) => (
        <>
          <Button size="sm" variant="quiet" aria-pressed={run.id === selectedId} onClick={() => onSelect(run.id)}>
            {run.firmwareVersion}
          </Button>
          {run.isRunOfRecord && (
            <span className="ml-1 text-teal" title="Run of record">
              <span aria-hidden="true">★</span>
              <span className="sr-only">Run of record</span>
            </span>
          )}
        </>
      ),
    }),
    numericColumn('started', 'Started', (run) => run.startedAt, formatInstant),
    { id: 'source', header: 'Source', cell: (run) => (run.source === 'manual' ? <ManualMark /> : 'Logger') },
    numericColumn('peak', 'Peak', (run) => run.analysis.peakC, formatC),
    {
      id: 'verdict',
      header: 'Verdict',
      cell: (run) => (
        <>
          <VerdictMark
            code={run.analysis.verdict}
            label={run.analysis.verdictLabel ?? 'No verdict yet'}
            status={run.analysis.verdictStatus ?? undefined}
          />
          <FlagCount count={run.analysis.flags.length} className="ml-2" />
        </>
      ),
    },
    { id: 'review', header: 'Review', cell: (run) => <ReviewStateBadge state={run.reviewState} /> },
  ];
  return (
    <DataTable
      caption="Runs of this cell, newest first"
      rows={runs}
      columns={columns}
      rowClassName={(run) => (run.id === selectedId ? 'bg-wash' : undefined)}
    />
  );
}

/** A matrix cell (product × load configuration): its runs, firmware comparison, the chosen run, and recording a new one. */
/** The cell's state, the editor's retest reason, and "Mark recorded" once a run is submitted. */
function CellStatus({
  cell,
  runCount,
  canRecord,
  moveCell,
}: {
  cell: MatrixCell;
  runCount: number;
  canRecord: boolean;
  moveCell: (action: CellAction) => Promise<MatrixCell>;
}) {
  const [pending, setPending] = useState(false);
  const [notice, setNotice] = useState<{ tone: 'success' | 'danger'; text: string } | null>(null);
  const mark = async () => {
    setPending(true);
    setNotice(null);
    try {
      const moved = await moveCell('record');
      setNotice({ tone: 'success', text: `The cell is ${cellStateLabels[moved.state]}: the editor reviews it next.` });
    } catch (error) {
      setNotice({ tone: 'danger', text: `The cell did not move. ${describeSubmitError(error).message}` });
    } finally {
      setPending(false);
    }
  };
  const canMark = cell.actions.includes('record');
  const waitsForRun = canRecord && runCount === 0 && ['running', 'assigned', 'needs-retest'].includes(cell.state);
  return (
    <div className="space-y-2">
      <div className="flex flex-wrap items-center gap-3 text-sm">
        <span>
          Cell: <CellStateBadge state={cell.state} />
        </span>
        {cell.tester && <span className="text-muted">Tester: {cell.tester.displayName}</span>}
        {canMark && (
          <Button size="sm" variant="primary" pending={pending} onClick={() => void mark()}>
            Mark recorded
          </Button>
        )}
      </div>
      {cell.state === 'needs-retest' && cell.note && (
        <p className="text-sm">
          <span className="font-semibold">Sent back for retest:</span> {cell.note}
        </p>
      )}
      {waitsForRun && (
        <p className="text-sm text-muted">Submit a run below; the cell can be marked recorded once it has one.</p>
      )}
      {notice && (
        <Alert tone={notice.tone} announce>
          {notice.text}
        </Alert>
      )}
    </div>
  );
}

export function CellRunsPage({
  cellId,
  matrixCell,
  moveCell,
  photosPath,
  matrixPath,
  signInPath,
  canRecord,
}: CellRunsPageProps) {
  const cell = useCellRuns(cellId);
  const [chosenId, setChosenId] = useState<number | null>(null);
  const [recording, setRecording] = useState<'logger' | 'manual' | null>(null);
  const [recorded, setRecorded] = useState(false);
  const selected =
    cell.runs.find((run) => run.id === chosenId) ??
    cell.runs.find((run) => run.id === cell.runOfRecordId) ??
    cell.runs[0] ??
    null;

  const onRecorded = (runId: number) => {
    setRecording(null);
    setChosenId(runId);
    setRecorded(true);
  };

  return (
    <>
      <p className="mb-2 text-sm">
        <Link to={matrixPath} className="text-copper underline-offset-2 hover:underline">
          ← Matrix
        </Link>
      </p>
      <PageHeader eyebrow="Test runs" title={`${cell.productName} · ${cell.loadConfigurationName}`} />
      <div className="space-y-6">
        {matrixCell && (
          <CellStatus cell={matrixCell} runCount={cell.runs.length} canRecord={canRecord} moveCell={moveCell} />
        )}
        {matrixCell && (
          <p className="text-sm">
            <Link to={photosPath(matrixCell.entryId)} className="text-copper underline-offset-2 hover:underline">
              Photos of {cell.productName}
            </Link>
          </p>
        )}
        {recorded && (
          <Alert tone="success" announce title="Run submitted">
            The run is stored with its analysis and waits for review. Mark the cell recorded when its runs are complete.
          </Alert>
        )}
        <Panel title="Runs" description="Every run of this cell, newest first; the run of record is starred.">
          {cell.runs.length === 0 ? (
            <p className="text-sm text-muted">No runs yet.</p>
          ) : (
            <RunsTable runs={cell.runs} selectedId={selected?.id ?? null} onSelect={setChosenId} />
          )}
        </Panel>
        {cell.byFirmware.length > 0 && (
          <section aria-labelledby="firmware-heading">
            <h2 id="firmware-heading" className="mb-3 text-lg font-semibold text-ink">
              By firmware
            </h2>
            <ul className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
              {cell.byFirmware.map((group) => (
                <li key={group.firmwareVersion} className="rounded-[3px] border border-rule bg-surface p-3 text-sm">
                  <p className="font-semibold">Firmware {group.firmwareVersion}</p>
                  <p className="numeric">
                    Mean peak {formatC(group.meanPeakC)} over {group.runs} run{group.runs > 1 ? 's' : ''}
                  </p>
                  <p className="numeric text-muted">
                    {group.ciLowC !== null && group.ciHighC !== null
                      ? `95\u2009% interval ${formatC(group.ciLowC)} to ${formatC(group.ciHighC)}`
                      : 'One run: no interval yet'}
                  </p>
                  {group.differenceFromFirstC !== null && (
                    <p className="numeric">
                      Difference from the first firmware {formatDeltaC(group.differenceFromFirstC, true)}
                    </p>
                  )}
                </li>
              ))}
            </ul>
          </section>
        )}
        {selected && <RunDetail key={selected.id} run={selected} />}
        {canRecord && (
          <Panel
            title="Record a run"
            description="Upload the soak's logger file, or enter peak and ambient by hand when no log exists."
            actions={
              <div className="flex flex-wrap gap-2">
                <Button size="sm" aria-pressed={recording === 'logger'} onClick={() => setRecording('logger')}>
                  Upload a log
                </Button>
                <Button size="sm" aria-pressed={recording === 'manual'} onClick={() => setRecording('manual')}>
                  Enter by hand
                </Button>
              </div>
            }
          >
            {recording === 'logger' && (
              <RecordLoggerRun
                cellId={cellId}
                rememberedMapping={cell.rememberedMapping}
                signInPath={signInPath}
                onRecorded={onRecorded}
              />
            )}
            {recording === 'manual' && <ManualRunForm cellId={cellId} onRecorded={onRecorded} />}
            {recording === null && <Badge tone="muted">Choose how to record</Badge>}
          </Panel>
        )}
      </div>
    </>
  );
}
