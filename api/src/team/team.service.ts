import { Injectable, NotFoundException } from '@nestjs/common';
import Decimal from 'decimal.js';
import type { TeamMember, UpdateTeamMemberInput, WeeklyHours } from '@loomwright/shared';
import { Database } from '../database/database';
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
  ) {}

  async list(): Promise<TeamMember[]> {
    const rows = await this.team.list();
    return rows.map((r) => ({
      id: r.id,
      userId: r.user_id,
      name: r.name,
      email: r.email,
      level: r.level,
      hourlyRate: r.hourly_rate,
      weeklyHours: r.weekly_hours,
      weeklyCapacityHours: Object.values(r.weekly_hours).reduce<number>((s, h) => s + (h ?? 0), 0),
      active: r.active,
    }));
  }

  /**
   * Changes a builder's level, rate, week or availability. Bench time already allocated keeps the
   * capacity it was booked against; new acceptances plan on the new week.
   */
  async update(builderId: string, body: UpdateTeamMemberInput): Promise<TeamMember> {
    const values = {
      ...(body.level !== undefined && { level: body.level }),
      ...(body.hourlyRate !== undefined && { hourly_rate: new Decimal(body.hourlyRate).toFixed(2) }),
      ...(body.weeklyHours !== undefined && { weekly_hours: JSON.stringify(workingDays(body.weeklyHours)) }),
      ...(body.active !== undefined && { active: body.active }),
    };
    const updated = await this.team.update(this.db, builderId, values);
    if (!updated) throw new NotFoundException('There is no builder with that id on the team.');
    return (await this.list()).find((m) => m.id === builderId)!;
  }
}
