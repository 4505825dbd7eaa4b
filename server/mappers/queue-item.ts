// Matrix cells listed outside the matrix (queues, bookable cells), each with its roundup, product and
// load configuration.
import { In, type EntityManager } from 'typeorm';
import { LoadConfigurationEntity } from '../entities/load-configuration.entity';
import type { MatrixCellEntity } from '../entities/matrix-cell.entity';
import { RoundupEntryEntity } from '../entities/roundup-entry.entity';
import { RoundupEntity } from '../entities/roundup.entity';
import { runFactsByCell, toMatrixCellDto } from './matrix-cell';
import { loadPeople } from './people';
import { productBriefs } from './product-fields';
import type { CurrentUser } from '../../shared/schemas/auth';
import type { ProductBrief } from '../../shared/schemas/catalog';
import type { QueueItem } from '../../shared/schemas/matrix';

/** Cells with their roundup, product and configuration, for lists outside the matrix. */
export async function queueItems(
  manager: EntityManager,
  cells: MatrixCellEntity[],
  user: CurrentUser,
  now: Date,
): Promise<QueueItem[]> {
  if (cells.length === 0) return [];
  const roundups = await manager
    .getRepository(RoundupEntity)
    .findBy({ id: In([...new Set(cells.map((c) => c.roundupId))]) });
  const roundupById = new Map(roundups.map((r) => [r.id, r]));
  const entries = await manager
    .getRepository(RoundupEntryEntity)
    .findBy({ id: In([...new Set(cells.map((c) => c.entryId))]) });
  const entryById = new Map(entries.map((e) => [e.id, e]));
  const products = await productBriefs(
    manager,
    entries.map((e) => e.productId),
  );
  const configs = await manager.getRepository(LoadConfigurationEntity).find({
    where: { id: In([...new Set(cells.map((c) => c.loadConfigurationId))]) },
    select: { id: true, name: true },
  });
  const configById = new Map(configs.map((c) => [c.id, c]));
  const people = await loadPeople(
    manager,
    cells.map((c) => c.testerId),
  );
  const runFacts = await runFactsByCell(
    manager,
    cells.map((c) => c.id),
  );
  return cells.map((cell) => {
    const roundup = roundupById.get(cell.roundupId) as RoundupEntity;
    const entry = entryById.get(cell.entryId) as RoundupEntryEntity;
    const config = configById.get(cell.loadConfigurationId) as LoadConfigurationEntity;
    return {
      cell: toMatrixCellDto(cell, roundup.timeZone, people, user, now, runFacts),
      roundup: { id: roundup.id, title: roundup.title, state: roundup.state, timeZone: roundup.timeZone },
      product: products.get(entry.productId) as ProductBrief,
      loadConfiguration: { id: config.id, name: config.name },
    };
  });
}
