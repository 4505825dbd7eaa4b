import type { DataSource } from 'typeorm';
import { ReaderSiteSettingsEntity } from '../entities/reader-site-settings.entity';
import { UserEntity } from '../entities/user.entity';
import { seedPlanning } from './demo-planning';
import { seedStaff } from './demo-staff';
import { seedDemoRuns } from './demo-runs';
import { seedDemoWriteUp } from './demo-write-up';
import { seedDemoEditorial } from './demo-editorial';
import { publishDemoRoundup } from './demo-publication';
import type { FileStore } from '../storage/file-store';

/** Seeds the invented demo outlet once: only into a database that has no users yet. Returns whether it ran. */
export async function seedDemoOnce(dataSource: DataSource, files: FileStore): Promise<boolean> {
  if ((await dataSource.getRepository(UserEntity).count()) > 0) return false;
  await dataSource.transaction(async (manager) => {
    const staff = await seedStaff(manager);
    await seedPlanning(manager, { editor: staff.editor, tester: staff.tester, secondTester: staff.secondTester });
    await manager.getRepository(ReaderSiteSettingsEntity).insert({
      id: 1,
      outletName: 'The Soak Sheet',
      openDataLicence: 'Results and logs by The Soak Sheet, free to reuse with credit and a link to the roundup.',
    });
  });
  // Runs go through the test-run service (its own transactions, the file store), after the plan they hang on.
  await seedDemoRuns(dataSource, files);
  // Photos and the write-up's first drafts for the roundup in Writing, through the same services.
  await seedDemoWriteUp(dataSource, files);
  // Verdicts and approved charts for the flagship roundup, whose results are complete.
  await seedDemoEditorial(dataSource, files);
  // The demo's live roundup gets its publication (frozen data, rendered pages), as the job runner would have made it.
  await publishDemoRoundup(dataSource);
  return true;
}
