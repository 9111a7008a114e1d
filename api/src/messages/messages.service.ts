import { BadRequestException, Injectable, NotFoundException } from '@nestjs/common';
import {
  MESSAGE_MAIL_WINDOW_MINUTES,
  MESSAGE_MAX_PHOTOS,
  messageWords,
  staffRoles,
  type AuthUser,
  type BuildMessageView,
  type MessageSide,
  type MessageThreadView,
  type PostMessageInput,
  type UnreadMessagesView,
} from '@loomwright/shared';
import { BookingPhotosService, type PreparedPhoto, type UploadedPhoto } from '../bookings/booking-photos.service';
import { BookingsService } from '../bookings/bookings.service';
import { Database } from '../database/database';
import { MessageClock } from './message-clock';
import { MessageNoticesWorker } from './message-notices.worker';
import { MessagesRepository } from './messages.repository';

export const sideOf = (user: AuthUser): MessageSide => (staffRoles.includes(user.role) ? 'shop' : 'player');
const iso = (value: Date | string) => new Date(value).toISOString();

/**
 * The conversation on a build. Who may read and write it: the player who owns the booking, the
 * owner, and the builder the build is assigned to. Anyone else is told there is no such build
 * (404), so a thread's existence is not given away.
 */
@Injectable()
export class MessagesService {
  constructor(
    private readonly db: Database,
    private readonly bookings: BookingsService,
    private readonly photos: BookingPhotosService,
    private readonly repository: MessagesRepository,
    private readonly clock: MessageClock,
    private readonly worker: MessageNoticesWorker,
  ) {}

  private async bookingFor(user: AuthUser, bookingId: string) {
    let booking;
    try {
      booking = await this.bookings.findVisible(user, bookingId);
    } catch (error) {
      if (error instanceof NotFoundException) throw new NotFoundException(messageWords.notYours(bookingId));
      throw error;
    }
    if (user.role === 'builder' && (await this.repository.assignedBuilderUserId(booking.id)) !== user.id) {
      throw new NotFoundException(messageWords.notYours(bookingId));
    }
    return booking;
  }

  /** The thread, oldest first; reading it moves the reader's side's marker to its newest message. */
  async thread(user: AuthUser, bookingId: string): Promise<MessageThreadView> {
    const booking = await this.bookingFor(user, bookingId);
    const side = sideOf(user);
    const rows = await this.repository.thread(booking.id);
    const photos = await this.repository.photosOfMessages(rows.map((r) => r.id));
    const readBefore = BigInt(await this.repository.readSeq(booking.id, side));
    const unreadBefore = rows.filter((r) => r.side !== side && BigInt(r.seq) > readBefore).length;
    const last = rows.at(-1);
    if (last) await this.repository.markRead(this.db, booking.id, side, last.seq, this.clock.now());
    const messages: BuildMessageView[] = rows.map((r) => ({
      id: r.id,
      side: r.side,
      authorName: r.author_name,
      body: r.body,
      createdAt: iso(r.created_at),
      mine: r.author_id === user.id,
      photos: photos
        .filter((p) => p.message_id === r.id)
        .map((p) => ({
          id: p.id,
          url: `/api/bookings/${p.booking_id}/photos/${p.id}`,
          thumbnailUrl: `/api/bookings/${p.booking_id}/photos/${p.id}/thumbnail`,
          width: p.width,
          height: p.height,
        })),
    }));
    return { bookingId: booking.id, reference: booking.reference, side, messages, unreadBefore };
  }

  /**
   * Writes a message with its photos. The photos are checked and stored first (outside the
   * transaction); the message, its photo rows, the writer's read marker and the other side's
   * notice commit together, and a failure removes the stored copies again.
   */
  async post(user: AuthUser, bookingId: string, input: PostMessageInput, files: UploadedPhoto[]): Promise<BuildMessageView> {
    const booking = await this.bookingFor(user, bookingId);
    const body = input.body.trim();
    if (files.length > MESSAGE_MAX_PHOTOS) throw new BadRequestException(messageWords.tooManyPhotos(MESSAGE_MAX_PHOTOS));
    if (!body && files.length === 0) throw new BadRequestException(messageWords.emptyMessage);
    const side = sideOf(user);
    const prepared: PreparedPhoto[] = [];
    try {
      for (const file of files) prepared.push(await this.photos.prepare(booking.id, file));
      const now = this.clock.now();
      const dueAt = new Date(now.getTime() + MESSAGE_MAIL_WINDOW_MINUTES * 60_000);
      const { message, photoIds, notice } = await this.db.transaction().execute(async (trx) => {
        const message = await this.repository.insertMessage(trx, {
          booking_id: booking.id,
          author_id: user.id,
          side,
          body,
          created_at: now,
        });
        const photoIds: string[] = [];
        for (const photo of prepared) {
          const row = await this.repository.insertPhoto(trx, {
            booking_id: booking.id,
            uploaded_by: user.id,
            kind: side === 'shop' ? 'build' : 'customer',
            message_id: message.id,
            ...photo,
          });
          photoIds.push(row.id);
        }
        // Whoever writes has read everything before it.
        await this.repository.markRead(trx, booking.id, side, message.seq, now);
        const notice = await this.repository.openNotice(trx, booking.id, side === 'player' ? 'shop' : 'player', message.seq, dueAt);
        return { message, photoIds, notice };
      });
      if (notice) await this.worker.wakeAt(notice.id, new Date(notice.due_at));
      return {
        id: message.id,
        side,
        authorName: user.name,
        body,
        createdAt: iso(message.created_at),
        mine: true,
        photos: photoIds.map((id, i) => ({
          id,
          url: `/api/bookings/${booking.id}/photos/${id}`,
          thumbnailUrl: `/api/bookings/${booking.id}/photos/${id}/thumbnail`,
          width: prepared[i].width,
          height: prepared[i].height,
        })),
      };
    } catch (error) {
      await Promise.all(prepared.map((p) => this.photos.discard(p)));
      throw error;
    }
  }

  /** Unread messages for the caller's side: a player's own builds; a builder's assigned builds; the owner's whole shop. */
  async unread(user: AuthUser): Promise<UnreadMessagesView> {
    const side = sideOf(user);
    const scope = side === 'player' ? { customerId: user.id } : user.role === 'builder' ? { builderUserId: user.id } : {};
    const rows = await this.repository.unreadFor(side, scope);
    const bookings = rows.map((r) => ({ bookingId: r.booking_id, reference: r.reference, unread: Number(r.unread) }));
    return { total: bookings.reduce((sum, b) => sum + b.unread, 0), bookings };
  }
}
