import { In, MoreThan, type DataSource } from 'typeorm';
import { BenchBookingEntity } from '../entities/bench-booking.entity';
import { MatrixCellEntity } from '../entities/matrix-cell.entity';
import type { BenchesService } from './benches.service';
import { queueItems } from '../mappers/queue-item';
import { queueStates } from '../../shared/domain/planning/matrix-cell-states';
import type { CurrentUser } from '../../shared/schemas/auth';
import type { MyBench } from '../../shared/schemas/benches';
import type { QueueItem } from '../../shared/schemas/matrix';

/** Earliest due date first; cells without a due date last; then roundup and cell order. */
export function byDueDate(a: QueueItem, b: QueueItem): number {
  const da = a.cell.dueDate;
  const db = b.cell.dueDate;
  if (da !== db) {
    if (da == null) return 1;
    if (db == null) return -1;
    return da < db ? -1 : 1;
  }
  return a.roundup.id - b.roundup.id || a.cell.id - b.cell.id;
}

/** A tester's own queue, recorded cells waiting for the editor, and upcoming bookings. */
export class MyBenchService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly benches: BenchesService,
  ) {}

  async forUser(user: CurrentUser): Promise<MyBench> {
    const manager = this.dataSource.manager;
    const now = new Date();
    const cells = await manager
      .getRepository(MatrixCellEntity)
      .findBy({ testerId: user.id, state: In([...queueStates, 'recorded']) });
    const items = await queueItems(manager, cells, user, now);
    // Only roundups still being tested put work in the queue.
    const open = items.filter((item) => item.roundup.state === 'planning' || item.roundup.state === 'on-the-bench');
    const bookings = await manager
      .getRepository(BenchBookingEntity)
      .find({ where: { testerId: user.id, endsAt: MoreThan(now) }, order: { startsAt: 'ASC' }, take: 100 });
    return {
      queue: open.filter((item) => item.cell.state !== 'recorded').sort(byDueDate),
      awaitingReview: open.filter((item) => item.cell.state === 'recorded').sort(byDueDate),
      upcomingBookings: await this.benches.toBookingDtos(manager, bookings, user),
    };
  }
}
