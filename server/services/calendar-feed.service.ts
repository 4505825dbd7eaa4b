import { createHash, randomBytes } from 'node:crypto';
import { In, type DataSource } from 'typeorm';
import { BenchEntity } from '../entities/bench.entity';
import { CalendarFeedEntity } from '../entities/calendar-feed.entity';
import { MatrixCellEntity } from '../entities/matrix-cell.entity';
import { UserEntity } from '../entities/user.entity';
import { notFound } from '../errors';
import { recordAction } from './audit.service';
import type { BenchesService } from './benches.service';
import { queueItems } from '../mappers/queue-item';
import { formatCalendar, type CalendarEvent } from '../../shared/domain/planning/icalendar';
import { cellStateLabels, queueStates } from '../../shared/domain/planning/matrix-cell-states';
import type { CurrentUser } from '../../shared/schemas/auth';
import {
  CALENDAR_TOKEN_PATTERN,
  type CalendarFeed,
  type CalendarFeedCreated,
} from '../../shared/schemas/calendar-feed';
import { productDisplayName } from '../../shared/domain/planning/product-display-name';

const DAY_MS = 86_400_000;

/** The token is 256 random bits, so a plain SHA-256 is enough to keep a stolen table from opening feeds. */
function hashToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

/** The day after a calendar date (YYYY-MM-DD): the exclusive end of an all-day event. */
function nextDay(date: string): string {
  return new Date(Date.parse(`${date}T00:00:00Z`) + DAY_MS).toISOString().slice(0, 10);
}

/**
 * A tester's private iCalendar feed of their bench bookings and cell due dates, behind a secret address they can
 * reset. The address carries the only copy of the token; the database keeps its hash.
 */
export class CalendarFeedService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly benches: BenchesService,
  ) {}

  async status(user: CurrentUser): Promise<CalendarFeed> {
    const feed = await this.dataSource.getRepository(CalendarFeedEntity).findOneBy({ userId: user.id });
    return { enabled: feed !== null, createdAt: feed?.createdAt.toISOString() ?? null };
  }

  /** Makes a new secret address, replacing any earlier one (which stops working at once). */
  async reset(user: CurrentUser): Promise<CalendarFeedCreated> {
    const token = randomBytes(32).toString('base64url');
    const createdAt = new Date();
    await this.dataSource.transaction(async (manager) => {
      const repo = manager.getRepository(CalendarFeedEntity);
      const had = await repo.existsBy({ userId: user.id });
      await repo.delete({ userId: user.id });
      await repo.insert({ userId: user.id, tokenHash: hashToken(token), createdAt });
      await recordAction(manager, user, had ? 'calendar_feed.reset' : 'calendar_feed.created', ['user', user.id]);
    });
    return { path: `/api/calendar/${token}.ics`, createdAt: createdAt.toISOString() };
  }

  async disable(user: CurrentUser): Promise<void> {
    await this.dataSource.transaction(async (manager) => {
      const { affected } = await manager.getRepository(CalendarFeedEntity).delete({ userId: user.id });
      if (affected) {
        await recordAction(manager, user, 'calendar_feed.disabled', ['user', user.id]);
      }
    });
  }

  /** The feed for a token, as iCalendar text; 404 for a token that is malformed, unknown, reset or whose owner left. */
  async feed(token: string, now = new Date()): Promise<string> {
    const manager = this.dataSource.manager;
    const feed = CALENDAR_TOKEN_PATTERN.test(token)
      ? await manager.getRepository(CalendarFeedEntity).findOneBy({ tokenHash: hashToken(token) })
      : null;
    const owner = feed ? await manager.getRepository(UserEntity).findOneBy({ id: feed.userId }) : null;
    if (!feed || !owner || !owner.active) throw notFound('That calendar');
    const user: CurrentUser = {
      id: owner.id,
      email: owner.email,
      displayName: owner.displayName,
      role: owner.role,
    };

    const bookings = await this.benches.bookings(user, {
      testerId: user.id,
      from: new Date(now.getTime() - 60 * DAY_MS).toISOString(),
      to: new Date(now.getTime() + 300 * DAY_MS).toISOString(),
    });
    const benchIds = [...new Set(bookings.map((booking) => booking.bench.id))];
    const locations = new Map(
      (benchIds.length ? await manager.getRepository(BenchEntity).findBy({ id: In(benchIds) }) : []).map((b) => [
        b.id,
        b.location,
      ]),
    );
    const cells = await manager
      .getRepository(MatrixCellEntity)
      .findBy({ testerId: user.id, state: In([...queueStates]) });
    const due = (await queueItems(manager, cells, user, now)).filter(
      (item) => item.cell.dueDate && (item.roundup.state === 'planning' || item.roundup.state === 'on-the-bench'),
    );

    const assignedAt = new Map(cells.map((cell) => [cell.id, cell.assignedAt ?? undefined]));
    const cellLine = (item: (typeof due)[number]) =>
      `${productDisplayName(item.product)} · ${item.loadConfiguration.name} (${item.roundup.title})`;
    const events: CalendarEvent[] = [
      ...bookings.map((booking) => ({
        uid: `booking-${booking.id}@benchwire`,
        stamp: new Date(booking.createdAt),
        when: { start: new Date(booking.startsAt), end: new Date(booking.endsAt) },
        summary: `${booking.bench.name}: ${booking.cells.length} cell${booking.cells.length === 1 ? '' : 's'}`,
        description: [...booking.cells.map(cellLine), ...(booking.note ? ['', booking.note] : [])].join('\n'),
        location: locations.get(booking.bench.id) ?? undefined,
      })),
      ...due.map((item) => ({
        uid: `cell-${item.cell.id}-due@benchwire`,
        stamp: assignedAt.get(item.cell.id) ?? now,
        when: { startDate: item.cell.dueDate as string, endDate: nextDay(item.cell.dueDate as string) },
        summary: `Due: ${productDisplayName(item.product)} · ${item.loadConfiguration.name}`,
        description: `${item.roundup.title}\n${cellStateLabels[item.cell.state]}`,
      })),
    ];
    return formatCalendar({
      productId: '-//Benchwire//Bench calendar//EN',
      name: `Benchwire: ${user.displayName}`,
      events,
    });
  }
}
