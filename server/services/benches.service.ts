import { In, LessThan, MoreThan, type DataSource, type EntityManager } from 'typeorm';
import { BenchBookingCellEntity } from '../entities/bench-booking-cell.entity';
import { BenchBookingEntity } from '../entities/bench-booking.entity';
import { BenchProfileEntity } from '../entities/bench-profile.entity';
import { BenchEntity } from '../entities/bench.entity';
import { MatrixCellEntity } from '../entities/matrix-cell.entity';
import { RoundupEntity } from '../entities/roundup.entity';
import { AppError, conflict, forbidden, invalid, notFound } from '../errors';
import { recordAction } from './audit.service';
import { NamedRecords } from '../lib/named-records';
import type { FieldChanges } from '../lib/field-changes';
import { loadPeople, personOrNull } from '../mappers/people';
import { benchProfileRoundupCounts, toBenchProfileDto } from '../mappers/bench-profile';
import { queueItems } from '../mappers/queue-item';
import { BenchInstrumentEntity } from '../entities/bench-instrument.entity';
import { BenchMaintenanceEntryEntity } from '../entities/bench-maintenance-entry.entity';
import { calibrationOverdue, nextCalibrationDue } from '../../shared/domain/planning/calibration';
import type {
  BenchDetail,
  Instrument,
  MaintenanceEntry,
  ParsedCreateInstrumentRequest,
  ParsedCreateMaintenanceRequest,
  ParsedUpdateInstrumentRequest,
} from '../../shared/schemas/bench-detail';
import { bookableStates, cellStateLabels } from '../../shared/domain/planning/matrix-cell-states';
import type { CurrentUser } from '../../shared/schemas/auth';
import type {
  Bench,
  Booking,
  ParsedCreateBenchRequest,
  ParsedCreateBookingRequest,
  ParsedUpdateBenchRequest,
} from '../../shared/schemas/benches';
import type { PersonRef } from '../../shared/schemas/planning-fields';
import { productDisplayName } from '../../shared/domain/planning/product-display-name';

const DAY_MS = 86_400_000;

/** "2025-06-02 09:00–12:00 UTC" for messages; the client shows times in the user's zone. */
function slotText(startsAt: Date, endsAt: Date): string {
  const start = startsAt.toISOString().slice(0, 16).replace('T', ' ');
  const sameDay = startsAt.toISOString().slice(0, 10) === endsAt.toISOString().slice(0, 10);
  const end = sameDay ? endsAt.toISOString().slice(11, 16) : endsAt.toISOString().slice(0, 16).replace('T', ' ');
  return `${start}–${end} UTC`;
}

function toInstrumentDto(instrument: BenchInstrumentEntity, today: string): Instrument {
  const nextDue = instrument.calibratedOn
    ? nextCalibrationDue(instrument.calibratedOn, instrument.calibrationIntervalMonths)
    : null;
  return {
    id: instrument.id,
    kind: instrument.kind,
    label: instrument.label,
    model: instrument.model,
    serialNumber: instrument.serialNumber,
    calibratedOn: instrument.calibratedOn,
    calibrationIntervalMonths: instrument.calibrationIntervalMonths,
    nextCalibrationDue: nextDue,
    calibrationOverdue: nextDue === null || calibrationOverdue(nextDue, today),
  };
}

/** The parts of a bench profile that describe the physical set-up, as a booking compares them. */
const setUpFields: { label: string; read: (profile: BenchProfileEntity) => string }[] = [
  { label: 'room target', read: (p) => `${Number(p.roomTempTargetC).toFixed(1)} °C` },
  { label: 'room tolerance', read: (p) => `±${Number(p.roomTempToleranceC).toFixed(1)} °C` },
  { label: 'cooler', read: (p) => p.cooler },
  { label: 'case and fans', read: (p) => p.caseAndFans },
  { label: 'power supply', read: (p) => p.psu },
  { label: 'memory', read: (p) => p.memory },
  { label: 'probe', read: (p) => p.probeType },
  { label: 'probe placement', read: (p) => p.probePlacement },
];

/**
 * The tester's booking of this cell that covers `at`, and else their next one; both null when there is none. A run
 * started outside every booking is warned about (the bench may be someone else's) and needs a reason.
 */
export async function cellBookingAt(manager: EntityManager, cellId: number, at: Date) {
  const query = () =>
    manager
      .getRepository(BenchBookingEntity)
      .createQueryBuilder('b')
      .innerJoin(BenchBookingCellEntity, 'bc', 'bc.bookingId = b.id')
      .innerJoin(BenchEntity, 'bench', 'bench.id = b.benchId')
      .select(['b.startsAt AS startsAt', 'b.endsAt AS endsAt', 'bench.name AS benchName'])
      .where('bc.cellId = :cellId', { cellId });
  type Row = { startsAt: Date; endsAt: Date; benchName: string };
  const covering = await query()
    .andWhere('b.startsAt <= :at', { at })
    .andWhere('b.endsAt > :at', { at })
    .getRawOne<Row>();
  const next = covering
    ? undefined
    : await query().andWhere('b.startsAt > :at', { at }).orderBy('b.startsAt', 'ASC').getRawOne<Row>();
  const describe = (row: Row | undefined) =>
    row ? `${row.benchName} ${slotText(new Date(row.startsAt), new Date(row.endsAt))}` : null;
  return { covering: describe(covering), next: describe(next) };
}

/** Benches and their booking calendars. */
export class BenchesService {
  private readonly records: NamedRecords<BenchEntity>;

  constructor(private readonly dataSource: DataSource) {
    this.records = new NamedRecords(dataSource, BenchEntity, 'bench', 'bench');
  }

  private async toBenchDtos(manager: EntityManager, benches: BenchEntity[]): Promise<Bench[]> {
    const profileIds = [...new Set(benches.map((b) => b.benchProfileId).filter((id): id is number => id != null))];
    const profiles = profileIds.length
      ? await manager
          .getRepository(BenchProfileEntity)
          .find({ where: { id: In(profileIds) }, select: { id: true, name: true } })
      : [];
    const profileById = new Map(profiles.map((p) => [p.id, p]));
    return benches.map((bench) => {
      const profile = bench.benchProfileId != null ? profileById.get(bench.benchProfileId) : undefined;
      return {
        id: bench.id,
        name: bench.name,
        location: bench.location,
        benchProfile: profile ? { id: profile.id, name: profile.name } : null,
        notes: bench.notes,
        active: Boolean(bench.active),
        createdAt: bench.createdAt.toISOString(),
        updatedAt: bench.updatedAt.toISOString(),
      };
    });
  }

  async list(): Promise<Bench[]> {
    const benches = await this.dataSource.getRepository(BenchEntity).find({ order: { name: 'ASC' } });
    return this.toBenchDtos(this.dataSource.manager, benches);
  }

  async get(id: number, manager: EntityManager = this.dataSource.manager): Promise<Bench> {
    const bench = await manager.getRepository(BenchEntity).findOneBy({ id });
    if (!bench) throw notFound('That bench');
    return (await this.toBenchDtos(manager, [bench]))[0];
  }

  private async checkProfile(manager: EntityManager, id: number | null | undefined) {
    if (id == null) return;
    if (!(await manager.getRepository(BenchProfileEntity).existsBy({ id }))) {
      throw invalid('That bench profile does not exist.', { benchProfileId: 'That bench profile does not exist.' });
    }
  }

  create(actor: CurrentUser, input: ParsedCreateBenchRequest): Promise<Bench> {
    return this.records.createAudited(
      actor,
      { ...input, active: true },
      { name: input.name },
      (id, manager) => this.get(id, manager),
      (manager) => this.checkProfile(manager, input.benchProfileId),
    );
  }

  update(actor: CurrentUser, id: number, input: ParsedUpdateBenchRequest): Promise<Bench> {
    return this.records.updateAudited(
      actor,
      id,
      async (bench, manager) => {
        await this.checkProfile(manager, input.benchProfileId);
        const changes: FieldChanges = {};
        for (const key of ['name', 'location', 'benchProfileId', 'notes', 'active'] as const) {
          const before = key === 'active' ? Boolean(bench.active) : bench[key];
          if (input[key] !== undefined && input[key] !== before) changes[key] = { from: before, to: input[key] };
        }
        return { patch: Object.fromEntries(Object.entries(changes).map(([k, v]) => [k, v.to])), changes };
      },
      (benchId, manager) => this.get(benchId, manager),
    );
  }

  /** Bookings overlapping [from, to), default from one day ago to two weeks ahead. `benchId` null = all benches. */
  async bookings(
    user: CurrentUser,
    options: { benchId?: number; testerId?: number; from?: string; to?: string },
  ): Promise<Booking[]> {
    const manager = this.dataSource.manager;
    if (options.benchId != null && !(await manager.getRepository(BenchEntity).existsBy({ id: options.benchId }))) {
      throw notFound('That bench');
    }
    const now = Date.now();
    const from = options.from ? new Date(options.from) : new Date(now - DAY_MS);
    const to = options.to ? new Date(options.to) : new Date(now + 14 * DAY_MS);
    if (!(to > from))
      throw invalid('The window must end after it starts.', { to: 'The window must end after it starts.' });
    if (to.getTime() - from.getTime() > 400 * DAY_MS)
      throw invalid('Ask for at most 400 days at a time.', { to: 'Ask for at most 400 days at a time.' });
    const bookings = await manager.getRepository(BenchBookingEntity).find({
      where: {
        ...(options.benchId != null ? { benchId: options.benchId } : {}),
        ...(options.testerId != null ? { testerId: options.testerId } : {}),
        startsAt: LessThan(to),
        endsAt: MoreThan(from),
      },
      order: { startsAt: 'ASC', id: 'ASC' },
    });
    return this.toBookingDtos(manager, bookings, user);
  }

  async toBookingDtos(manager: EntityManager, bookings: BenchBookingEntity[], user: CurrentUser): Promise<Booking[]> {
    if (bookings.length === 0) return [];
    const benches = await manager
      .getRepository(BenchEntity)
      .find({ where: { id: In([...new Set(bookings.map((b) => b.benchId))]) }, select: { id: true, name: true } });
    const benchById = new Map(benches.map((b) => [b.id, b]));
    const links = await manager
      .getRepository(BenchBookingCellEntity)
      .findBy({ bookingId: In(bookings.map((b) => b.id)) });
    const cells = links.length
      ? await manager.getRepository(MatrixCellEntity).findBy({ id: In(links.map((l) => l.cellId)) })
      : [];
    const items = await queueItems(manager, cells, user, new Date());
    const itemByCell = new Map(items.map((item) => [item.cell.id, item]));
    const people: Map<number, PersonRef> = await loadPeople(
      manager,
      bookings.map((b) => b.testerId),
    );
    return bookings.map((booking) => {
      const bench = benchById.get(booking.benchId) as BenchEntity;
      return {
        id: booking.id,
        bench: { id: bench.id, name: bench.name },
        tester: personOrNull(people, booking.testerId) ?? { id: booking.testerId, displayName: 'Former staff member' },
        startsAt: booking.startsAt.toISOString(),
        endsAt: booking.endsAt.toISOString(),
        note: booking.note,
        overrideReason: booking.overrideReason,
        cells: links
          .filter((l) => l.bookingId === booking.id)
          .map((l) => itemByCell.get(l.cellId))
          .filter((item) => item !== undefined),
        cancellable: user.role === 'editor' || booking.testerId === user.id,
        createdAt: booking.createdAt.toISOString(),
      };
    });
  }

  /**
   * Books a slot on a bench for the tester's own assigned cells. Overlaps are refused inside the database
   * transaction: the bench row is locked with SELECT … FOR UPDATE first, so a second request for the same
   * bench waits until the first commits and then sees its booking in the overlap check (READ COMMITTED, so
   * the check reads the latest committed rows rather than an older snapshot).
   */
  async book(actor: CurrentUser, benchId: number, input: ParsedCreateBookingRequest): Promise<Booking> {
    const startsAt = new Date(input.startsAt);
    const endsAt = new Date(input.endsAt);
    if (endsAt.getTime() <= Date.now()) {
      throw invalid('That slot is already over; book a slot that ends in the future.', {
        endsAt: 'The slot has already ended.',
      });
    }
    return this.dataSource.transaction('READ COMMITTED', async (manager) => {
      const bench = await manager
        .getRepository(BenchEntity)
        .findOne({ where: { id: benchId }, lock: { mode: 'pessimistic_write' } });
      if (!bench) throw notFound('That bench');
      if (!bench.active)
        throw new AppError('bench_inactive', 422, `${bench.name} is out of service and takes no bookings.`);

      // Exclusive locks on the cells: an unassign waits until the booking commits, and so does a second booking of
      // the same cell on another bench (which then sees this one in the cell check below).
      const cells = await manager
        .getRepository(MatrixCellEntity)
        .find({ where: { id: In(input.cellIds) }, lock: { mode: 'pessimistic_write' }, order: { id: 'ASC' } });
      const missing = input.cellIds.filter((id) => !cells.some((c) => c.id === id));
      if (missing.length > 0)
        throw invalid('Some cells do not exist.', { cellIds: `Cells ${missing.join(', ')} do not exist.` });
      const others = cells.filter((c) => c.testerId !== actor.id);
      if (others.length > 0) throw forbidden('You can book bench time only for cells assigned to you.');
      const closed = cells.filter((c) => !bookableStates.includes(c.state));
      if (closed.length > 0) {
        throw new AppError(
          'cells_not_bookable',
          422,
          `Book time only for cells still to be tested; ${closed.length} chosen cell(s) are ${[
            ...new Set(closed.map((c) => cellStateLabels[c.state].toLowerCase())),
          ].join(' or ')}.`,
          { cellIds: closed.map((c) => c.id).join(', ') },
        );
      }

      const clash = await manager
        .getRepository(BenchBookingEntity)
        .createQueryBuilder('b')
        .where('b.benchId = :benchId', { benchId })
        .andWhere('b.startsAt < :endsAt', { endsAt })
        .andWhere('b.endsAt > :startsAt', { startsAt })
        .orderBy('b.startsAt', 'ASC')
        .setLock('pessimistic_write')
        .getOne();
      if (clash) {
        const holder = (await loadPeople(manager, [clash.testerId])).get(clash.testerId)?.displayName ?? 'someone';
        throw conflict(
          'booking_overlap',
          `${bench.name} is already booked ${slotText(clash.startsAt, clash.endsAt)} by ${holder}, which overlaps ${slotText(startsAt, endsAt)}. Choose another time or bench.`,
          { startsAt: `Overlaps the booking ${slotText(clash.startsAt, clash.endsAt)}.` },
        );
      }

      await this.refuseCellsBookedElsewhere(manager, actor, input.cellIds, startsAt, endsAt);

      const differences = await this.setUpDifferences(manager, bench, cells);
      const overrideReason = differences.length > 0 ? (input.overrideReason ?? null) : null;
      if (differences.length > 0 && !overrideReason) {
        throw conflict(
          'bench_profile_mismatch',
          `${bench.name} is not set up as the roundup’s bench profile asks: ${differences.join('; ')}. Choose another bench, or book anyway and say why.`,
          { overrideReason: 'Say why this bench will do, or choose another bench.' },
        );
      }

      const { identifiers } = await manager
        .getRepository(BenchBookingEntity)
        .insert({ benchId, testerId: actor.id, startsAt, endsAt, note: input.note ?? null, overrideReason });
      const bookingId = Number(identifiers[0].id);
      await manager
        .getRepository(BenchBookingCellEntity)
        .insert(input.cellIds.map((cellId) => ({ bookingId, cellId })));
      await recordAction(manager, actor, 'bench.booked', ['bench', benchId], {
        bookingId,
        startsAt: startsAt.toISOString(),
        endsAt: endsAt.toISOString(),
        cellIds: input.cellIds,
        ...(overrideReason ? { setUpDifferences: differences, overrideReason } : {}),
      });
      const booking = await manager.getRepository(BenchBookingEntity).findOneByOrFail({ id: bookingId });
      return (await this.toBookingDtos(manager, [booking], actor))[0];
    });
  }

  /**
   * A cell runs on one bench at a time: refuses the slot when one of the cells already has a booking, on any bench,
   * that overlaps it. The caller holds the cells' row locks, so two bookings of one cell cannot pass this together.
   */
  private async refuseCellsBookedElsewhere(
    manager: EntityManager,
    actor: CurrentUser,
    cellIds: number[],
    startsAt: Date,
    endsAt: Date,
  ) {
    const clash = await manager
      .getRepository(BenchBookingEntity)
      .createQueryBuilder('b')
      .innerJoin(BenchBookingCellEntity, 'bc', 'bc.bookingId = b.id')
      .innerJoin(BenchEntity, 'bench', 'bench.id = b.benchId')
      .select(['b.startsAt AS startsAt', 'b.endsAt AS endsAt', 'bench.name AS benchName', 'bc.cellId AS cellId'])
      .where('bc.cellId IN (:...cellIds)', { cellIds })
      .andWhere('b.startsAt < :endsAt', { endsAt })
      .andWhere('b.endsAt > :startsAt', { startsAt })
      .orderBy('b.startsAt', 'ASC')
      .getRawOne<{ startsAt: Date; endsAt: Date; benchName: string; cellId: number }>();
    if (!clash) return;
    const [item] = await queueItems(
      manager,
      await manager.getRepository(MatrixCellEntity).findBy({ id: clash.cellId }),
      actor,
      new Date(),
    );
    const cellName = item
      ? `${productDisplayName(item.product)} · ${item.loadConfiguration.name}`
      : `Cell ${clash.cellId}`;
    const slot = slotText(new Date(clash.startsAt), new Date(clash.endsAt));
    throw conflict(
      'cell_already_booked',
      `${cellName} is already booked on ${clash.benchName} ${slot}, which overlaps ${slotText(startsAt, endsAt)}. A cell runs on one bench at a time: choose another time, or cancel the other booking first.`,
      { cellIds: `${cellName} is already booked on ${clash.benchName} ${slot}.` },
    );
  }

  /**
   * How the bench's set-up differs from the bench profiles of the roundups the cells belong to, in words; empty
   * when they agree. A bench built to the same profile agrees; a bench built to another profile agrees when every
   * set-up field matches.
   */
  private async setUpDifferences(manager: EntityManager, bench: BenchEntity, cells: MatrixCellEntity[]) {
    const roundups = await manager
      .getRepository(RoundupEntity)
      .find({ where: { id: In([...new Set(cells.map((cell) => cell.roundupId))]) }, order: { id: 'ASC' } });
    const wanted = roundups.filter(
      (roundup) => roundup.benchProfileId != null && roundup.benchProfileId !== bench.benchProfileId,
    );
    // A bench built to no profile has no described set-up: nothing to compare, so nothing to warn about.
    if (wanted.length === 0 || bench.benchProfileId == null) return [];
    const profileIds = [bench.benchProfileId, ...wanted.map((roundup) => roundup.benchProfileId as number)];
    const profiles = new Map(
      (await manager.getRepository(BenchProfileEntity).findBy({ id: In(profileIds) })).map((p) => [p.id, p]),
    );
    const own = profiles.get(bench.benchProfileId);
    if (!own) return [];
    const differences: string[] = [];
    for (const roundup of wanted) {
      const profile = profiles.get(roundup.benchProfileId as number);
      if (!profile) continue;
      const fields = setUpFields
        .filter(({ read }) => read(own) !== read(profile))
        .map(({ label, read }) => `${label} ${read(own)} here, ${read(profile)} in ${profile.name}`);
      if (fields.length > 0) differences.push(`for “${roundup.title}”: ${fields.join(', ')}`);
    }
    return differences;
  }

  /** One bench's page: its set-up (the profile it is built to), probes and logger, and maintenance log. */
  async detail(id: number, today = new Date().toISOString().slice(0, 10)): Promise<BenchDetail> {
    const manager = this.dataSource.manager;
    const bench = await this.get(id, manager);
    const profile = bench.benchProfile
      ? await manager.getRepository(BenchProfileEntity).findOneBy({ id: bench.benchProfile.id })
      : null;
    const instruments = await manager
      .getRepository(BenchInstrumentEntity)
      .find({ where: { benchId: id }, order: { kind: 'ASC', label: 'ASC', id: 'ASC' } });
    const entries = await manager
      .getRepository(BenchMaintenanceEntryEntity)
      .find({ where: { benchId: id }, order: { doneOn: 'DESC', id: 'DESC' }, take: 200 });
    const people = await loadPeople(
      manager,
      entries.map((entry) => entry.recordedBy),
    );
    return {
      bench,
      setUp: profile
        ? toBenchProfileDto(profile, (await benchProfileRoundupCounts(manager, [profile.id])).get(profile.id) ?? 0)
        : null,
      instruments: instruments.map((instrument) => toInstrumentDto(instrument, today)),
      maintenance: entries.map((entry) => ({
        id: entry.id,
        doneOn: entry.doneOn,
        description: entry.description,
        recordedBy: personOrNull(people, entry.recordedBy),
        createdAt: entry.createdAt.toISOString(),
      })),
    };
  }

  async addInstrument(actor: CurrentUser, benchId: number, input: ParsedCreateInstrumentRequest): Promise<Instrument> {
    return this.dataSource.transaction(async (manager) => {
      await this.lockBench(manager, benchId);
      const { identifiers } = await manager.getRepository(BenchInstrumentEntity).insert({ ...input, benchId });
      const id = Number(identifiers[0].id);
      await recordAction(manager, actor, 'bench.instrument_added', ['bench', benchId], { instrumentId: id, ...input });
      const saved = await manager.getRepository(BenchInstrumentEntity).findOneByOrFail({ id });
      return toInstrumentDto(saved, new Date().toISOString().slice(0, 10));
    });
  }

  /** Edits a probe or logger, e.g. a new calibration date after it came back from the lab. */
  async updateInstrument(
    actor: CurrentUser,
    benchId: number,
    instrumentId: number,
    input: ParsedUpdateInstrumentRequest,
  ): Promise<Instrument> {
    return this.dataSource.transaction(async (manager) => {
      await this.lockBench(manager, benchId);
      const repo = manager.getRepository(BenchInstrumentEntity);
      const instrument = await repo.findOneBy({ id: instrumentId, benchId });
      if (!instrument) throw notFound('That probe or logger');
      const changes = Object.fromEntries(Object.entries(input).filter(([, value]) => value !== undefined));
      if (Object.keys(changes).length > 0) {
        await repo.update({ id: instrumentId }, changes);
        await recordAction(manager, actor, 'bench.instrument_updated', ['bench', benchId], {
          instrumentId,
          ...changes,
        });
      }
      return toInstrumentDto(await repo.findOneByOrFail({ id: instrumentId }), new Date().toISOString().slice(0, 10));
    });
  }

  async addMaintenance(
    actor: CurrentUser,
    benchId: number,
    input: ParsedCreateMaintenanceRequest,
  ): Promise<MaintenanceEntry> {
    if (input.doneOn > new Date().toISOString().slice(0, 10)) {
      throw invalid('Log maintenance once it is done.', { doneOn: 'The day cannot be in the future.' });
    }
    return this.dataSource.transaction(async (manager) => {
      await this.lockBench(manager, benchId);
      const { identifiers } = await manager
        .getRepository(BenchMaintenanceEntryEntity)
        .insert({ benchId, doneOn: input.doneOn, description: input.description, recordedBy: actor.id });
      const id = Number(identifiers[0].id);
      await recordAction(manager, actor, 'bench.maintenance_logged', ['bench', benchId], {
        entryId: id,
        doneOn: input.doneOn,
      });
      const entry = await manager.getRepository(BenchMaintenanceEntryEntity).findOneByOrFail({ id });
      return {
        id,
        doneOn: entry.doneOn,
        description: entry.description,
        recordedBy: { id: actor.id, displayName: actor.displayName },
        createdAt: entry.createdAt.toISOString(),
      };
    });
  }

  private async lockBench(manager: EntityManager, benchId: number) {
    const bench = await manager
      .getRepository(BenchEntity)
      .findOne({ where: { id: benchId }, lock: { mode: 'pessimistic_write' } });
    if (!bench) throw notFound('That bench');
    return bench;
  }

  /** Cancels a booking: testers their own, editors any. */
  async cancel(actor: CurrentUser, benchId: number, bookingId: number): Promise<void> {
    await this.dataSource.transaction(async (manager) => {
      const repo = manager.getRepository(BenchBookingEntity);
      const booking = await repo.findOne({ where: { id: bookingId, benchId }, lock: { mode: 'pessimistic_write' } });
      if (!booking) throw notFound('That booking');
      if (actor.role !== 'editor' && booking.testerId !== actor.id)
        throw forbidden('You can cancel only your own bookings.');
      await repo.delete({ id: bookingId });
      await recordAction(manager, actor, 'bench.booking_cancelled', ['bench', benchId], {
        bookingId,
        testerId: booking.testerId,
        startsAt: booking.startsAt.toISOString(),
        endsAt: booking.endsAt.toISOString(),
      });
    });
  }
}
