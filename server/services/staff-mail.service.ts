import { In, type DataSource, type EntityManager } from 'typeorm';
import { MailOptOutEntity } from '../entities/mail.entities';
import { MatrixCellEntity } from '../entities/matrix-cell.entity';
import { RoundupEntity } from '../entities/roundup.entity';
import { SampleEntity } from '../entities/sample.entity';
import { UserEntity } from '../entities/user.entity';
import { LoadConfigurationEntity } from '../entities/load-configuration.entity';
import { entriesWithProducts } from '../mappers/product-fields';
import { rowsById } from '../lib/rows-by-id';
import { enqueueMail } from '../mail/outbox';
import { oneLine } from '../mail/compose';
import { calendarDateIn, daysPast, isLoanOverdue } from '../../shared/domain/planning/loan-overdue';
import { queueStates } from '../../shared/domain/planning/matrix-cell-states';
import { productDisplayName } from '../../shared/domain/planning/product-display-name';
import type { CurrentUser } from '../../shared/schemas/auth';
import {
  staffMailKindLabels,
  staffMailKinds,
  type MailPreferences,
  type StaffMailKind,
} from '../../shared/schemas/subscribers';

const DAY_MS = 86_400_000;

/** The calendar date `days` after a YYYY-MM-DD date. */
function addDays(date: string, days: number): string {
  return new Date(Date.parse(`${date}T00:00:00Z`) + days * DAY_MS).toISOString().slice(0, 10);
}

/**
 * Staff reminders through the outbox. Each reminder's idempotency key names what it is about (the loan and its
 * return date, the day of a digest), so a job that runs every few minutes queues each reminder once. Whether a
 * person still wants a kind is checked when the mail is sent (Account → Mail), so turning it off takes effect at once.
 */
export class StaffMailService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly siteUrl: string,
  ) {}

  async preferences(user: CurrentUser): Promise<MailPreferences> {
    const off = new Set(
      (await this.dataSource.getRepository(MailOptOutEntity).findBy({ userId: user.id })).map((o) => o.kind),
    );
    return {
      kinds: staffMailKinds.map((kind) => ({ kind, label: staffMailKindLabels[kind], enabled: !off.has(kind) })),
    };
  }

  async updatePreferences(user: CurrentUser, disabled: StaffMailKind[]): Promise<MailPreferences> {
    await this.dataSource.transaction(async (manager) => {
      const repo = manager.getRepository(MailOptOutEntity);
      await repo.delete({ userId: user.id });
      const kinds = [...new Set(disabled)];
      if (kinds.length) await repo.insert(kinds.map((kind) => ({ userId: user.id, kind })));
    });
    return this.preferences(user);
  }

  /** A tester's cells were assigned (in the assignment's transaction). */
  static async cellsAssigned(
    manager: EntityManager,
    input: {
      testerId: number;
      roundupId: number;
      cellIds: number[];
      dueDate: string | null;
      at: Date;
      siteUrl?: string;
    },
  ) {
    if (input.cellIds.length === 0) return;
    const roundup = await manager.getRepository(RoundupEntity).findOneByOrFail({ id: input.roundupId });
    const lines = await cellLines(manager, input.cellIds);
    await enqueueMail(manager, {
      key: `cell-assigned:roundup:${input.roundupId}:tester:${input.testerId}:${input.at.getTime()}`,
      kind: 'cell-assigned',
      userId: input.testerId,
      payload: {
        subject: `Assigned to you: ${lines.length} cell${lines.length === 1 ? '' : 's'} in ${oneLine(roundup.title)}`,
        text: [
          `You have ${lines.length === 1 ? 'a new cell' : 'new cells'} to test in “${roundup.title}”${input.dueDate ? `, due ${input.dueDate}` : ''}:`,
          lines.map((l) => `- ${l}`).join('\n'),
          'Open My bench in Benchwire to book a bench and start.',
        ].join('\n\n'),
      },
    });
  }

  /** An editor sent a cell back for a retest (in the move's transaction). */
  static async cellSentBack(
    manager: EntityManager,
    input: { cellId: number; testerId: number | null; roundupId: number; note?: string; at: Date },
  ) {
    if (input.testerId === null) return;
    const roundup = await manager.getRepository(RoundupEntity).findOneByOrFail({ id: input.roundupId });
    const [line] = await cellLines(manager, [input.cellId]);
    await enqueueMail(manager, {
      key: `cell-sent-back:cell:${input.cellId}:${input.at.getTime()}`,
      kind: 'cell-sent-back',
      userId: input.testerId,
      payload: {
        subject: `Sent back for a retest: ${oneLine(line ?? 'a cell')}`,
        text: [
          `An editor sent this cell of “${roundup.title}” back for a retest: ${line ?? ''}`,
          ...(input.note ? [`Their reason: ${input.note}`] : []),
          'Open My bench in Benchwire to plan the retest.',
        ].join('\n\n'),
      },
    });
  }

  /**
   * The periodic scan: vendor loans due back in three days, loans overdue, and the daily digest of overdue cells.
   * Safe to run as often as wanted: every reminder's key repeats for the same loan, date or day.
   */
  async scanReminders(now = new Date()): Promise<number> {
    let queued = 0;
    const manager = this.dataSource.manager;
    const loans = await manager
      .getRepository(SampleEntity)
      .createQueryBuilder('s')
      .where("s.source = 'vendor-loan'")
      .andWhere('s.return_by IS NOT NULL')
      .andWhere("s.status NOT IN ('returned', 'kept')")
      .getMany();
    const editors = await manager.getRepository(UserEntity).findBy({ role: 'editor', active: true });
    if (loans.length) {
      const { entryById, products } = await entriesWithProducts(manager, loans, (l) => l.entryId);
      const roundupById = await rowsById(manager, RoundupEntity, [...entryById.values()], (e) => e.roundupId);
      for (const loan of loans) {
        const entry = entryById.get(loan.entryId);
        const roundup = entry ? roundupById.get(entry.roundupId) : undefined;
        if (!entry || !roundup || !loan.returnBy) continue;
        const product = products.get(entry.productId);
        const name = product ? productDisplayName(product) : 'a sample';
        const today = calendarDateIn(roundup.timeZone, now);
        const recipients = this.roundupEditors(roundup, editors);
        const dueSoon = addDays(today, 3) === loan.returnBy;
        const overdue = isLoanOverdue(loan, roundup.timeZone, now);
        if (!dueSoon && !overdue) continue;
        for (const editor of recipients) {
          const kind: StaffMailKind = overdue ? 'loan-overdue' : 'loan-due-soon';
          const added = await enqueueMail(manager, {
            key: `${kind}:sample:${loan.id}:${loan.returnBy}:user:${editor.id}`,
            kind,
            userId: editor.id,
            payload: overdue
              ? {
                  subject: `Overdue: the ${name} loan was due back ${loan.returnBy}`,
                  text: `The vendor loan of ${name} in “${roundup.title}” was due back on ${loan.returnBy} and is ${daysPast(loan.returnBy, roundup.timeZone, now)} day(s) overdue.${loan.vendorContact ? `\n\nVendor contact: ${loan.vendorContact}` : ''}\n\nMark it returned in the roundup's Samples once it is on its way.`,
                }
              : {
                  subject: `Due back in three days: the ${name} loan (${loan.returnBy})`,
                  text: `The vendor loan of ${name} in “${roundup.title}” is due back on ${loan.returnBy}, three days from now.${loan.vendorContact ? `\n\nVendor contact: ${loan.vendorContact}` : ''}`,
                },
          });
          if (added) queued += 1;
        }
      }
    }
    queued += await this.overdueDigest(now, editors);
    return queued;
  }

  private roundupEditors(roundup: RoundupEntity, editors: UserEntity[]): UserEntity[] {
    const owner = editors.find((e) => e.id === roundup.createdBy);
    return owner ? [owner] : editors;
  }

  /** Once a day per editor: the cells past their due date, when there are any. */
  private async overdueDigest(now: Date, editors: UserEntity[]): Promise<number> {
    const manager = this.dataSource.manager;
    const cells = await manager
      .getRepository(MatrixCellEntity)
      .createQueryBuilder('c')
      .where('c.due_date IS NOT NULL')
      .andWhere('c.state IN (:...states)', { states: [...queueStates] })
      .getMany();
    if (cells.length === 0 || editors.length === 0) return 0;
    const roundupById = await rowsById(manager, RoundupEntity, cells, (c) => c.roundupId);
    const overdue = cells.filter((c) => {
      const roundup = roundupById.get(c.roundupId);
      return (
        roundup &&
        (roundup.state === 'planning' || roundup.state === 'on-the-bench') &&
        calendarDateIn(roundup.timeZone, now) > (c.dueDate as string)
      );
    });
    if (overdue.length === 0) return 0;
    const lines = await cellLines(
      manager,
      overdue.map((c) => c.id),
    );
    const day = now.toISOString().slice(0, 10);
    let queued = 0;
    for (const editor of editors) {
      const added = await enqueueMail(manager, {
        key: `overdue-digest:${day}:user:${editor.id}`,
        kind: 'overdue-digest',
        userId: editor.id,
        payload: {
          subject: `${overdue.length} overdue cell${overdue.length === 1 ? '' : 's'} on ${day}`,
          text: [
            `Cells past their due date:`,
            lines.map((l) => `- ${l}`).join('\n'),
            `Benchwire: ${this.siteUrl}/roundups`,
          ].join('\n\n'),
        },
      });
      if (added) queued += 1;
    }
    return queued;
  }
}

/** "Product · load configuration (due date)" for each cell. */
async function cellLines(manager: EntityManager, cellIds: number[]): Promise<string[]> {
  if (cellIds.length === 0) return [];
  const cells = await manager.getRepository(MatrixCellEntity).findBy({ id: In(cellIds) });
  const { entryById, products } = await entriesWithProducts(manager, cells, (c) => c.entryId);
  const configs = await manager
    .getRepository(LoadConfigurationEntity)
    .findBy({ id: In([...new Set(cells.map((c) => c.loadConfigurationId))]) });
  const configById = new Map(configs.map((c) => [c.id, c.name]));
  return cells.map((cell) => {
    const entry = entryById.get(cell.entryId);
    const product = entry ? products.get(entry.productId) : undefined;
    return `${product ? productDisplayName(product) : 'Product'} · ${configById.get(cell.loadConfigurationId) ?? 'load'}${cell.dueDate ? ` (due ${cell.dueDate})` : ''}`;
  });
}
