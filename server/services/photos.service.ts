import { createHash } from 'node:crypto';
import type { DataSource } from 'typeorm';
import { PhotoEntity, type PhotoDerivativeRecord } from '../entities/photo.entity';
import { RoundupEntryEntity } from '../entities/roundup-entry.entity';
import { AppError, invalid, notFound } from '../errors';
import { processPhoto } from '../images/photo-derivatives';
import { loadPeople, personOrNull } from '../mappers/people';
import type { FileStore } from '../storage/file-store';
import { recordAction } from './audit.service';
import type { CurrentUser } from '../../shared/schemas/auth';
import type {
  ParsedPhotoUploadFields,
  ParsedReorderPhotosRequest,
  ParsedUpdatePhotoRequest,
  Photo,
} from '../../shared/schemas/photos';

const contentTypes = { webp: 'image/webp', jpeg: 'image/jpeg' } as const;

/**
 * Photos of a product within a roundup. The upload is decoded by sharp (libvips works on its own threads, so the event
 * loop stays free), turned upright, stripped of metadata and written in web sizes; the original is not kept.
 */
export class PhotosService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly files: FileStore,
  ) {}

  async list(roundupId: number, entryId: number): Promise<Photo[]> {
    await this.entryOf(roundupId, entryId);
    const rows = await this.dataSource
      .getRepository(PhotoEntity)
      .find({ where: { entryId }, order: { position: 'ASC', id: 'ASC' } });
    return this.toDtos(rows);
  }

  async upload(
    actor: CurrentUser,
    roundupId: number,
    entryId: number,
    file: { buffer: Uint8Array } | undefined,
    fields: ParsedPhotoUploadFields,
  ): Promise<Photo> {
    if (!file || file.buffer.length === 0) {
      throw new AppError('validation_failed', 400, 'Attach a photo (JPEG, PNG or WebP).', { file: 'Choose a photo.' });
    }
    await this.entryOf(roundupId, entryId);
    const upload = Buffer.from(file.buffer);
    const processed = await processPhoto(upload);
    const sourceSha256 = createHash('sha256').update(upload).digest('hex');
    const prefix = `photos/entry-${entryId}/${sourceSha256.slice(0, 16)}-${Date.now().toString(36)}`;
    const written: string[] = [];
    try {
      const derivatives: PhotoDerivativeRecord[] = [];
      for (const derivative of processed.derivatives) {
        const key = `${prefix}/${derivative.width}.${derivative.format}`;
        await this.files.put(key, derivative.body, derivative.contentType);
        written.push(key);
        derivatives.push({
          width: derivative.width,
          height: derivative.height,
          format: derivative.format,
          key,
          bytes: derivative.body.length,
        });
      }
      const saved = await this.dataSource.transaction(async (manager) => {
        const repo = manager.getRepository(PhotoEntity);
        // Lock the entry's photos so two uploads at once do not take the same position.
        await manager
          .getRepository(RoundupEntryEntity)
          .findOne({ where: { id: entryId }, lock: { mode: 'pessimistic_write' } });
        const last = await repo.findOne({ where: { entryId }, order: { position: 'DESC' } });
        const photo = await repo.save(
          repo.create({
            roundupId,
            entryId,
            kind: fields.kind,
            caption: fields.caption,
            altText: fields.altText,
            position: (last?.position ?? 0) + 1,
            width: processed.width,
            height: processed.height,
            sourceSha256,
            derivatives,
            uploadedBy: actor.id,
          }),
        );
        await recordAction(manager, actor, 'photo.added', ['roundup', roundupId], {
          photoId: photo.id,
          entryId,
          kind: fields.kind,
          sizes: derivatives.length,
        });
        return photo;
      });
      return (await this.toDtos([saved]))[0];
    } catch (error) {
      await Promise.all(written.map((key) => this.files.delete(key).catch(() => undefined)));
      throw error;
    }
  }

  async update(actor: CurrentUser, photoId: number, fields: ParsedUpdatePhotoRequest): Promise<Photo> {
    const saved = await this.dataSource.transaction(async (manager) => {
      const repo = manager.getRepository(PhotoEntity);
      const photo = await repo.findOne({ where: { id: photoId }, lock: { mode: 'pessimistic_write' } });
      if (!photo) throw notFound('That photo');
      if (fields.kind !== undefined) photo.kind = fields.kind;
      if (fields.caption !== undefined) photo.caption = fields.caption;
      if (fields.altText !== undefined) photo.altText = fields.altText;
      await repo.save(photo);
      await recordAction(manager, actor, 'photo.changed', ['roundup', photo.roundupId], { photoId, ...fields });
      return photo;
    });
    return (await this.toDtos([saved]))[0];
  }

  async reorder(
    actor: CurrentUser,
    roundupId: number,
    entryId: number,
    input: ParsedReorderPhotosRequest,
  ): Promise<Photo[]> {
    await this.entryOf(roundupId, entryId);
    const rows = await this.dataSource.transaction(async (manager) => {
      const repo = manager.getRepository(PhotoEntity);
      const photos = await repo.find({ where: { entryId }, lock: { mode: 'pessimistic_write' } });
      const ids = new Set(photos.map((p) => p.id));
      const given = new Set(input.photoIds);
      if (
        given.size !== input.photoIds.length ||
        given.size !== ids.size ||
        input.photoIds.some((id) => !ids.has(id))
      ) {
        throw invalid('List every photo of this product exactly once.', {
          photoIds: 'List every photo of this product exactly once.',
        });
      }
      for (const [index, id] of input.photoIds.entries()) await repo.update({ id }, { position: index + 1 });
      await recordAction(manager, actor, 'photo.reordered', ['roundup', roundupId], {
        entryId,
        photoIds: input.photoIds,
      });
      return repo.find({ where: { entryId }, order: { position: 'ASC' } });
    });
    return this.toDtos(rows);
  }

  async remove(actor: CurrentUser, photoId: number): Promise<void> {
    const photo = await this.dataSource.transaction(async (manager) => {
      const row = await manager.getRepository(PhotoEntity).findOneBy({ id: photoId });
      if (!row) throw notFound('That photo');
      await manager.getRepository(PhotoEntity).delete({ id: photoId });
      await recordAction(manager, actor, 'photo.removed', ['roundup', row.roundupId], {
        photoId,
        entryId: row.entryId,
      });
      return row;
    });
    // The files go after the row: a failed delete leaves an unreferenced file, never a row without its files.
    await Promise.all(photo.derivatives.map((d) => this.files.delete(d.key).catch(() => undefined)));
  }

  /** One web size of a photo, for staff (readers get published copies). */
  async file(photoId: number, size: string) {
    const photo = await this.dataSource.getRepository(PhotoEntity).findOneBy({ id: photoId });
    if (!photo) throw notFound('That photo');
    const [width, format] = size.split('.');
    const derivative = photo.derivatives.find((d) => String(d.width) === width && d.format === format);
    if (!derivative) throw notFound('That photo size');
    const body = await this.files.get(derivative.key);
    if (!body) throw new AppError('file_missing', 410, 'The stored photo is missing from storage. Tell an admin.');
    return { body, contentType: contentTypes[derivative.format] };
  }

  private async entryOf(roundupId: number, entryId: number) {
    const entry = await this.dataSource.getRepository(RoundupEntryEntity).findOneBy({ id: entryId, roundupId });
    if (!entry) throw notFound('That product in this roundup');
    return entry;
  }

  private async toDtos(rows: PhotoEntity[]): Promise<Photo[]> {
    const people = await loadPeople(
      this.dataSource.manager,
      rows.map((r) => r.uploadedBy),
    );
    return rows.map((row) => ({
      id: row.id,
      roundupId: row.roundupId,
      entryId: row.entryId,
      kind: row.kind,
      caption: row.caption,
      altText: row.altText,
      position: row.position,
      width: row.width,
      height: row.height,
      sizes: row.derivatives.map((d) => ({
        width: d.width,
        height: d.height,
        format: d.format,
        url: `/api/photos/${row.id}/files/${d.width}.${d.format}`,
      })),
      uploadedBy: personOrNull(people, row.uploadedBy) ?? { id: row.uploadedBy, displayName: 'Former staff' },
      createdAt: row.createdAt.toISOString(),
    }));
  }
}
