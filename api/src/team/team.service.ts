import { BadRequestException, Injectable, NotFoundException } from '@nestjs/common';
import Decimal from 'decimal.js';
import type {
  AbsenceInput,
  AddAbsenceResponse,
  AuthUser,
  BuilderAbsenceView,
  TeamMember,
  UpdateTeamMemberInput,
  WeeklyHours,
} from '@loomwright/shared';
import { daysBetween } from '../bench/calendar-days';
import { Database } from '../database/database';
import { BenchRepository } from '../bench/bench.repository';
import { TeamRepository } from './team.repository';

/** The days a builder works: a day of 0 hours is left out, as a day off. */
function workingDays(week: WeeklyHours): WeeklyHours {
  return Object.fromEntries(Object.entries(week).filter(([, h]) => h !== undefined && h > 0));
}

@Injectable()
export class TeamService {
  constructor(
    private readonly db: Database,
    private readonly team: TeamRepository,
    private readonly bench: BenchRepository,
  ) {}

  /**
   * The team as `viewer` may see it: the owner sees every rate; a builder sees their own rate and
   * their colleagues' names, levels and weeks (what planning the bench needs), not their rates.
   */
  async list(viewer: AuthUser): Promise<TeamMember[]> {
    const rows = await this.team.list();
    const seesRates = viewer.role === 'owner';
    return rows.map((r) => ({
      id: r.id,
      userId: r.user_id,
      name: r.name,
      email: r.email,
      level: r.level,
      hourlyRate: seesRates || r.user_id === viewer.id ? r.hourly_rate : null,
      weeklyHours: r.weekly_hours,
      weeklyCapacityHours: Object.values(r.weekly_hours).reduce<number>((s, h) => s + (h ?? 0), 0),
      active: r.active,
      status: !r.joined ? 'invited' : r.active ? 'active' : 'inactive',
      isMe: r.user_id === viewer.id,
      invitationExpiresAt: !r.joined && r.invitation_expires_at ? new Date(r.invitation_expires_at).toISOString() : null,
    }));
  }

  /**
   * Changes a builder's level, rate, week or availability. Bench time already allocated keeps the
   * capacity it was booked against; new acceptances plan on the new week.
   */
  async update(viewer: AuthUser, builderId: string, body: UpdateTeamMemberInput): Promise<TeamMember> {
    const values = {
      ...(body.level !== undefined && { level: body.level }),
      ...(body.hourlyRate !== undefined && { hourly_rate: new Decimal(body.hourlyRate).toFixed(2) }),
      ...(body.weeklyHours !== undefined && { weekly_hours: JSON.stringify(workingDays(body.weeklyHours)) }),
      ...(body.active !== undefined && { active: body.active }),
    };
    const updated = await this.bench.updateBuilder(this.db, builderId, values);
    if (!updated) throw new NotFoundException('There is no builder with that id on the team.');
    return (await this.list(viewer)).find((m) => m.id === builderId)!;
  }

  async absences(): Promise<BuilderAbsenceView[]> {
    return (await this.bench.absences()).map(absenceView);
  }

  /** A builder's days away; builds already on their bench then are listed so the shop can move them. */
  async addAbsence(builderId: string, input: AbsenceInput): Promise<AddAbsenceResponse> {
    if (daysBetween(input.startsOn, input.endsOn) >= 366)
      throw new BadRequestException('An absence can last at most 366 days; add another for longer.');
    return this.db.transaction().execute(async (trx) => {
      const builder = (await this.team.list(trx)).find((b) => b.id === builderId);
      if (!builder) throw new NotFoundException('There is no builder with that id.');
      const row = await this.bench.insertAbsence(trx, { builderId, ...input });
      const hit = await this.bench.buildsWithBenchTimeBetween(trx, input.startsOn, input.endsOn, builderId);
      return { ...absenceView(row), buildsOnBenchThen: hit.map((h) => ({ bookingId: h.id, reference: h.reference, days: h.days })) };
    });
  }

  async deleteAbsence(id: string): Promise<void> {
    if (!(await this.bench.deleteAbsence(this.db, id))) throw new NotFoundException('There is no absence with that id.');
  }
}

function absenceView(row: { id: string; builder_id: string; starts_on: string; ends_on: string; reason: string }): BuilderAbsenceView {
  return { id: row.id, builderId: row.builder_id, startsOn: row.starts_on, endsOn: row.ends_on, reason: row.reason };
}
