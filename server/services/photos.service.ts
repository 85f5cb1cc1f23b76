import { fileTypeFromBuffer } from 'file-type';
import { imageSize } from 'image-size';
import { randomUUID } from 'node:crypto';
import type { AppContext } from '../context';
import { PhotoEntity } from '../entities/photo.entity';
import { AppError } from '../lib/app-error';

export const PHOTO_MAX_BYTES = 8 * 1024 * 1024;
/** Larger images are refused: a small file that decodes to a huge bitmap is a decompression bomb. */
export const PHOTO_MAX_PIXELS = 40_000_000;
const allowed = new Set(['image/jpeg', 'image/png', 'image/webp']);

export function presentPhoto(p: PhotoEntity) {
  return { id: p.id, observationId: p.observationId, contentType: p.contentType, bytes: p.bytes, url: `/api/photos/${p.id}`, createdAt: p.createdAt.toISOString() };
}

export function photosService(ctx: AppContext) {
  const photos = ctx.ds.getRepository(PhotoEntity);
  return {
    /** Stores an uploaded image after checking what it really is (never trusting its name or declared type). */
    async add(observationId: string, buffer: Buffer) {
      if (buffer.length === 0) throw AppError.validation('The file is empty.').because('photo_empty');
      if (buffer.length > PHOTO_MAX_BYTES) throw new AppError('payload_too_large', `Photos can be at most ${PHOTO_MAX_BYTES / 1048576} MB.`).because('photo_too_large', { mb: PHOTO_MAX_BYTES / 1048576 });
      const type = await fileTypeFromBuffer(buffer);
      if (!type || !allowed.has(type.mime)) {
        throw new AppError('unsupported_media_type', 'Only JPEG, PNG and WebP photos can be uploaded; this file is something else, whatever its name says.').because('photo_type');
      }
      let dims: { width?: number; height?: number };
      try {
        dims = imageSize(buffer);
      } catch {
        throw new AppError('unsupported_media_type', 'This image could not be read. Is the file damaged?').because('photo_unreadable');
      }
      if (!dims.width || !dims.height || dims.width * dims.height > PHOTO_MAX_PIXELS) {
        throw new AppError('payload_too_large', 'This image is too large in pixels. Resize it to under 40 megapixels.').because('photo_too_many_pixels', { megapixels: PHOTO_MAX_PIXELS / 1e6 });
      }
      // The storage key is ours alone: nothing from the uploaded file name reaches it.
      const key = `observations/${observationId}/${randomUUID()}.${type.ext}`;
      await ctx.storage.put(key, buffer, type.mime);
      try {
        const { identifiers } = await photos.insert({ observationId, storageKey: key, contentType: type.mime, bytes: buffer.length });
        return presentPhoto(await photos.findOneByOrFail({ id: identifiers[0]!.id as string }));
      } catch (err) {
        await ctx.storage.remove(key).catch(() => {});
        throw err;
      }
    },
    async list(observationId: string) {
      return (await photos.find({ where: { observationId }, order: { createdAt: 'ASC' } })).map(presentPhoto);
    },
    async open(id: string) {
      const p = await photos.findOneBy({ id });
      if (!p) throw AppError.notFound('Photo');
      const obj = await ctx.storage.get(p.storageKey).catch((err: { name?: string }) => {
        if (err.name === 'NoSuchKey' || err.name === 'NotFound') throw AppError.notFound('Photo file');
        throw err;
      });
      return { ...obj, contentType: p.contentType, bytes: p.bytes };
    },
    async remove(id: string) {
      const p = await photos.findOneBy({ id });
      if (!p) throw AppError.notFound('Photo');
      await photos.delete(id);
      await ctx.storage.remove(p.storageKey).catch((err) => ctx.logger.warn({ err, key: p.storageKey }, 'photo object left behind'));
    },
  };
}
