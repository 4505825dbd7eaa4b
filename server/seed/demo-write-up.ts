import sharp from 'sharp';
import type { DataSource } from 'typeorm';
import { PhotoEntity } from '../entities/photo.entity';
import { ProductEntity } from '../entities/product.entity';
import { RoundupEntity } from '../entities/roundup.entity';
import { RoundupEntryEntity } from '../entities/roundup-entry.entity';
import { UserEntity } from '../entities/user.entity';
import { WriteUpSectionEntity } from '../entities/write-up-section.entity';
import { analyseInProcess } from '../services/log-check.service';
import { PhotosService } from '../services/photos.service';
import { TestRunsService } from '../services/test-runs.service';
import { WriteUpsService } from '../services/write-ups.service';
import type { FileStore } from '../storage/file-store';
import type { CurrentUser } from '../../shared/schemas/auth';
import type { ParagraphNode, WriteUpDocument } from '../../shared/schemas/write-up-document';
import { productDisplayName } from '../../shared/domain/planning/product-display-name';
import { cautionDefaultTexts } from '../../shared/domain/editorial/caution-texts';

const paragraph = (text: string): ParagraphNode => ({ type: 'paragraph', content: [{ type: 'text', text }] });

/** A plain board-coloured picture standing in for a product photo (the demo has no real photographs). */
function boardPicture(hue: number) {
  return sharp({
    create: { width: 1200, height: 800, channels: 3, background: { r: 40 + hue, g: 70, b: 60 + (hue % 40) } },
  })
    .composite([
      {
        input: Buffer.from(
          '<svg width="1200" height="800"><rect x="760" y="120" width="300" height="140" fill="#8a8f96"/>' +
            '<rect x="140" y="180" width="180" height="440" fill="#9aa0a6"/><rect x="420" y="260" width="300" height="300" fill="#c9b27c"/></svg>',
        ),
      },
    ])
    .jpeg()
    .toBuffer();
}

/**
 * The demo roundup in Writing gets an overview photo per board, its write-up sections, an opening drafted by the
 * writer and the first board's section drafted with its results. All text is invented.
 */
export async function seedDemoWriteUp(dataSource: DataSource, files: FileStore) {
  const users = await dataSource.getRepository(UserEntity).find();
  const actor = (role: string): CurrentUser | null => {
    const user = users.find((u) => u.role === role);
    return user ? { id: user.id, email: user.email, displayName: user.displayName, role: user.role } : null;
  };
  const writer = actor('writer');
  const tester = actor('tester');
  if (!writer || !tester) return;
  const testRuns = new TestRunsService(dataSource, files, analyseInProcess);
  const writeUps = new WriteUpsService(dataSource, testRuns);
  const photos = new PhotosService(dataSource, files);

  const roundups = await dataSource.getRepository(RoundupEntity).findBy({ state: 'writing' });
  for (const roundup of roundups) {
    const entries = await dataSource
      .getRepository(RoundupEntryEntity)
      .find({ where: { roundupId: roundup.id, kind: 'tested' }, order: { position: 'ASC' } });
    for (const [index, entry] of entries.entries()) {
      if (await dataSource.getRepository(PhotoEntity).existsBy({ entryId: entry.id })) continue;
      const product = await dataSource.getRepository(ProductEntity).findOneByOrFail({ id: entry.productId });
      await photos.upload(
        tester,
        roundup.id,
        entry.id,
        { buffer: await boardPicture(index * 37) },
        {
          kind: 'overview',
          caption: `${productDisplayName(product)} on the open bench`,
          altText: `Top view of the ${productDisplayName(product)} with its V-core heatsinks left of the socket`,
        },
      );
    }

    await writeUps.ensureSections(roundup.id, writer);
    const sections = await dataSource
      .getRepository(WriteUpSectionEntity)
      .find({ where: { roundupId: roundup.id }, order: { position: 'ASC' } });
    const intro = sections.find((s) => s.kind === 'introduction');
    if (intro && intro.version === 1) {
      const content: WriteUpDocument = {
        type: 'doc',
        content: [
          paragraph(
            'Flagship boards promise more power stages than any desktop chip can use. We soaked each one for an hour ' +
              'at two load levels to see which heatsinks earn their size.',
          ),
          paragraph('Short version: the board with the fewest phases was not the hottest, and one board throttled.'),
        ],
      };
      await writeUps.save(writer, intro.id, { baseVersion: 1, content });
    }
    const firstProduct = sections.find((s) => s.kind === 'product');
    if (firstProduct && firstProduct.version === 1 && firstProduct.entryId) {
      const content: WriteUpDocument = {
        type: 'doc',
        content: [
          paragraph(
            'A calm performer: the finned heatsink over the V-core stages kept the rear of the board well inside ' +
              'the comfortable band even in the overclocked configuration.',
          ),
          { type: 'liveBlock', attrs: { block: 'power-design', entryId: firstProduct.entryId } },
          { type: 'liveBlock', attrs: { block: 'results', entryId: firstProduct.entryId } },
          {
            type: 'caution',
            attrs: { kind: 'hot-surface' },
            content: [paragraph(cautionDefaultTexts['hot-surface'])],
          },
        ],
      };
      await writeUps.save(writer, firstProduct.id, { baseVersion: 1, content });
    }
  }
}
