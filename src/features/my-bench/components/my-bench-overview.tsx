import { useCallback, useId, useState } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { Panel } from '../../../components/ui/panel';
import { TextArea } from '../../../components/ui/text-area';
import { isApiError } from '../../../lib/api-client';
import { describeSubmitError } from '../../../lib/form-errors';
import { productDisplayName } from '../../../../shared/domain/planning/product-display-name';
import { cellStateLabels, type CellAction } from '../../../../shared/domain/planning/matrix-cell-states';
import type { MyBench } from '../../../../shared/schemas/benches';
import type { MatrixCell, QueueItem } from '../../../../shared/schemas/matrix';
import { QueueTable } from './queue-table';

/** One of the tester's own moves on a cell: start a run, put it back in the queue, or mark it recorded. */
export interface MoveCellInput {
  roundupId: number;
  cellId: number;
  action: CellAction;
  /** Why a run starts outside every booking of the cell (asked for after the server's warning). */
  overrideReason?: string;
}

export interface MyBenchOverviewProps {
  myBench: MyBench;
  /** Link to a roundup's matrix. */
  matrixPath: (roundupId: number) => string;
  /** Sends a move (the page wires in the matrix's one transition request). */
  moveCell: (input: MoveCellInput) => Promise<MatrixCell>;
}

type Notice = { tone: 'success' | 'danger'; text: string } | null;

const cellName = (item: QueueItem) => `${productDisplayName(item.product)} · ${item.loadConfiguration.name}`;

/** A tester's own work: the queue and what waits for the editor. */
export function MyBenchOverview({ myBench, matrixPath, moveCell }: MyBenchOverviewProps) {
  const [notice, setNotice] = useState<Notice>(null);
  const [pendingCellId, setPendingCellId] = useState<number | undefined>();
  // A start the server warned about: no booking of this cell covers now. The tester may start anyway, with a reason.
  const [outside, setOutside] = useState<{ item: QueueItem; message: string } | null>(null);
  const overdue = myBench.queue.filter((item) => item.cell.overdue).length;

  const move = useCallback(
    async (item: QueueItem, action: CellAction, overrideReason?: string) => {
      setNotice(null);
      setPendingCellId(item.cell.id);
      try {
        const cell = await moveCell({ roundupId: item.roundup.id, cellId: item.cell.id, action, overrideReason });
        setOutside(null);
        setNotice({ tone: 'success', text: `${cellName(item)}: ${cellStateLabels[cell.state]}.` });
      } catch (error) {
        if (isApiError(error) && error.code === 'start_outside_booking') {
          setOutside({ item, message: error.message });
        } else {
          setOutside(null);
          setNotice({ tone: 'danger', text: `${cellName(item)} did not move. ${describeSubmitError(error).message}` });
        }
      } finally {
        setPendingCellId(undefined);
      }
    },
    [moveCell],
  );

  return (
    <div className="space-y-6">
      <Panel
        title="Your queue"
        description={
          myBench.queue.length === 0
            ? 'Nothing assigned to you right now.'
            : `${myBench.queue.length} cell${myBench.queue.length === 1 ? '' : 's'} to run, earliest due date first${
                overdue > 0 ? `; ${overdue} overdue` : ''
              }. Runs start once their roundup is On the bench.`
        }
      >
        {notice && (
          <Alert tone={notice.tone} announce className="mb-3">
            {notice.text}
          </Alert>
        )}
        <QueueTable
          caption="Your queue"
          items={myBench.queue}
          bookings={myBench.upcomingBookings}
          matrixPath={matrixPath}
          onMove={(item, action) => void move(item, action)}
          pendingCellId={pendingCellId}
          empty={{
            title: 'Your queue is empty',
            text: 'When an editor assigns matrix cells to you, they appear here by due date.',
          }}
        />
      </Panel>

      {myBench.awaitingReview.length > 0 && (
        <Panel title="Waiting for the editor" description="Recorded runs the editor has yet to accept or send back.">
          <QueueTable
            caption="Recorded, waiting for the editor"
            items={myBench.awaitingReview}
            bookings={myBench.upcomingBookings}
            matrixPath={matrixPath}
            empty={{ title: 'Nothing waiting', text: '' }}
          />
        </Panel>
      )}

      <StartOutsideBookingDialog
        warning={outside}
        pending={outside !== null && pendingCellId === outside.item.cell.id}
        onCancel={() => setOutside(null)}
        onConfirm={(reason) => outside && void move(outside.item, 'start', reason)}
      />
    </div>
  );
}

function StartOutsideBookingDialog({
  warning,
  pending,
  onCancel,
  onConfirm,
}: {
  warning: { item: QueueItem; message: string } | null;
  pending: boolean;
  onCancel: () => void;
  onConfirm: (reason: string) => void;
}) {
  const formId = useId();
  const [reason, setReason] = useState('');
  const [error, setError] = useState<string | undefined>();
  return (
    <Dialog
      open={warning !== null}
      onClose={onCancel}
      size="sm"
      title="Start outside your bookings?"
      footer={
        <>
          <Button onClick={onCancel}>Keep it queued</Button>
          <Button type="submit" form={formId} variant="primary" pending={pending}>
            Start anyway
          </Button>
        </>
      }
    >
      <form
        id={formId}
        noValidate
        className="space-y-3"
        onSubmit={(event) => {
          event.preventDefault();
          if (!reason.trim()) {
            setError('Say why the run starts outside its bookings.');
            return;
          }
          onConfirm(reason.trim());
        }}
      >
        {warning && (
          <p className="text-sm">
            <span className="font-semibold">{cellName(warning.item)}.</span> {warning.message}
          </p>
        )}
        <TextArea
          label="Why start now"
          rows={2}
          maxLength={300}
          value={reason}
          error={error}
          description="Kept in the roundup’s history, so the editor can see why."
          onChange={(event) => {
            setReason(event.target.value);
            setError(undefined);
          }}
        />
      </form>
    </Dialog>
  );
}
