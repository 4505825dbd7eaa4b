import { signedIn, type TestApp } from '../../support/test-app';
import {
  acceptedCell,
  assignCells,
  dayFromToday,
  moveRoundup,
  roundupOnTheBench,
} from '../../planning/support/planning-fixtures';

/**
 * A roundup taken the product's way to Writing: `products` tested boards, one load configuration, every cell run
 * (manual peaks), recorded and accepted. Returns signed-in editor, writer and tester.
 */
export async function roundupInWriting(app: TestApp, options: { products?: number; peaksC?: number[] } = {}) {
  const editor = await signedIn(app, 'editor');
  const writer = await signedIn(app, 'writer');
  const tester = await signedIn(app, 'tester');
  const { roundupId, entryIds, loadConfigurationIds, matrix } = await roundupOnTheBench(editor.agent, {
    configurations: 1,
    products: options.products ?? 2,
  });
  await assignCells(editor.agent, roundupId, { entryIds }, tester.user.id, dayFromToday(2));
  for (const [index, row] of matrix.rows.entries()) {
    for (const cell of row.cells) {
      await acceptedCell(editor.agent, tester.agent, roundupId, cell.id, options.peaksC?.[index] ?? 70 + index);
    }
  }
  await moveRoundup(editor.agent, roundupId, 'writing');
  return { editor, writer, tester, roundupId, entryIds, loadConfigurationIds };
}
