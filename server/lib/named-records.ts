import type {
  DataSource,
  EntityManager,
  EntityTarget,
  FindOptionsOrder,
  FindOptionsWhere,
  ObjectLiteral,
  QueryDeepPartialEntity,
} from 'typeorm';
import { conflict, notFound } from '../errors';
import { recordAction } from '../services/audit.service';
import { archivedWhere, refusingDuplicates } from './database-errors';
import { fieldChanges, type FieldChanges } from './field-changes';
import type { CurrentUser } from '../../shared/schemas/auth';

/** What one edit of a record writes: the columns to set and, for the audit log, each field's value before and after. */
export interface RecordEdit<E> {
  patch: QueryDeepPartialEntity<E>;
  changes: FieldChanges;
  /** Runs in the same transaction after a change was written and audited (for example the history of roundups). */
  afterChange?: (manager: EntityManager) => Promise<void>;
}

/**
 * Staff records with a unique name (benches, bench profiles, load configurations): created and edited in one
 * transaction with an audit entry `<subject>.created` / `<subject>.updated`; a name another record already has is
 * refused with a 409 that names the field.
 */
export class NamedRecords<E extends ObjectLiteral & { id: number }> {
  constructor(
    protected readonly dataSource: DataSource,
    protected readonly entity: EntityTarget<E>,
    /** The audit subject type, e.g. `bench_profile`. */
    private readonly subject: string,
    /** The record in words, e.g. `bench profile`. */
    private readonly label: string,
  ) {}

  nameTaken(): Error {
    const message = `Another ${this.label} already has this name.`;
    return conflict('name_taken', message, { name: message });
  }

  notFound(): Error {
    return notFound(`That ${this.label}`);
  }

  /** Inserts `row` after `check` passes, audits it with `details`, and returns what `read` makes of the new id. */
  createAudited<T>(
    actor: CurrentUser,
    row: QueryDeepPartialEntity<E>,
    details: Record<string, unknown>,
    read: (id: number, manager: EntityManager) => Promise<T>,
    check?: (manager: EntityManager) => Promise<void>,
  ): Promise<T> {
    return refusingDuplicates(
      () =>
        this.dataSource.transaction(async (manager) => {
          await check?.(manager);
          const { identifiers } = await manager.getRepository(this.entity).insert(row);
          const id = Number(identifiers[0].id);
          await recordAction(manager, actor, `${this.subject}.created`, [this.subject, id], details);
          return read(id, manager);
        }),
      () => this.nameTaken(),
    );
  }

  /**
   * Locks the record, lets `edit` work out what changes, and writes and audits it when anything does; returns what
   * `read` makes of the record afterwards.
   */
  updateAudited<T>(
    actor: CurrentUser,
    id: number,
    edit: (current: E, manager: EntityManager) => Promise<RecordEdit<E>> | RecordEdit<E>,
    read: (id: number, manager: EntityManager) => Promise<T>,
  ): Promise<T> {
    return refusingDuplicates(
      () =>
        this.dataSource.transaction(async (manager) => {
          const repo = manager.getRepository(this.entity);
          const current = await repo.findOne({
            where: { id } as FindOptionsWhere<E>,
            lock: { mode: 'pessimistic_write' },
          });
          if (!current) throw this.notFound();
          const { patch, changes, afterChange } = await edit(current, manager);
          if (Object.keys(patch).length > 0) {
            await repo.update({ id } as FindOptionsWhere<E>, patch);
            await recordAction(manager, actor, `${this.subject}.updated`, [this.subject, id], changes);
            await afterChange?.(manager);
          }
          return read(id, manager);
        }),
      () => this.nameTaken(),
    );
  }
}

/** What sets one kind of archivable record apart: its table, its words, how staff see it and which fields they edit. */
export interface ArchivableKind<E, Dto> {
  entity: EntityTarget<E>;
  /** The audit subject type, e.g. `bench_profile`. */
  subject: string;
  /** The record in words, e.g. `bench profile`. */
  label: string;
  toDto: (row: E, roundupCount: number) => Dto;
  roundupCounts: (manager: EntityManager, ids: number[]) => Promise<Map<number, number>>;
  /** The fields staff edit, in the order the audit log lists their changes. */
  fields: readonly (keyof Dto & string)[];
  /** The fields kept as DECIMAL, with their scale: written as text with that many decimals. */
  decimalScales: Partial<Record<keyof Dto & string, number>>;
}

/**
 * Named records staff archive instead of deleting (bench profiles, load configurations), each shown with the number
 * of roundups that use it. Their services extend this class.
 */
export abstract class ArchivableNamedRecords<
  E extends ObjectLiteral & { id: number; name: string; archivedAt: Date | null },
  Dto extends { archived: boolean },
> extends NamedRecords<E> {
  private readonly kind: ArchivableKind<E, Dto>;

  constructor(dataSource: DataSource, kind: ArchivableKind<E, Dto>) {
    super(dataSource, kind.entity, kind.subject, kind.label);
    this.kind = kind;
  }

  /** Every record by name, hiding, including or showing only the archived ones. */
  async list(query: { archived: 'exclude' | 'include' | 'only' }): Promise<Dto[]> {
    const manager = this.dataSource.manager;
    const rows = await manager.getRepository(this.entity).find({
      where: archivedWhere(query.archived) as FindOptionsWhere<E>,
      order: { name: 'ASC' } as FindOptionsOrder<E>,
    });
    const counts = await this.kind.roundupCounts(
      manager,
      rows.map((row) => row.id),
    );
    return rows.map((row) => this.kind.toDto(row, counts.get(row.id) ?? 0));
  }

  async get(id: number, manager: EntityManager = this.dataSource.manager): Promise<Dto> {
    const row = await manager.getRepository(this.entity).findOneBy({ id } as FindOptionsWhere<E>);
    if (!row) throw this.notFound();
    return this.kind.toDto(row, (await this.kind.roundupCounts(manager, [id])).get(id) ?? 0);
  }

  /** The columns for the edited fields `values` sets, decimals as text with their stored scale. */
  private columns(values: Partial<Record<string, unknown>>): QueryDeepPartialEntity<E> {
    const columns: Record<string, unknown> = {};
    for (const field of this.kind.fields) {
      const value = values[field];
      if (value === undefined) continue;
      const scale = this.kind.decimalScales[field];
      columns[field] = scale !== undefined && typeof value === 'number' ? value.toFixed(scale) : value;
    }
    return columns as QueryDeepPartialEntity<E>;
  }

  /** Creates a record from the fields of the form (`fixed` overrides some), audits it with its name, returns it. */
  protected createFromInput(
    actor: CurrentUser,
    input: { name: string },
    fixed: QueryDeepPartialEntity<E> = {},
  ): Promise<Dto> {
    const row = { ...this.columns(input), ...fixed, createdBy: actor.id } as QueryDeepPartialEntity<E>;
    return this.createAudited(actor, row, { name: input.name }, (id, manager) => this.get(id, manager));
  }

  /**
   * Edits a record with the fields `input` sets; `settle` may check or adjust the record as it would be afterwards
   * (the merged values). `archived` archives or restores it; `afterChange` runs in the same transaction when anything
   * changed.
   */
  protected updateFromInput(
    actor: CurrentUser,
    id: number,
    input: { archived?: boolean },
    afterChange: (manager: EntityManager, changes: FieldChanges) => Promise<void>,
    settle: (merged: Dto) => void = () => {},
  ): Promise<Dto> {
    return this.updateAudited(
      actor,
      id,
      (current) => {
        const before = this.kind.toDto(current, 0);
        const set = Object.fromEntries(Object.entries(input).filter(([, value]) => value !== undefined));
        const merged = { ...before, ...set } as Dto;
        settle(merged);
        const changes = fieldChanges(before, merged, this.kind.fields);
        const patch = this.columns(
          Object.fromEntries(Object.keys(changes).map((key) => [key, merged[key as keyof Dto]])),
        );
        if (input.archived !== undefined && input.archived !== before.archived) {
          (patch as { archivedAt?: Date | null }).archivedAt = input.archived ? new Date() : null;
          changes.archived = { from: before.archived, to: input.archived };
        }
        return { patch, changes, afterChange: (manager: EntityManager) => afterChange(manager, changes) };
      },
      (recordId, manager) => this.get(recordId, manager),
    );
  }
}
