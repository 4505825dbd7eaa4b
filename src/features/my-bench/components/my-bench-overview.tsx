import { useCallback, useState } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Panel } from '../../../components/ui/panel';
import { describeSubmitError } from '../../../lib/form-errors';
import {
  bookableStates,
  cellStateLabels,
  type CellAction,
} from '../../../../shared/domain/planning/matrix-cell-states';
import type { QueueItem } from '../../../../shared/schemas/matrix';
import { useBenches } from '../api/get-benches';
import { useMyBench } from '../api/get-my-bench';
import { useMoveCell } from '../api/move-cell';
import { formatSlot } from '../../../lib/format-time';
import { productName } from '../../../lib/product-name';
import { BenchSafety } from './bench-safety';
import { BookBenchForm } from './book-bench-form';
import { BookingsList } from './bookings-list';
import { QueueTable } from './queue-table';

export interface MyBenchOverviewProps {
  /** Link to a roundup's matrix. */
  matrixPath: (roundupId: number) => string;
}

type Notice = { tone: 'success' | 'danger'; text: string } | null;

/** A tester's own work: the queue, what waits for the editor, the bookings, and booking a bench. */
export function MyBenchOverview({ matrixPath }: MyBenchOverviewProps) {
  const myBench = useMyBench();
  const benches = useBenches();
  const moveCell = useMoveCell();
  const [notice, setNotice] = useState<Notice>(null);
  const [booked, setBooked] = useState<string | null>(null);
  const bookable = myBench.queue.filter((item) => bookableStates.includes(item.cell.state));
  const overdue = myBench.queue.filter((item) => item.cell.overdue).length;

  const move = useCallback(
    (item: QueueItem, action: CellAction) => {
      const name = `${productName(item.product)} · ${item.loadConfiguration.name}`;
      setNotice(null);
      moveCell.mutate(
        { roundupId: item.roundup.id, cellId: item.cell.id, action },
        {
          onSuccess: (cell) => setNotice({ tone: 'success', text: `${name}: ${cellStateLabels[cell.state]}.` }),
          onError: (error) =>
            setNotice({ tone: 'danger', text: `${name} did not move. ${describeSubmitError(error).message}` }),
        },
      );
    },
    [moveCell],
  );

  return (
    <div className="space-y-6">
      <BenchSafety />

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
          onMove={move}
          pendingCellId={moveCell.isPending ? moveCell.variables?.cellId : undefined}
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

      <div className="grid grid-cols-1 gap-6 lg:grid-cols-2">
        <Panel title="Your bookings">
          <BookingsList bookings={myBench.upcomingBookings} />
        </Panel>
        <Panel title="Book a bench" description="Reserve bench time for cells assigned to you.">
          {booked && (
            <Alert tone="success" announce className="mb-4">
              {booked}
            </Alert>
          )}
          <BookBenchForm
            benches={benches}
            cells={bookable}
            onBooked={(booking) =>
              setBooked(
                `Booked ${booking.bench.name}, ${formatSlot(booking.startsAt, booking.endsAt)}, for ${booking.cells.length} cell${
                  booking.cells.length === 1 ? '' : 's'
                }.`,
              )
            }
          />
        </Panel>
      </div>
    </div>
  );
}
