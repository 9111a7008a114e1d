import { randomUUID } from 'node:crypto';
import { BadRequestException, ConflictException, Injectable, NotFoundException, PayloadTooLargeException } from '@nestjs/common';
import type { AuthUser, PhotoView } from '@loomwright/shared';
import { staffRoles } from '@loomwright/shared';
import { fileTypeFromBuffer } from 'file-type';
import { Database } from '../database/database';
import { photoView } from './booking-view';
import { BookingsRepository } from './bookings.repository';
import { BookingsService } from './bookings.service';
import { PhotoStorage } from './photo-storage';

export const MAX_PHOTO_BYTES = 8 * 1024 * 1024;
export const MAX_PHOTOS_PER_BOOKING = 8;
/** Formats every browser shows; judged by the file's first bytes, never by its name or header. */
const allowedImages: Record<string, string> = { 'image/jpeg': 'jpg', 'image/png': 'png', 'image/webp': 'webp' };

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
    if (!file || file.size === 0) throw new BadRequestException('file: attach an image in the multipart field "file".');
    if (file.size > MAX_PHOTO_BYTES) throw new PayloadTooLargeException(photoTooLargeMessage);
    const type = await fileTypeFromBuffer(file.buffer);
    const ext = type && allowedImages[type.mime];
    if (!type || !ext) {
      throw new BadRequestException(
        `file: this is ${type ? `a ${type.mime} file` : 'not a recognisable image'}; upload a JPEG, PNG or WebP photo.`,
      );
    }
    const staff = staffRoles.includes(user.role);
    const key = `${booking.id}/${randomUUID()}.${ext}`;
    await this.storage.put(key, file.buffer);
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
          storage_key: key,
          content_type: type.mime,
          size_bytes: file.size,
          caption: options.caption?.trim() ?? '',
        });
      });
      return photoView(row);
    } catch (error) {
      await this.storage.remove(key);
      throw error;
    }
  }

  async read(user: AuthUser, bookingId: string, photoId: string): Promise<{ bytes: Buffer; contentType: string }> {
    await this.bookings.findVisible(user, bookingId);
    const row = await this.repository.findPhoto(bookingId, photoId);
    if (!row) throw new NotFoundException(`There is no photo ${photoId} on this booking.`);
    return { bytes: await this.storage.get(row.storage_key), contentType: row.content_type };
  }
}

export const photoTooLargeMessage = `file: the photo is larger than ${MAX_PHOTO_BYTES / 1024 / 1024} MB; send a smaller one (a phone's "medium" size is plenty).`;
