import { randomUUID } from 'node:crypto';
import { BadRequestException, ConflictException, Injectable, NotFoundException, PayloadTooLargeException } from '@nestjs/common';
import type { AuthUser, PhotoView } from '@loomwright/shared';
import { errorResponse, staffRoles, requestWords } from '@loomwright/shared';
import { fileTypeFromBuffer } from 'file-type';
import { Database } from '../database/database';
import { photoView } from './booking-view';
import { BookingsRepository, type PhotoRow } from './bookings.repository';
import { BookingsService } from './bookings.service';
import { type PhotoFormat, type ProcessedPhoto, reencodePhoto, UnreadablePhotoError } from './photo-processing';
import { PhotoStorage } from './photo-storage';

export const MAX_PHOTO_BYTES = 8 * 1024 * 1024;
export const MAX_PHOTOS_PER_BOOKING = 8;
/** Formats every browser shows; judged by the file's first bytes, never by its name or header, then re-encoded. */
const allowedImages: Record<string, string> = { 'image/jpeg': 'jpg', 'image/png': 'png', 'image/webp': 'webp' };

/** A checked, re-encoded and stored photo, ready to be recorded in a `photos` row. */
export interface PreparedPhoto {
  storage_key: string;
  thumbnail_key: string;
  content_type: string;
  size_bytes: number;
  width: number;
  height: number;
}

export interface UploadedPhoto {
  buffer: Buffer;
  size: number;
}

@Injectable()
export class BookingPhotosService {
  constructor(
    private readonly db: Database,
    private readonly bookings: BookingsService,
    private readonly repository: BookingsRepository,
    private readonly storage: PhotoStorage,
  ) {}

  async upload(
    user: AuthUser,
    bookingId: string,
    file: UploadedPhoto | undefined,
    options: { caption?: string; kind?: 'intake' | 'build' },
  ): Promise<PhotoView> {
    const booking = await this.bookings.findVisible(user, bookingId);
    const photo = await this.prepare(booking.id, file);
    const staff = staffRoles.includes(user.role);
    try {
      const row = await this.db.transaction().execute(async (trx) => {
        // The lock makes the per-booking limit hold under concurrent uploads.
        await this.repository.lockById(trx, booking.id);
        const count = await this.repository.countPhotos(trx, booking.id);
        if (count >= MAX_PHOTOS_PER_BOOKING) {
          throw new ConflictException(`This booking already has ${MAX_PHOTOS_PER_BOOKING} photos, the most it can hold.`);
        }
        return this.repository.insertPhoto(trx, {
          booking_id: booking.id,
          uploaded_by: user.id,
          kind: staff ? (options.kind ?? 'build') : 'customer',
          ...photo,
          caption: options.caption?.trim() ?? '',
        });
      });
      return photoView(row);
    } catch (error) {
      await this.discard(photo);
      throw error;
    }
  }

  /**
   * Checks an upload (present, within the size, a JPEG, PNG or WebP by its bytes), re-encodes it
   * without camera metadata and writes both copies to the photo store. The caller inserts the
   * photo row in its own transaction, or calls discard() when that fails.
   */
  async prepare(bookingId: string, file: UploadedPhoto | undefined): Promise<PreparedPhoto> {
    if (!file || file.size === 0)
      throw new BadRequestException('Attach a photo: the upload holds no file (send it in the multipart field "file").');
    if (file.size > MAX_PHOTO_BYTES) throw new PayloadTooLargeException(errorResponse('photo_too_large', photoTooLargeMessage));
    const type = await fileTypeFromBuffer(file.buffer);
    const ext = type && allowedImages[type.mime];
    if (!type || !ext) throw new BadRequestException(requestWords.notAPhoto(type?.mime));
    const processed = await this.reencode(file.buffer, type.mime as PhotoFormat);
    const keys = await this.store(bookingId, processed);
    return {
      ...keys,
      content_type: processed.full.contentType,
      size_bytes: processed.full.bytes.length,
      width: processed.width,
      height: processed.height,
    };
  }

  /** Removes the stored copies of a prepared photo whose row was never written. */
  discard(photo: Pick<PreparedPhoto, 'storage_key' | 'thumbnail_key'>) {
    return this.removeAll(photo);
  }

  /**
   * The photo or its list-sized copy. Only re-encoded bytes go out: a photo stored before uploads
   * were re-encoded is re-encoded here the first time anyone asks for it, and its original removed.
   */
  async read(
    user: AuthUser,
    bookingId: string,
    photoId: string,
    variant: 'full' | 'thumbnail' = 'full',
  ): Promise<{ bytes: Buffer; contentType: string }> {
    await this.bookings.findVisible(user, bookingId);
    let row = await this.repository.findPhoto(bookingId, photoId);
    if (!row) throw new NotFoundException(`There is no photo ${photoId} on this booking.`);
    if (!row.thumbnail_key) row = await this.reencodeLegacy(row);
    return variant === 'thumbnail'
      ? { bytes: await this.storage.get(row.thumbnail_key!), contentType: 'image/webp' }
      : { bytes: await this.storage.get(row.storage_key), contentType: row.content_type };
  }

  private async reencodeLegacy(row: PhotoRow): Promise<PhotoRow> {
    let processed: ProcessedPhoto;
    try {
      processed = await reencodePhoto(await this.storage.get(row.storage_key), row.content_type as PhotoFormat);
    } catch (error) {
      if (!(error instanceof UnreadablePhotoError)) throw error;
      throw new NotFoundException('This photo could not be read back from storage; please upload it again.');
    }
    const keys = await this.store(row.booking_id, processed);
    const updated = await this.repository.replaceLegacyPhoto(row.id, {
      ...keys,
      content_type: processed.full.contentType,
      size_bytes: processed.full.bytes.length,
      width: processed.width,
      height: processed.height,
    });
    if (!updated) {
      // Someone else re-encoded it at the same moment: theirs stands, ours goes.
      await this.removeAll(keys);
      return (await this.repository.findPhoto(row.booking_id, row.id))!;
    }
    await this.storage.remove(row.storage_key);
    return updated;
  }

  private async reencode(bytes: Buffer, format: PhotoFormat): Promise<ProcessedPhoto> {
    try {
      return await reencodePhoto(bytes, format);
    } catch (error) {
      if (error instanceof UnreadablePhotoError) throw new BadRequestException(error.message);
      throw error;
    }
  }

  /** Writes both copies under fresh server-chosen keys; nothing stays behind if either write fails. */
  private async store(bookingId: string, processed: ProcessedPhoto): Promise<{ storage_key: string; thumbnail_key: string }> {
    const name = `${bookingId}/${randomUUID()}`;
    const keys = { storage_key: `${name}.${processed.full.ext}`, thumbnail_key: `${name}.thumb.${processed.thumbnail.ext}` };
    try {
      await this.storage.put(keys.storage_key, processed.full.bytes);
      await this.storage.put(keys.thumbnail_key, processed.thumbnail.bytes);
    } catch (error) {
      await this.removeAll(keys);
      throw error;
    }
    return keys;
  }

  private async removeAll(keys: { storage_key: string; thumbnail_key: string }) {
    await Promise.all([this.storage.remove(keys.storage_key), this.storage.remove(keys.thumbnail_key)]);
  }
}

export const photoTooLargeMessage = `file: the photo is larger than ${MAX_PHOTO_BYTES / 1024 / 1024} MB; send a smaller one (a phone's "medium" size is plenty).`;
