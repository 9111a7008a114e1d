import { BadRequestException, ConflictException, ForbiddenException, Injectable, NotFoundException } from '@nestjs/common';
import Decimal from 'decimal.js';
import type { AuthUser, BookingState, ExtraView, IntakeItemView, ProposeExtraInput, RecordIntakeInput, TimeEntriesResponse, TimeEntryInput } from '@loomwright/shared';
import { BenchService } from '../bench/bench.service';
import { Database, type Executor } from '../database/database';
import { BuildHistory, stateWords } from './build-history';
import { BuildsRepository } from './builds.repository';

// Generated<Timestamp> columns come back typed as the column type; at runtime pg gives a Date.
const iso = (d: unknown) => (d instanceof Date ? d : new Date(String(d))).toISOString();

/** What the bench records around a build: hours, intake, extras and the layout approval. */
@Injectable()
export class BuildRecordsService {
  constructor(
    private readonly db: Database,
    private readonly builds: BuildsRepository,
    private readonly bench: BenchService,
    private readonly history: BuildHistory,
  ) {}

  private async lockIn(trx: Executor, bookingId: string, states: BookingState[], what: string) {
    const booking = await this.builds.lockBooking(trx, bookingId);
    if (!booking) throw new NotFoundException('There is no booking with that id.');
    if (!states.includes(booking.state)) {
      throw new ConflictException(`Booking ${booking.reference} is ${stateWords(booking.state)}; ${what} only while it is ${states.map(stateWords).join(', ')}.`);
    }
    return booking;
  }

  private async mustExist(bookingId: string) {
    const booking = await this.builds.findBooking(this.db, bookingId);
    if (!booking) throw new NotFoundException('There is no booking with that id.');
    return booking;
  }

  async addTimeEntry(user: AuthUser, bookingId: string, dto: TimeEntryInput): Promise<TimeEntriesResponse> {
    await this.db.transaction().execute(async (trx) => {
      const booking = await this.lockIn(trx, bookingId, ['pedals_received', 'on_bench', 'testing', 'ready'], 'hours can be recorded');
      const own = await this.builds.builderByUser(trx, user.id);
      let builderId: string | null | undefined;
      if (user.role === 'owner') builderId = dto.builderId ?? booking.builder_id ?? own?.id;
      else {
        if (!own) throw new ForbiddenException('Your account is not on the bench team, so it has no hours to record.');
        if (dto.builderId && dto.builderId !== own.id) throw new ForbiddenException('A builder records their own hours; the owner may record anyone’s.');
        builderId = own.id;
      }
      if (!builderId) throw new BadRequestException('builderId is required: say whose hours these are.');
      if (!(await this.builds.builderRef(trx, builderId))) throw new NotFoundException('There is no builder with that builderId.');
      const { today } = await this.bench.shopCalendar(trx);
      if (dto.workedOn > today) throw new BadRequestException(`workedOn ${dto.workedOn} is in the future; record hours once they are spent.`);
      const hours = new Decimal(dto.hours).toFixed(2);
      await this.builds.insertTimeEntry(trx, { bookingId, builderId, workedOn: dto.workedOn, hours, note: dto.note?.trim() ?? '' });
      await this.history.note(trx, booking, user, `Recorded ${hours} h on ${dto.workedOn}${dto.note?.trim() ? `: ${dto.note.trim()}` : ''}.`);
    });
    return this.timeEntries(bookingId);
  }

  async timeEntries(bookingId: string): Promise<TimeEntriesResponse> {
    await this.mustExist(bookingId);
    const [rows, firm] = await Promise.all([this.builds.timeEntries(this.db, bookingId), this.builds.latestFirmQuote(this.db, bookingId)]);
    const total = rows.reduce((s, r) => s.plus(r.hours), new Decimal(0));
    return {
      entries: rows.map((r) => ({
        id: r.id,
        builder: { id: r.builder_id, userId: r.user_id, name: r.name, level: r.level },
        workedOn: r.worked_on,
        hours: Number(r.hours),
        note: r.note,
        createdAt: iso(r.created_at),
      })),
      totalHours: total.toNumber(),
      plannedHours: firm ? Number(firm.labor_hours) : null,
    };
  }

  async recordIntake(user: AuthUser, bookingId: string, dto: RecordIntakeInput): Promise<IntakeItemView[]> {
    await this.db.transaction().execute(async (trx) => {
      const booking = await this.lockIn(trx, bookingId, ['scheduled', 'pedals_received'], 'intake can be recorded');
      const items = dto.items.map((i) => ({ item: i.item.trim(), condition: i.condition, note: i.note?.trim() ?? '' }));
      await this.builds.insertIntakeItems(trx, bookingId, user.id, items);
      const faulty = items.filter((i) => i.condition === 'faulty');
      await this.history.note(
        trx,
        booking,
        user,
        `Intake: ${items.length} item(s) checked` + (faulty.length ? `, faulty: ${faulty.map((f) => f.item).join(', ')}` : ', all working') + '.',
      );
    });
    return this.intake(bookingId);
  }

  async intake(bookingId: string): Promise<IntakeItemView[]> {
    await this.mustExist(bookingId);
    const rows = await this.builds.intakeItems(this.db, bookingId);
    return rows.map((r) => ({ id: r.id, item: r.item, condition: r.condition, note: r.note, recordedBy: r.recorded_by, createdAt: iso(r.created_at) }));
  }

  async proposeExtra(user: AuthUser, bookingId: string, dto: ProposeExtraInput): Promise<ExtraView> {
    return this.db.transaction().execute(async (trx) => {
      const booking = await this.lockIn(trx, bookingId, ['scheduled', 'pedals_received', 'on_bench', 'testing'], 'extras can be proposed');
      const row = await this.builds.insertExtra(trx, {
        bookingId,
        description: dto.description.trim(),
        amount: new Decimal(dto.amount).toFixed(2),
        reason: dto.reason.trim(),
        proposedBy: user.id,
      });
      await this.history.note(trx, booking, user, `Extra proposed for the player's approval: ${row.description}, ${row.amount} (${row.reason}).`);
      return this.toExtra(row);
    });
  }

  async decideExtra(user: AuthUser, bookingId: string, extraId: string, approve: boolean): Promise<ExtraView> {
    return this.db.transaction().execute(async (trx) => {
      const booking = await this.builds.lockBooking(trx, bookingId);
      if (!booking) throw new NotFoundException('There is no booking with that id.');
      if (booking.customer_id !== user.id) throw new ForbiddenException('Only the player who booked this build can decide on its extras.');
      const extra = await this.builds.lockExtra(trx, bookingId, extraId);
      if (!extra) throw new NotFoundException('There is no such extra on this booking.');
      if (extra.status !== 'proposed') throw new ConflictException(`This extra is already ${extra.status}.`);
      if (['ready', 'delivered', 'declined', 'cancelled', 'refunded'].includes(booking.state)) {
        throw new ConflictException(`Booking ${booking.reference} is ${stateWords(booking.state)}; its extras can no longer change.`);
      }
      const row = await this.builds.decideExtra(trx, extraId, approve ? 'approved' : 'declined');
      await this.history.note(trx, booking, user, `Extra ${approve ? 'approved' : 'declined'} by the player: ${extra.description}, ${extra.amount}.`);
      return this.toExtra(row!);
    });
  }

  async extras(user: AuthUser, bookingId: string): Promise<ExtraView[]> {
    const booking = await this.mustExist(bookingId);
    if (user.role === 'customer' && booking.customer_id !== user.id) throw new NotFoundException('There is no booking with that id.');
    return (await this.builds.extras(this.db, bookingId)).map((r) => this.toExtra(r));
  }

  async requestLayoutApproval(user: AuthUser, bookingId: string, note = '') {
    return this.db.transaction().execute(async (trx) => {
      const booking = await this.lockIn(trx, bookingId, ['on_bench'], 'a layout can be sent for approval');
      if (booking.awaiting_layout_approval) throw new ConflictException('The layout is already waiting for the player’s approval.');
      const updated = await this.builds.updateBooking(trx, bookingId, ['on_bench'], { awaiting_layout_approval: true });
      await this.history.note(trx, booking, user, `Layout sent to the player for approval${note.trim() ? `: ${note.trim()}` : '.'}`);
      return { bookingId, state: updated!.state, awaitingLayoutApproval: true };
    });
  }

  async approveLayout(user: AuthUser, bookingId: string, note = '') {
    return this.db.transaction().execute(async (trx) => {
      const booking = await this.builds.lockBooking(trx, bookingId);
      if (!booking) throw new NotFoundException('There is no booking with that id.');
      if (booking.customer_id !== user.id) throw new ForbiddenException('Only the player who booked this build can approve its layout.');
      if (!booking.awaiting_layout_approval) throw new ConflictException('There is no layout waiting for your approval.');
      const updated = await this.builds.updateBooking(trx, bookingId, [booking.state], { awaiting_layout_approval: false });
      await this.history.note(trx, booking, user, `Layout approved by the player${note.trim() ? `: ${note.trim()}` : '.'}`);
      return { bookingId, state: updated!.state, awaitingLayoutApproval: false };
    });
  }

  private toExtra(r: Awaited<ReturnType<BuildsRepository['extras']>>[number]): ExtraView {
    return {
      id: r.id,
      description: r.description,
      amount: r.amount,
      reason: r.reason,
      status: r.status,
      decidedAt: r.decided_at ? iso(r.decided_at) : null,
      createdAt: iso(r.created_at),
    };
  }
}
