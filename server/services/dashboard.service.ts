import { type DataSource } from 'typeorm';
import { RoundupEntity } from '../entities/roundup.entity';
import type { MyBenchService } from './my-bench.service';
import { roundupSummaries } from '../mappers/roundup';
import { samplesOfRoundups } from '../mappers/sample';
import { roundupStates } from '../../shared/domain/planning/roundup-states';
import type { CurrentUser } from '../../shared/schemas/auth';
import type { Dashboard } from '../../shared/schemas/dashboard';

/** The home page per role: editors steer, testers see their work, everyone else sees where roundups stand. */
export class DashboardService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly myBench: MyBenchService,
  ) {}

  async forUser(user: CurrentUser): Promise<Dashboard> {
    if (user.role === 'tester') return { view: 'tester', ...(await this.myBench.forUser(user)) };
    const manager = this.dataSource.manager;
    const now = new Date();
    const roundups = await manager
      .getRepository(RoundupEntity)
      .find({ order: { targetPublishDate: 'ASC', id: 'ASC' } });
    const summaries = await roundupSummaries(manager, roundups, now);
    const roundupsByState = roundupStates.map((state) => ({
      state,
      roundups: summaries.filter((r) => r.state === state),
    }));
    if (user.role !== 'editor') return { view: 'overview', roundupsByState };
    const open = roundups.filter((r) => r.state === 'planning' || r.state === 'on-the-bench');
    const titleById = new Map(roundups.map((r) => [r.id, r.title]));
    const overdueSamples = (await samplesOfRoundups(manager, roundups, now, { onlyOpenLoans: true }))
      .filter((sample) => sample.overdue)
      .sort((a, b) => b.daysOverdue - a.daysOverdue)
      .map((sample) => ({ ...sample, roundupTitle: titleById.get(sample.roundupId) ?? '' }));
    const unassignedCells = summaries
      .filter((s) => open.some((r) => r.id === s.id) && s.progress.unassignedCount > 0)
      .map((s) => ({ roundupId: s.id, title: s.title, unassignedCount: s.progress.unassignedCount }));
    return { view: 'editor', roundupsByState, overdueSamples, unassignedCells };
  }
}
