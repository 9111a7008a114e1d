import { dayWords } from '../common/shop-voice';
import { BadRequestException, ForbiddenException, Injectable, NotFoundException } from '@nestjs/common';
import Decimal from 'decimal.js';
import {
  intakeChecklist,
  placeIntakeItems,
  type AuthUser,
  type BookingState,
  type EditIntakeItemInput,
  type EditTimeEntryInput,
  type IntakeItemView,
  type RecordIntakeInput,
  type StaffNoteAdded,
  type StaffNoteInput,
  type TimeEntriesResponse,
  type TimeEntryInput,
} from '@loomwright/shared';
import { type Executor } from '../database/database';
import { BuildServiceBase } from './build-service.base';
import { stateWords } from './build-history';

// Generated<Timestamp> columns come back typed as the column type; at runtime pg gives a Date.
const iso = (d: unknown) => (d instanceof Date ? d : new Date(String(d))).toISOString();

const hoursStates: BookingState[] = ['pedals_received', 'on_bench', 'testing', 'ready'];
const intakeStates: BookingState[] = ['scheduled', 'pedals_received', 'on_bench'];
const conditionWords = { working: 'working', faulty: 'faulty' } as const;

/** What the bench records around a build: hours, intake and staff notes, each correctable with history. */
@Injectable()
export class BuildRecordsService extends BuildServiceBase {
  private lockIn(trx: Executor, bookingId: string, states: BookingState[], what: string) {
    return this.lockInState(trx, bookingId, states, `${what} only while it is ${states.map(stateWords).join(', ')}.`);
  }

  private async mustExist(bookingId: string) {
    const booking = await this.bookingRows.findById(bookingId);
    if (!booking) throw new NotFoundException('There is no booking with that id.');
    return booking;
  }

  // ---- staff notes ----

  /** A staff note: internal, unless the writer tells the player (then it is e-mailed word for word). */
  async addNote(user: AuthUser, bookingId: string, input: StaffNoteInput): Promise<StaffNoteAdded> {
    await this.db.transaction().execute(async (trx) => {
      const booking = await this.lockBooking(trx, bookingId);
      const note = input.note.trim();
      await this.history.note(trx, booking, user, note, input.tellPlayer ? 'player' : 'internal');
      if (input.tellPlayer) {
        await this.mail.enqueue(trx, {
          template: 'shop-note',
          to: booking.customer_email,
          bookingId,
          userId: booking.customer_id,
          data: { name: booking.customer_name, reference: booking.reference, note },
        });
      }
    });
    return { bookingId, told: !!input.tellPlayer };
  }

  // ---- hours ----

  async addTimeEntry(user: AuthUser, bookingId: string, dto: TimeEntryInput): Promise<TimeEntriesResponse> {
    await this.db.transaction().execute(async (trx) => {
      const booking = await this.lockIn(trx, bookingId, hoursStates, 'hours can be recorded');
      const own = await this.builds.builderByUser(trx, user.id);
      let builderId: string | null | undefined;
      if (user.role === 'owner') builderId = dto.builderId ?? booking.builder_id ?? own?.id;
      else {
        if (!own) throw new ForbiddenException('Your account is not on the bench team, so it has no hours to record.');
        if (dto.builderId && dto.builderId !== own.id)
          throw new ForbiddenException('A builder records their own hours; the owner may record anyone’s.');
        builderId = own.id;
      }
      if (!builderId) throw new BadRequestException('Builder is required: say whose hours these are.');
      if (!(await this.builds.builderRef(trx, builderId)))
        throw new NotFoundException('That builder is not on the team; choose one from the list.');
      await this.notInFuture(trx, dto.workedOn);
      const hours = new Decimal(dto.hours).toFixed(2);
      const note = dto.note?.trim() ?? '';
      await this.builds.insertTimeEntry(trx, { bookingId, builderId, workedOn: dto.workedOn, hours, note, createdBy: user.id });
      const f = await this.shopRows.formatOf(trx);
      await this.history.note(trx, booking, user, `Recorded ${f.hours(hours)} on ${dayWords(f, dto.workedOn)}${note ? `: ${note}` : ''}.`);
    });
    return this.timeEntries(bookingId);
  }

  /** Corrects an hour entry: its author or the owner, while the build is on the bench; the change goes in the history. */
  async editTimeEntry(user: AuthUser, bookingId: string, entryId: string, dto: EditTimeEntryInput): Promise<TimeEntriesResponse> {
    await this.db.transaction().execute(async (trx) => {
      const booking = await this.lockIn(trx, bookingId, hoursStates, 'hours can be corrected');
      const entry = await this.ownEntry(trx, user, bookingId, entryId);
      if (dto.workedOn !== undefined) await this.notInFuture(trx, dto.workedOn);
      const next = {
        worked_on: dto.workedOn ?? entry.worked_on,
        hours: dto.hours !== undefined ? new Decimal(dto.hours).toFixed(2) : new Decimal(entry.hours).toFixed(2),
        note: dto.note !== undefined ? dto.note.trim() : entry.note,
      };
      const f = await this.shopRows.formatOf(trx);
      const before = `${f.hours(entry.hours)} on ${dayWords(f, entry.worked_on)}`;
      const after = `${f.hours(next.hours)} on ${dayWords(f, next.worked_on)}`;
      if (next.worked_on === entry.worked_on && next.hours === new Decimal(entry.hours).toFixed(2) && next.note === entry.note) return;
      await this.builds.updateTimeEntry(trx, entryId, next);
      await this.history.note(
        trx,
        booking,
        user,
        `Hours corrected: ${before} → ${after}${next.note !== entry.note ? ` (note: ${next.note || 'removed'})` : ''}.`,
      );
    });
    return this.timeEntries(bookingId);
  }

  async deleteTimeEntry(user: AuthUser, bookingId: string, entryId: string): Promise<TimeEntriesResponse> {
    await this.db.transaction().execute(async (trx) => {
      const booking = await this.lockIn(trx, bookingId, hoursStates, 'hours can be deleted');
      const entry = await this.ownEntry(trx, user, bookingId, entryId);
      await this.builds.deleteTimeEntry(trx, entryId);
      const f = await this.shopRows.formatOf(trx);
      await this.history.note(
        trx,
        booking,
        user,
        `Hours deleted: ${f.hours(entry.hours)} on ${dayWords(f, entry.worked_on)}${entry.note ? ` (${entry.note})` : ''}.`,
      );
    });
    return this.timeEntries(bookingId);
  }

  private async ownEntry(trx: Executor, user: AuthUser, bookingId: string, entryId: string) {
    const entry = await this.builds.lockTimeEntry(trx, bookingId, entryId);
    if (!entry) throw new NotFoundException('There is no such hour entry on this booking.');
    if (user.role !== 'owner' && entry.created_by !== user.id) {
      throw new ForbiddenException('Only the person who recorded these hours, or the owner, can change them.');
    }
    return entry;
  }

  private async notInFuture(trx: Executor, day: string) {
    const { today } = await this.bench.shopCalendar(trx);
    if (day > today) throw new BadRequestException(`The day worked, ${day}, is in the future; record hours once they are spent.`);
  }

  async timeEntries(bookingId: string): Promise<TimeEntriesResponse> {
    await this.mustExist(bookingId);
    const [rows, firm] = await Promise.all([
      this.builds.timeEntries(this.db, bookingId),
      this.bookingRows.latestQuote(this.db, bookingId, 'firm'),
    ]);
    const total = rows.reduce((s, r) => s.plus(r.hours), new Decimal(0));
    return {
      entries: rows.map((r) => ({
        id: r.id,
        builder: { id: r.builder_id, userId: r.user_id, name: r.name, level: r.level },
        workedOn: r.worked_on,
        hours: Number(r.hours),
        note: r.note,
        createdAt: iso(r.created_at),
        updatedAt: r.updated_at ? iso(r.updated_at) : null,
        recordedBy: r.created_by ? { id: r.created_by, name: r.created_by_name ?? '' } : null,
      })),
      totalHours: total.toNumber(),
      plannedHours: firm ? Number(firm.labor_hours) : null,
    };
  }

  // ---- intake ----

  /**
   * Records each item once, at its place in the signal chain. Recording an item again with the
   * same words changes nothing; with other words it corrects the item and says so in the history.
   */
  async recordIntake(user: AuthUser, bookingId: string, dto: RecordIntakeInput): Promise<IntakeItemView[]> {
    await this.db.transaction().execute(async (trx) => {
      const booking = await this.lockIn(trx, bookingId, intakeStates, 'intake can be recorded');
      const existing = new Map((await this.builds.lockIntakeItems(trx, bookingId)).map((row) => [row.item_key, row]));
      const placed = placeIntakeItems(
        intakeChecklist(booking.configuration),
        dto.items.map((i) => i.item),
      );
      const seen = new Set<string>();
      const added: string[] = [];
      const corrected: string[] = [];
      for (const [index, input] of dto.items.entries()) {
        const place = placed[index];
        if (seen.has(place.key))
          throw new BadRequestException(`Item ${index + 1}: "${input.item.trim()}" is listed twice; record each item once.`);
        seen.add(place.key);
        const note = input.note?.trim() ?? '';
        const row = existing.get(place.key);
        if (!row) {
          await this.builds.insertIntakeItem(trx, {
            bookingId,
            key: place.key,
            position: place.position,
            item: place.item,
            condition: input.condition,
            note,
            recordedBy: user.id,
          });
          added.push(`${place.item} (${conditionWords[input.condition]}${note ? `: ${note}` : ''})`);
        } else if (row.condition !== input.condition || row.note !== note || row.item !== place.item) {
          await this.builds.updateIntakeItem(trx, row.id, { item: place.item, condition: input.condition, note, updatedBy: user.id });
          corrected.push(`${place.item}: ${row.condition} → ${input.condition}${note !== row.note ? ` (note: ${note || 'removed'})` : ''}`);
        }
      }
      if (added.length) await this.history.note(trx, booking, user, `Intake: ${added.join('; ')}.`);
      if (corrected.length) await this.history.note(trx, booking, user, `Intake corrected: ${corrected.join('; ')}.`);
    });
    return this.intake(bookingId);
  }

  /** Corrects one recorded item (a typo, a fault found later): the change goes in the history. */
  async editIntakeItem(user: AuthUser, bookingId: string, itemId: string, dto: EditIntakeItemInput): Promise<IntakeItemView[]> {
    await this.db.transaction().execute(async (trx) => {
      const booking = await this.lockIn(trx, bookingId, intakeStates, 'intake can be corrected');
      const row = (await this.builds.lockIntakeItems(trx, bookingId)).find((r) => r.id === itemId);
      if (!row) throw new NotFoundException('There is no such intake item on this booking.');
      const note = dto.note?.trim() ?? '';
      const item = dto.item.trim();
      if (row.item === item && row.condition === dto.condition && row.note === note) return;
      await this.builds.updateIntakeItem(trx, row.id, { item, condition: dto.condition, note, updatedBy: user.id });
      const renamed = row.item !== item ? ` renamed to ${item},` : '';
      await this.history.note(
        trx,
        booking,
        user,
        `Intake corrected: ${row.item}${renamed} ${row.condition} → ${dto.condition}${note !== row.note ? ` (note: ${note || 'removed'})` : ''}.`,
      );
    });
    return this.intake(bookingId);
  }

  async intake(bookingId: string): Promise<IntakeItemView[]> {
    await this.mustExist(bookingId);
    const rows = await this.builds.intakeItems(this.db, bookingId);
    return rows.map((r) => ({
      id: r.id,
      key: r.item_key,
      item: r.item,
      condition: r.condition,
      note: r.note,
      recordedBy: r.recorded_by,
      createdAt: iso(r.created_at),
      updatedAt: r.updated_at ? iso(r.updated_at) : null,
    }));
  }
}
