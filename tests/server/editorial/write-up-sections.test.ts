import { describe, expect, it } from 'vitest';
import { WriteUpSectionEntity } from '../../../server/entities/write-up-section.entity';
import { createServices } from '../../../server/compose-services';
import { testApp, testDataSource, testEnv } from '../support/test-app';
import { roundupInWriting } from './support/write-up-fixtures';

describe('write-up sections of a roundup', () => {
  it('when a roundup reaches Writing, then it gets an introduction, how we tested, a section per product and a conclusion, and each blocks readiness until signed off', async () => {
    const app = await testApp();
    const { roundupId, entryIds } = await roundupInWriting(app, { products: 2 });
    const service = createServices(await testDataSource(), testEnv()).writeUps;

    const blocking = await service.sectionsBlocking(roundupId);
    const sections = await (
      await testDataSource()
    )
      .getRepository(WriteUpSectionEntity)
      .find({ where: { roundupId }, order: { position: 'ASC' } });
    expect(sections.map((s) => s.sectionKey)).toEqual([
      'introduction',
      'methodology',
      `entry-${entryIds[0]}`,
      `entry-${entryIds[1]}`,
      'conclusion',
    ]);
    expect(blocking).toHaveLength(5);
    expect(blocking[0]).toBe('Write-up section “Introduction” is Drafting, not signed off.');

    // Pre-filled from the bench profile of the fixture: 21 °C ± 1 °C room, 60-minute soak, 230 W configuration.
    const methodology = JSON.stringify(sections[1].content);
    expect(methodology).toContain('21.0\u2009°C ± 1.0\u2009°C');
    expect(methodology).toContain('Board rear under the V-core stages, taped');
    expect(methodology).toContain('at least 60\u2009minutes');
    expect(methodology).toContain('230.0\u2009W package power at 1.250\u2009V core');

    // Opening again creates nothing new.
    await service.ensureSections(roundupId);
    expect(await (await testDataSource()).getRepository(WriteUpSectionEntity).countBy({ roundupId })).toBe(5);
  });
});
