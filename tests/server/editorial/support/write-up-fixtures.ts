import { expect } from 'vitest';
import { signedIn, type TestApp } from '../../support/test-app';
import {
  addEntry,
  createProduct,
  createRoundup,
  dayFromToday,
  matrixOf,
  moveToBench,
  recordManualRun,
} from '../../planning/support/planning-fixtures';

/**
 * A roundup taken the product's way to Writing: `products` tested boards, one load configuration, every cell run
 * (manual peaks), recorded and accepted. Returns signed-in editor, writer and tester.
 */
export async function roundupInWriting(app: TestApp, options: { products?: number; peaksC?: number[] } = {}) {
  const editor = await signedIn(app, 'editor');
  const writer = await signedIn(app, 'writer');
  const tester = await signedIn(app, 'tester');
  const { roundupId, platform, loadConfigurationIds } = await createRoundup(editor.agent, { configurations: 1 });
  const entryIds: number[] = [];
  for (let i = 0; i < (options.products ?? 2); i++) {
    const { entry } = await addEntry(editor.agent, roundupId, await createProduct(editor.agent, platform));
    entryIds.push(entry.id);
  }
  await moveToBench(editor.agent, roundupId);
  const assigned = await editor.agent
    .post(`/api/roundups/${roundupId}/assignments`)
    .send({ entryIds, testerId: tester.user.id, dueDate: dayFromToday(2) });
  expect(assigned.status, assigned.text).toBeLessThan(300);
  const matrix = await matrixOf(editor.agent, roundupId);
  for (const [index, row] of matrix.rows.entries()) {
    for (const cell of row.cells) {
      await tester.agent
        .post(`/api/roundups/${roundupId}/cells/${cell.id}/transitions`)
        .send({ action: 'start', overrideReason: 'Bench free this morning; booking follows' });
      await recordManualRun(tester.agent, cell.id, options.peaksC?.[index] ?? 70 + index);
      await tester.agent.post(`/api/roundups/${roundupId}/cells/${cell.id}/transitions`).send({ action: 'record' });
      const accepted = await editor.agent
        .post(`/api/roundups/${roundupId}/cells/${cell.id}/transitions`)
        .send({ action: 'accept' });
      expect(accepted.status, accepted.text).toBe(200);
    }
  }
  const writing = await editor.agent.post(`/api/roundups/${roundupId}/state`).send({ to: 'writing' });
  expect(writing.status, writing.text).toBe(200);
  return { editor, writer, tester, roundupId, entryIds, loadConfigurationIds };
}
