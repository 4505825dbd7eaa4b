import { describe, expect, it } from 'vitest';
import { AuditEntryEntity } from '../../../server/entities/audit-entry.entity';
import { BenchBookingEntity } from '../../../server/entities/bench-booking.entity';
import { signedInTeam, testDataSource, type Client } from '../support/test-app';
import {
  assignCells,
  createBench,
  createBenchProfile,
  dayFromToday,
  roundupOnTheBench,
  tag,
} from './support/planning-fixtures';

/** An hour slot `hoursAhead` from a whole hour tomorrow, as ISO instants. */
function slot(hoursAhead: number, hours = 1) {
  const base = Date.parse(`${dayFromToday(1)}T08:00:00.000Z`);
  return {
    startsAt: new Date(base + hoursAhead * 3_600_000).toISOString(),
    endsAt: new Date(base + (hoursAhead + hours) * 3_600_000).toISOString(),
  };
}

async function setUp() {
  const { app, editor, tester, otherTester } = await signedInTeam();
  const { roundupId, entryIds, matrix } = await roundupOnTheBench(editor.agent, { configurations: 2 });
  const cells = matrix.rows[0].cells;
  await assignCells(editor.agent, roundupId, { cellIds: [cells[0].id] }, tester.user.id, dayFromToday(3));
  await assignCells(editor.agent, roundupId, { cellIds: [cells[1].id] }, otherTester.user.id, dayFromToday(3));
  const benchId = await createBench(editor.agent);
  return { app, editor, tester, otherTester, roundupId, entryId: entryIds[0], cells, benchId };
}

function book(agent: Client, benchId: number, body: Record<string, unknown>) {
  return agent.post(`/api/benches/${benchId}/bookings`).send(body);
}

/**
 * Waits until `count` statements on bench tables have been waiting for at least 100 ms (they are blocked on a
 * row lock), or 10 s have passed.
 */
async function waitForBlockedBenchStatements(count: number) {
  const ds = await testDataSource();
  const deadline = Date.now() + 10_000;
  while (Date.now() < deadline) {
    const [row] = await ds.query(
      "SELECT COUNT(*) AS n FROM information_schema.PROCESSLIST WHERE COMMAND = 'Query' AND TIME_MS >= 100 AND INFO LIKE '%bench%'",
    );
    if (Number(row.n) >= count) return;
    await new Promise((resolve) => setTimeout(resolve, 20));
  }
}

describe('bench booking', () => {
  it('when two testers ask for overlapping slots at the same moment, then exactly one booking is made', async () => {
    const { tester, otherTester, cells, benchId } = await setUp();
    // Make the race certain rather than lucky: hold both testers' user rows locked from outside, so each
    // request's INSERT (whose foreign-key check needs that row) waits inside its transaction. Without the bench
    // row lock both requests would pass the overlap check, wait here, and then both commit. With it, the
    // second request waits on the bench row until the first commits, then sees the first booking.
    const ds = await testDataSource();
    const blocker = ds.createQueryRunner();
    await blocker.connect();
    await blocker.startTransaction();
    let responses: Awaited<ReturnType<typeof book>>[];
    try {
      await blocker.query('SELECT id FROM users WHERE id IN (?, ?) FOR UPDATE', [tester.user.id, otherTester.user.id]);
      const inFlight = Promise.all([
        book(tester.agent, benchId, { ...slot(0, 2), cellIds: [cells[0].id] }),
        book(otherTester.agent, benchId, { ...slot(1, 2), cellIds: [cells[1].id] }),
      ]);
      await waitForBlockedBenchStatements(2);
      await blocker.commitTransaction();
      responses = await inFlight;
    } finally {
      if (blocker.isTransactionActive) await blocker.rollbackTransaction();
      await blocker.release();
    }
    const [first, second] = responses;
    expect([first.status, second.status].sort()).toEqual([201, 409]);
    const refused = first.status === 409 ? first : second;
    expect(refused.body.error.code).toBe('booking_overlap');
    expect(refused.body.error.message).toMatch(
      /is already booked .* UTC by Test tester .*, which overlaps .* Choose another time or bench\./,
    );
    expect(await ds.getRepository(BenchBookingEntity).countBy({ benchId })).toBe(1);
  });

  it('many simultaneous requests for the same slot still leave a single booking', async () => {
    const { tester, cells, benchId } = await setUp();
    const responses = await Promise.all(
      Array.from({ length: 6 }, () => book(tester.agent, benchId, { ...slot(4), cellIds: [cells[0].id] })),
    );
    expect(responses.filter((r) => r.status === 201)).toHaveLength(1);
    expect(responses.filter((r) => r.status === 409)).toHaveLength(5);
    expect(await (await testDataSource()).getRepository(BenchBookingEntity).countBy({ benchId })).toBe(1);
  });

  it('slots that only touch are fine; an overlap, someone else’s cells or an unassigned cell are refused', async () => {
    const { editor, tester, otherTester, cells, benchId, roundupId } = await setUp();
    expect((await book(tester.agent, benchId, { ...slot(0), cellIds: [cells[0].id] })).status).toBe(201);
    // [09:00, 10:00) after [08:00, 09:00): touching, not overlapping (first principles, half-open intervals).
    expect((await book(otherTester.agent, benchId, { ...slot(1), cellIds: [cells[1].id] })).status).toBe(201);
    const overlap = await book(tester.agent, benchId, { ...slot(0.5), cellIds: [cells[0].id] });
    expect(overlap.status).toBe(409);
    expect((await book(tester.agent, benchId, { ...slot(5), cellIds: [cells[1].id] })).status).toBe(403);
    await editor.agent.post(`/api/roundups/${roundupId}/cells/${cells[0].id}/transitions`).send({ action: 'unassign' });
    expect((await book(tester.agent, benchId, { ...slot(6), cellIds: [cells[0].id] })).status).toBe(403);
    const backwards = await book(tester.agent, benchId, {
      startsAt: slot(3).endsAt,
      endsAt: slot(3).startsAt,
      cellIds: [cells[0].id],
    });
    expect(backwards.status).toBe(400);
    expect(backwards.body.error.fields.endsAt).toMatch(/end after it starts/);
  });

  it('a booking accepts times with an explicit zone and answers in UTC; testers cancel only their own', async () => {
    const { editor, tester, otherTester, cells, benchId } = await setUp();
    const day = dayFromToday(2);
    const made = await book(tester.agent, benchId, {
      startsAt: `${day}T10:00:00+02:00`,
      endsAt: `${day}T12:30:00+02:00`,
      cellIds: [cells[0].id],
      note: 'Soak both configurations',
    });
    expect(made.status, made.text).toBe(201);
    expect(made.body).toMatchObject({
      startsAt: `${day}T08:00:00.000Z`,
      endsAt: `${day}T10:30:00.000Z`,
      cancellable: true,
    });
    expect(made.body.cells[0].cell.id).toBe(cells[0].id);

    const calendar = await otherTester.agent.get(
      `/api/benches/${benchId}/bookings?from=${day}T00:00:00Z&to=${dayFromToday(3)}T00:00:00Z`,
    );
    expect(calendar.body.bookings).toEqual([expect.objectContaining({ id: made.body.id, cancellable: false })]);
    expect((await otherTester.agent.delete(`/api/benches/${benchId}/bookings/${made.body.id}`)).status).toBe(403);
    const mine = await tester.agent.get('/api/my-bench');
    expect(mine.body.upcomingBookings.map((b: { id: number }) => b.id)).toEqual([made.body.id]);
    expect((await editor.agent.delete(`/api/benches/${benchId}/bookings/${made.body.id}`)).status).toBe(204);
  });

  it('a cell runs on one bench at a time: the same cell on a second bench at an overlapping time is refused', async () => {
    const { editor, tester, cells, benchId } = await setUp();
    const second = await editor.agent.post('/api/benches').send({ name: `Bench ${tag()}` });
    expect(second.status, second.text).toBe(201);
    const first = await book(tester.agent, benchId, { ...slot(0, 2), cellIds: [cells[0].id] });
    expect(first.status, first.text).toBe(201);

    // [09:00, 11:00) on the other bench overlaps [08:00, 10:00) by an hour.
    const twice = await book(tester.agent, second.body.id, { ...slot(1, 2), cellIds: [cells[0].id] });
    expect(twice.status).toBe(409);
    expect(twice.body.error.code).toBe('cell_already_booked');
    expect(twice.body.error.message).toMatch(
      /is already booked on Bench .* UTC, which overlaps .* one bench at a time/,
    );
    expect(twice.body.error.fields.cellIds).toMatch(/already booked on Bench/);
    // Touching is fine (half-open intervals, first principles): [10:00, 11:00) after [08:00, 10:00).
    expect((await book(tester.agent, second.body.id, { ...slot(2), cellIds: [cells[0].id] })).status).toBe(201);
  });

  it('simultaneous bookings of one cell on two benches leave a single booking of it', async () => {
    const { editor, tester, cells, benchId } = await setUp();
    const second = await editor.agent.post('/api/benches').send({ name: `Bench ${tag()}` });
    const responses = await Promise.all(
      [benchId, second.body.id, benchId, second.body.id].map((id) =>
        book(tester.agent, id, { ...slot(3, 2), cellIds: [cells[0].id] }),
      ),
    );
    expect(responses.filter((r) => r.status === 201)).toHaveLength(1);
    expect(responses.filter((r) => r.status === 409)).toHaveLength(3);
    const [row] = await (
      await testDataSource()
    ).query('SELECT COUNT(*) AS n FROM bench_booking_cells WHERE matrix_cell_id = ?', [cells[0].id]);
    expect(Number(row.n)).toBe(1);
  });
});

describe('the bench and the plan agree', () => {
  async function benchBuiltTo(editor: Client, benchProfileId: number) {
    const response = await editor.post('/api/benches').send({ name: `Bench ${tag()}`, benchProfileId });
    expect(response.status, response.text).toBe(201);
    return response.body.id as number;
  }

  it('booking a bench set up differently from the roundup’s profile warns first, and books with a reason', async () => {
    const { editor, tester, cells } = await setUp();
    const warm = await benchBuiltTo(
      editor.agent,
      await createBenchProfile(editor.agent, { roomTempTargetC: 24, cooler: 'Tidewell 240 liquid cooler' }),
    );
    const warned = await book(tester.agent, warm, { ...slot(0), cellIds: [cells[0].id] });
    expect(warned.status).toBe(409);
    expect(warned.body.error.code).toBe('bench_profile_mismatch');
    expect(warned.body.error.message).toContain('room target 24.0 °C here, 21.0 °C in');
    expect(warned.body.error.message).toContain('cooler Tidewell 240 liquid cooler here, Quillon Arctide 360');
    expect(warned.body.error.fields.overrideReason).toBeTruthy();
    expect(await (await testDataSource()).getRepository(BenchBookingEntity).countBy({ benchId: warm })).toBe(0);

    const reason = 'Bench A is down for a new PSU; room runs warm, results get a note';
    const booked = await book(tester.agent, warm, { ...slot(0), cellIds: [cells[0].id], overrideReason: reason });
    expect(booked.status, booked.text).toBe(201);
    expect(booked.body.overrideReason).toBe(reason);
    const audit = await (
      await testDataSource()
    )
      .getRepository(AuditEntryEntity)
      .findOneByOrFail({ action: 'bench.booked', subjectId: String(warm) });
    expect(audit.details).toMatchObject({ bookingId: booked.body.id, overrideReason: reason });
  });

  it('a bench built to the roundup’s profile, or to another with the same set-up, books without a warning', async () => {
    const { editor, tester, cells, roundupId } = await setUp();
    const roundup = await editor.agent.get(`/api/roundups/${roundupId}`);
    const own = await benchBuiltTo(editor.agent, roundup.body.benchProfile.id);
    const same = await benchBuiltTo(editor.agent, await createBenchProfile(editor.agent));
    const first = await book(tester.agent, own, { ...slot(0), cellIds: [cells[0].id] });
    expect(first.status, first.text).toBe(201);
    expect(first.body.overrideReason).toBeNull();
    const second = await book(tester.agent, same, { ...slot(2), cellIds: [cells[0].id], overrideReason: 'not needed' });
    expect(second.status, second.text).toBe(201);
    // A reason where nothing differs is not kept: there is nothing it explains.
    expect(second.body.overrideReason).toBeNull();
  });

  it('starting a run outside every booking of the cell warns the tester; a reason starts it and is kept', async () => {
    const { tester, cells, roundupId, benchId } = await setUp();
    const start = (cellId: number, body: Record<string, unknown> = {}) =>
      tester.agent.post(`/api/roundups/${roundupId}/cells/${cellId}/transitions`).send({ action: 'start', ...body });

    expect((await book(tester.agent, benchId, { ...slot(0), cellIds: [cells[0].id] })).status).toBe(201);
    const warned = await start(cells[0].id);
    expect(warned.status).toBe(409);
    expect(warned.body.error.code).toBe('start_outside_booking');
    expect(warned.body.error.message).toMatch(/No booking of this cell covers now; its next one is Bench .* UTC/);

    const reason = 'Bench free all morning, booked slot is tomorrow';
    const started = await start(cells[0].id, { overrideReason: reason });
    expect(started.status, started.text).toBe(200);
    expect(started.body.state).toBe('running');
    const audit = await (
      await testDataSource()
    )
      .getRepository(AuditEntryEntity)
      .find({ where: { action: 'roundup.cell_moved', subjectId: String(roundupId) } });
    expect(audit.map((entry) => entry.details)).toContainEqual(
      expect.objectContaining({ cellId: cells[0].id, action: 'start', overrideReason: reason }),
    );
  });

  it('starting a run inside a booking of the cell needs no reason', async () => {
    const { tester, cells, roundupId, benchId } = await setUp();
    const now = Date.now();
    const covering = await book(tester.agent, benchId, {
      startsAt: new Date(now - 10 * 60_000).toISOString(),
      endsAt: new Date(now + 60 * 60_000).toISOString(),
      cellIds: [cells[0].id],
    });
    expect(covering.status, covering.text).toBe(201);
    const started = await tester.agent
      .post(`/api/roundups/${roundupId}/cells/${cells[0].id}/transitions`)
      .send({ action: 'start' });
    expect(started.status, started.text).toBe(200);
  });
});
