import { describe, expect, it } from 'vitest';
import { UserEntity } from '../../server/entities/user.entity';
import { roles } from '../../shared/schemas/common';
import { createTestUser, signedIn, signedInTeam, testApp, testDataSource } from './support/test-app';
import { assignCells, dayFromToday, recordManualRun, roundupOnTheBench } from './planning/support/planning-fixtures';

/**
 * Rules about whose object it is, beyond the role × route matrix (route-access.test.ts): the routes admit the
 * role, the services decide on the object.
 */

async function twoTestersWithRuns() {
  const { app, editor, tester, otherTester, writer } = await signedInTeam();
  const { roundupId, matrix } = await roundupOnTheBench(editor.agent, { configurations: 1, products: 2 });
  const [mine, theirs] = matrix.rows.map((row) => row.cells[0].id);
  await assignCells(editor.agent, roundupId, { cellIds: [mine] }, tester.user.id, dayFromToday(3));
  await assignCells(editor.agent, roundupId, { cellIds: [theirs] }, otherTester.user.id, dayFromToday(3));
  const myRun = await recordManualRun(tester.agent, mine);
  const theirRun = await recordManualRun(otherTester.agent, theirs);
  return { app, editor, tester, otherTester, writer, roundupId, mine, theirs, myRun, theirRun };
}

describe('a tester and another tester’s runs', () => {
  it('a tester reads their own runs but not another tester’s: run, cell list and logger file are refused', async () => {
    const { tester, theirs, myRun, theirRun, mine } = await twoTestersWithRuns();
    expect((await tester.agent.get(`/api/runs/${myRun.id}`)).status).toBe(200);
    expect((await tester.agent.get(`/api/cells/${mine}/runs`)).status).toBe(200);
    const run = await tester.agent.get(`/api/runs/${theirRun.id}`);
    expect(run.status).toBe(403);
    expect(run.body.error).toMatchObject({ code: 'forbidden', message: expect.stringMatching(/another tester/) });
    expect((await tester.agent.get(`/api/cells/${theirs}/runs`)).status).toBe(403);
    // A manual run has no logger file: the refusal comes before the 404, so nothing tells whether one exists.
    expect((await tester.agent.get(`/api/runs/${theirRun.id}/logger-file`)).status).toBe(403);
  });

  it('a tester cannot add runs to, re-analyse or review another tester’s work, and nothing changes', async () => {
    const { tester, otherTester, theirs, theirRun } = await twoTestersWithRuns();
    const before = (await otherTester.agent.get(`/api/cells/${theirs}/runs`)).body;
    const attempts = [
      tester.agent.post(`/api/cells/${theirs}/manual-runs`).send({
        firmwareVersion: 'F9.9',
        startedAt: new Date().toISOString(),
        manualPeakC: 50,
        manualAmbientC: 21,
        outsideBookingReason: 'Trying to add to someone else’s cell.',
      }),
      tester.agent.post(`/api/runs/${theirRun.id}/analyses`).send({}),
      tester.agent.post(`/api/runs/${theirRun.id}/review`).send({ decision: 'accept', reason: 'looks fine' }),
      tester.agent.post(`/api/runs/${theirRun.id}/run-of-record`),
    ];
    for (const response of await Promise.all(attempts)) expect(response.status, response.text).toBe(403);
    expect((await otherTester.agent.get(`/api/cells/${theirs}/runs`)).body).toEqual(before);
  });

  it('editors and writers read every tester’s runs', async () => {
    const { editor, writer, theirRun, myRun } = await twoTestersWithRuns();
    for (const agent of [editor.agent, writer.agent]) {
      expect((await agent.get(`/api/runs/${theirRun.id}`)).status).toBe(200);
      expect((await agent.get(`/api/runs/${myRun.id}`)).status).toBe(200);
    }
  });
});

describe('a writer and the editors’ decisions', () => {
  it('a writer cannot review a run, mark the run of record, set the rubric or move a roundup’s state', async () => {
    const { writer, editor, theirRun, roundupId } = await twoTestersWithRuns();
    const before = (await editor.agent.get(`/api/roundups/${roundupId}`)).body;
    const attempts = [
      writer.agent.post(`/api/runs/${theirRun.id}/review`).send({ decision: 'accept', reason: 'approved by me' }),
      writer.agent.post(`/api/runs/${theirRun.id}/run-of-record`),
      writer.agent.put(`/api/roundups/${roundupId}/rubric`).send({ rubric: null }),
      writer.agent.post(`/api/roundups/${roundupId}/state`).send({ to: 'writing' }),
      writer.agent.patch(`/api/roundups/${roundupId}`).send({ title: 'Renamed by a writer' }),
    ];
    for (const response of await Promise.all(attempts)) expect(response.status, response.text).toBe(403);
    expect((await editor.agent.get(`/api/roundups/${roundupId}`)).body).toEqual(before);
    expect((await editor.agent.get(`/api/runs/${theirRun.id}`)).body.reviewState).not.toBe('accepted');
  });
});

describe('staff accounts', () => {
  it('nobody but an admin adds users, changes a role or deactivates anyone — themselves included', async () => {
    const app = await testApp();
    const target = await createTestUser('writer');
    const users = (await testDataSource()).getRepository(UserEntity);
    const before = await users.findOneByOrFail({ id: target.id });
    for (const role of roles.filter((r) => r !== 'admin')) {
      const { agent, user } = await signedIn(app, role);
      const refused = [
        await agent.get('/api/users'),
        await agent.post('/api/users').send({
          email: `made-by-${role}@test.soaksheet.example`,
          displayName: 'Made',
          role: 'admin',
          password: 'x'.repeat(16),
        }),
        await agent.patch(`/api/users/${target.id}`).send({ role: 'admin' }),
        await agent.patch(`/api/users/${target.id}`).send({ active: false }),
        await agent.patch(`/api/users/${user.id}`).send({ role: 'admin' }),
      ];
      for (const response of refused) expect(response.status, `${role}: ${response.text}`).toBe(403);
      expect((await users.findOneByOrFail({ id: user.id })).role).toBe(role);
      expect(await users.countBy({ email: `made-by-${role}@test.soaksheet.example` })).toBe(0);
    }
    const after = await users.findOneByOrFail({ id: target.id });
    expect({ role: after.role, active: after.active }).toEqual({ role: before.role, active: before.active });
  });

  it('when an account is deactivated behind the app’s back, then its open session is refused on the next request', async () => {
    const app = await testApp();
    const { agent, user } = await signedIn(app, 'editor');
    expect((await agent.get('/api/roundups')).status).toBe(200);
    // Straight in the database, so the session row stays: the refusal must come from the check on each request.
    await (await testDataSource()).getRepository(UserEntity).update({ id: user.id }, { active: false });
    const next = await agent.get('/api/roundups');
    expect(next.status).toBe(401);
    expect(next.body.error.code).toBe('unauthenticated');
    expect((await agent.post('/api/roundups').send({})).status).toBe(401);
  });
});
