// Matrix cells listed outside the matrix (queues, bookable cells), each with its roundup, product and
// load configuration.
import type { EntityManager } from 'typeorm';
import { LoadConfigurationEntity } from '../entities/load-configuration.entity';
import type { MatrixCellEntity } from '../entities/matrix-cell.entity';
import { RoundupEntryEntity } from '../entities/roundup-entry.entity';
import { RoundupEntity } from '../entities/roundup.entity';
import { cellDtoFacts, toMatrixCellDto } from './matrix-cell';
import { entriesWithProducts } from './product-fields';
import { rowsById } from '../lib/rows-by-id';
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
  const roundupById = await rowsById(manager, RoundupEntity, cells, (c) => c.roundupId);
  const { entryById, products } = await entriesWithProducts(manager, cells, (c) => c.entryId);
  const configById = await rowsById(manager, LoadConfigurationEntity, cells, (c) => c.loadConfigurationId, {
    id: true,
    name: true,
  });
  const { people, runFacts } = await cellDtoFacts(manager, cells);
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
