import { describe, expect, it } from 'vitest';
import { AuditEntryEntity } from '../../../server/entities/audit-entry.entity';
import { signedInTeam, testDataSource, type Client } from '../support/test-app';
import { dayFromToday, matrixOf, moveToBench, plannedRoundup, recordManualRun } from './support/planning-fixtures';

function move(agent: Client, roundupId: number, cellId: number, action: string, note?: string) {
  return agent.post(`/api/roundups/${roundupId}/cells/${cellId}/transitions`).send({
    action,
    ...(note ? { note } : {}),
    ...(action === 'start' ? { overrideReason: startWithoutBooking } : {}),
  });
}

/** These tests are about the matrix's moves, not bench time: starts say why no booking covers them. */
const startWithoutBooking = 'Bench free this morning; booking follows';

async function setUp() {
  const { app, editor, tester, otherTester, writer } = await signedInTeam();
  const roundup = await plannedRoundup(editor.agent, { configurations: 3, products: 2 });
  return { app, editor, tester, otherTester, writer, ...roundup };
}

describe('the test matrix', () => {
  it('is products × configurations; editors assign cells or whole rows with a due date', async () => {
    const { editor, tester, roundupId, entryIds } = await setUp();
    const matrix = await matrixOf(editor.agent, roundupId);
    expect(matrix.rows.map((r) => r.cells.map((c) => c.state))).toEqual([
      ['not-started', 'not-started', 'not-started'],
      ['not-started', 'not-started', 'not-started'],
    ]);
    expect(matrix.progress).toMatchObject({ cellCount: 6, acceptedCount: 0, unassignedCount: 6 });

    const row = await editor.agent
      .post(`/api/roundups/${roundupId}/assignments`)
      .send({ entryIds: [entryIds[0]], testerId: tester.user.id, dueDate: dayFromToday(5) });
    expect(row.status, row.text).toBe(200);
    expect(row.body.cells).toHaveLength(3);
    const single = matrix.rows[1].cells[2].id;
    const one = await editor.agent
      .post(`/api/roundups/${roundupId}/assignments`)
      .send({ cellIds: [single], testerId: tester.user.id, dueDate: dayFromToday(2) });
    expect(one.body.cells).toEqual([
      expect.objectContaining({ id: single, state: 'assigned', dueDate: dayFromToday(2) }),
    ]);
    expect((await matrixOf(editor.agent, roundupId)).progress.unassignedCount).toBe(2);

    const notATester = await editor.agent
      .post(`/api/roundups/${roundupId}/assignments`)
      .send({ cellIds: [single], testerId: editor.user.id, dueDate: dayFromToday(2) });
    expect(notATester.status).toBe(422);
    expect(notATester.body.error.fields.testerId).toBeTruthy();

    const history = await editor.agent.get(`/api/roundups/${roundupId}/history`);
    expect(history.body.entries[0]).toMatchObject({
      action: 'roundup.cells_assigned',
      actor: { id: editor.user.id },
      details: { cellIds: [single], testerId: tester.user.id },
    });
  });

  it('a tester moves their own cells assigned → running → recorded; an editor accepts or sends back', async () => {
    const { editor, tester, otherTester, writer, roundupId, entryIds } = await setUp();
    await editor.agent
      .post(`/api/roundups/${roundupId}/assignments`)
      .send({ entryIds, testerId: tester.user.id, dueDate: dayFromToday(5) });
    const cells = (await matrixOf(editor.agent, roundupId)).rows.flatMap((r) => r.cells);
    const [a, b] = cells;

    // Runs start once the roundup is on the bench.
    const tooEarly = await move(tester.agent, roundupId, a.id, 'start');
    expect(tooEarly.status).toBe(422);
    expect(tooEarly.body.error.code).toBe('roundup_not_on_bench');
    await moveToBench(editor.agent, roundupId);

    // Nobody else moves a tester's cell; an editor does not run it either.
    expect((await move(otherTester.agent, roundupId, a.id, 'start')).status).toBe(403);
    expect((await move(editor.agent, roundupId, a.id, 'start')).status).toBe(403);
    expect((await move(writer.agent, roundupId, a.id, 'start')).status).toBe(403);

    const started = await move(tester.agent, roundupId, a.id, 'start');
    expect(started.status, started.text).toBe(200);
    // No run yet, so "Mark recorded" is not offered.
    expect(started.body).toMatchObject({ state: 'running', runCount: 0, actions: ['pause'] });
    // A tester cannot accept their own work, and nothing is accepted before it is recorded.
    expect((await move(tester.agent, roundupId, a.id, 'accept')).status).toBe(403);
    const notRecorded = await move(editor.agent, roundupId, a.id, 'accept');
    expect(notRecorded.status).toBe(422);
    expect(notRecorded.body.error.message).toMatch(/Recorded; this one is Running/);

    // “Mark recorded” needs a run behind it.
    const noRun = await move(tester.agent, roundupId, a.id, 'record');
    expect(noRun.status).toBe(409);
    expect(noRun.body.error.code).toBe('no_run');
    await recordManualRun(tester.agent, a.id);
    const withRun = (await matrixOf(tester.agent, roundupId)).rows.flatMap((r) => r.cells).find((c) => c.id === a.id);
    expect(withRun).toMatchObject({ runCount: 1, actions: ['pause', 'record'] });
    expect((await move(tester.agent, roundupId, a.id, 'record')).body.state).toBe('recorded');
    const accepted = await move(editor.agent, roundupId, a.id, 'accept');
    expect(accepted.body.state).toBe('accepted');

    // Send back needs a reason; the cell goes to needs retest and back into the tester's queue.
    expect((await move(editor.agent, roundupId, a.id, 'send-back')).status).toBe(400);
    const back = await move(editor.agent, roundupId, a.id, 'send-back', 'Ambient drifted 2 °C during the soak');
    expect(back.body).toMatchObject({ state: 'needs-retest', note: 'Ambient drifted 2 °C during the soak' });
    expect((await move(tester.agent, roundupId, a.id, 'start')).body.state).toBe('running');

    // The editor may unassign a cell that has not started, not one that is running.
    expect((await move(editor.agent, roundupId, b.id, 'unassign')).body).toMatchObject({
      state: 'not-started',
      tester: null,
    });
    expect((await move(editor.agent, roundupId, a.id, 'unassign')).status).toBe(422);

    const moves = await (await testDataSource()).getRepository(AuditEntryEntity).find({
      where: { subjectType: 'roundup', subjectId: String(roundupId), action: 'roundup.cell_moved' },
      order: { id: 'ASC' },
    });
    expect(moves.map((m) => [m.details?.action, m.details?.from, m.details?.to])).toEqual([
      ['start', 'assigned', 'running'],
      ['record', 'running', 'recorded'],
      ['accept', 'recorded', 'accepted'],
      ['send-back', 'accepted', 'needs-retest'],
      ['start', 'needs-retest', 'running'],
      ['unassign', 'assigned', 'not-started'],
    ]);
  });

  it('nobody jumps from not started to accepted, and a running cell cannot be reassigned', async () => {
    const { editor, tester, otherTester, roundupId, entryIds } = await setUp();
    await moveToBench(editor.agent, roundupId);
    const [cell] = (await matrixOf(editor.agent, roundupId)).rows[0].cells;
    for (const action of ['accept', 'record', 'send-back']) {
      const response = await move(editor.agent, roundupId, cell.id, action, 'reason');
      expect([403, 422], `${action} from not started`).toContain(response.status);
    }
    expect((await move(tester.agent, roundupId, cell.id, 'start')).status).toBe(403);
    await editor.agent
      .post(`/api/roundups/${roundupId}/assignments`)
      .send({ entryIds, testerId: tester.user.id, dueDate: dayFromToday(1) });
    await move(tester.agent, roundupId, cell.id, 'start');
    const reassign = await editor.agent
      .post(`/api/roundups/${roundupId}/assignments`)
      .send({ cellIds: [cell.id], testerId: otherTester.user.id, dueDate: dayFromToday(1) });
    expect(reassign.status).toBe(422);
    expect(reassign.body.error.code).toBe('cell_not_assignable');
    // A whole row skips the running cell and takes the others.
    const row = await editor.agent
      .post(`/api/roundups/${roundupId}/assignments`)
      .send({ entryIds: [entryIds[0]], testerId: otherTester.user.id, dueDate: dayFromToday(1) });
    expect(row.body.cells.map((c: { id: number }) => c.id)).not.toContain(cell.id);
    expect(row.body.cells).toHaveLength(2);
  });

  it('“my bench” lists a tester’s own open cells by due date, and recorded ones apart', async () => {
    const { editor, tester, otherTester, roundupId } = await setUp();
    await moveToBench(editor.agent, roundupId);
    const rows = (await matrixOf(editor.agent, roundupId)).rows;
    const assign = (cellIds: number[], who: number, dueDate: string) =>
      editor.agent.post(`/api/roundups/${roundupId}/assignments`).send({ cellIds, testerId: who, dueDate });
    await assign([rows[0].cells[0].id], tester.user.id, dayFromToday(9));
    await assign([rows[0].cells[1].id], tester.user.id, dayFromToday(2));
    await assign([rows[1].cells[0].id], tester.user.id, dayFromToday(-1));
    await assign([rows[1].cells[1].id], tester.user.id, dayFromToday(4));
    await assign([rows[1].cells[2].id], otherTester.user.id, dayFromToday(1));
    await move(tester.agent, roundupId, rows[1].cells[1].id, 'start');
    await recordManualRun(tester.agent, rows[1].cells[1].id);
    await move(tester.agent, roundupId, rows[1].cells[1].id, 'record');

    const mine = await tester.agent.get('/api/my-bench');
    expect(mine.status, mine.text).toBe(200);
    const queue = mine.body.queue as { cell: { id: number; dueDate: string; overdue: boolean } }[];
    expect(queue.map((q) => q.cell.id)).toEqual([rows[1].cells[0].id, rows[0].cells[1].id, rows[0].cells[0].id]);
    expect(queue.map((q) => q.cell.overdue)).toEqual([true, false, false]);
    expect(mine.body.awaitingReview.map((q: { cell: { id: number } }) => q.cell.id)).toEqual([rows[1].cells[1].id]);
    expect(mine.body.queue[0]).toMatchObject({
      roundup: { id: roundupId },
      loadConfiguration: { name: expect.any(String) },
    });

    const dashboard = await tester.agent.get('/api/dashboard');
    expect(dashboard.body.view).toBe('tester');
    expect(dashboard.body.queue).toHaveLength(3);
  });
});
