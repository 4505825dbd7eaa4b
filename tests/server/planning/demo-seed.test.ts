import { describe, expect, it } from 'vitest';
import { In, MoreThan } from 'typeorm';
import { BenchBookingEntity } from '../../../server/entities/bench-booking.entity';
import { BenchEntity } from '../../../server/entities/bench.entity';
import { MatrixCellEntity } from '../../../server/entities/matrix-cell.entity';
import { ProductEntity } from '../../../server/entities/product.entity';
import { RoundupEntryEntity } from '../../../server/entities/roundup-entry.entity';
import { RoundupLoadConfigurationEntity } from '../../../server/entities/roundup-load-configuration.entity';
import { RoundupEntity } from '../../../server/entities/roundup.entity';
import { seedPlanning } from '../../../server/seed/demo-planning';
import { seedStaff } from '../../../server/seed/demo-staff';
import { roundupEntries } from '../../../server/mappers/roundup-entry';
import { samplesOfRoundups } from '../../../server/mappers/sample';
import { productDisplayName } from '../../../shared/domain/planning/product-display-name';
import { testDataSource } from '../support/test-app';

class RollBack extends Error {}

describe('demo seed: planning', () => {
  it('grows an invented catalog and one roundup on the bench with every kind of planning data', async () => {
    const ds = await testDataSource();
    const now = new Date();
    // Seeded inside a transaction that is rolled back, so the shared test database stays as it was.
    await ds
      .transaction(async (manager) => {
        // Other test files add boards of their own to the shared database: only the seed's own are judged here.
        const [{ lastId }] = await manager.query('SELECT COALESCE(MAX(id), 0) AS lastId FROM products');
        const staff = await seedStaff(manager);
        const { roundupId, earlierRoundupId } = await seedPlanning(manager, staff, now);

        const products = await manager
          .getRepository(ProductEntity)
          .findBy({ platform: 'Helix-1700', id: MoreThan(Number(lastId)) });
        expect(products.length).toBeGreaterThanOrEqual(20);
        expect(new Set(products.map((p) => p.maker))).toEqual(
          new Set(['Korvath', 'Ostrel Works', 'Brightmoor', 'Quillon', 'Tarnwell', 'Vesk']),
        );
        // Names appear once: no demo model repeats its maker's name.
        expect(products.filter((p) => productDisplayName(p) !== `${p.maker} ${p.model}`).map((p) => p.model)).toEqual(
          [],
        );
        expect(new Set(products.map((p) => p.chipset)).size).toBe(3);
        expect(products.every((p) => p.effectivePhases && p.vcoreStageCurrentA && p.socket === 'HX4')).toBe(true);
        const [{ n: priceCount }] = await manager.query('SELECT COUNT(*) AS n FROM product_prices');
        expect(Number(priceCount)).toBeGreaterThan(products.length * 2);

        const roundup = await manager.getRepository(RoundupEntity).findOneByOrFail({ id: roundupId });
        expect(roundup.state).toBe('on-the-bench');
        expect(roundup.benchProfileId).not.toBeNull();
        expect(
          await manager.getRepository(RoundupLoadConfigurationEntity).countBy({ roundupId }),
        ).toBeGreaterThanOrEqual(3);

        const entries = await roundupEntries(manager, roundup, now);
        expect(entries.length).toBe(8);
        expect(entries.filter((e) => e.kind === 'reference')).toEqual([
          expect.objectContaining({
            referenceRoundup: expect.objectContaining({ id: earlierRoundupId }),
            sample: null,
          }),
        ]);
        // One tested board sits outside the band, so the warning shows in the demo.
        expect(entries.filter((e) => e.kind === 'tested' && e.priceCheck.fit !== 'in-band')).toHaveLength(1);

        const samples = await samplesOfRoundups(manager, [roundup], now);
        expect(samples.filter((s) => s.overdue)).toEqual([
          expect.objectContaining({ source: 'vendor-loan', daysOverdue: 4 }),
        ]);
        expect(new Set(samples.map((s) => s.source))).toEqual(new Set(['retail', 'vendor-loan']));

        const states = new Set(
          (await manager.getRepository(MatrixCellEntity).findBy({ roundupId })).map((c) => c.state),
        );
        for (const state of ['not-started', 'assigned', 'running', 'recorded', 'accepted'])
          expect(states).toContain(state);

        const benches = await manager.getRepository(BenchEntity).findBy({ name: In(['Bench A', 'Bench B']) });
        const bookings = await manager
          .getRepository(BenchBookingEntity)
          .findBy({ benchId: In(benches.map((b) => b.id)) });
        expect(new Set(bookings.map((b) => b.benchId)).size).toBe(2);
        expect(await manager.getRepository(RoundupEntryEntity).countBy({ roundupId: earlierRoundupId })).toBe(3);
        throw new RollBack();
      })
      .catch((error) => {
        if (!(error instanceof RollBack)) throw error;
      });
  });
});
