import { BadRequestException, Injectable, NotFoundException } from '@nestjs/common';
import Decimal from 'decimal.js';
import type { TeamMember, WeeklyHours } from '@loomwright/shared';
import { Database } from '../database/database';
import { TeamRepository } from './team.repository';
import type { UpdateTeamMemberDto } from './dto/update-team-member.dto';

const WEEKDAYS = ['1', '2', '3', '4', '5', '6', '7'] as const;

/** Checks a week of bench hours: ISO weekdays only, 0–24 h in quarter hours or finer (two decimals). */
export function parseWeeklyHours(input: unknown): WeeklyHours {
  if (!input || typeof input !== 'object' || Array.isArray(input)) throw new BadRequestException('weeklyHours must be an object of ISO weekday → hours');
  const out: WeeklyHours = {};
  for (const [key, value] of Object.entries(input as Record<string, unknown>)) {
    if (!(WEEKDAYS as readonly string[]).includes(key)) throw new BadRequestException(`weeklyHours has "${key}"; days are ISO weekdays 1 (Monday) to 7 (Sunday)`);
    if (typeof value !== 'number' || !Number.isFinite(value) || value < 0 || value > 24) {
      throw new BadRequestException(`weeklyHours.${key} must be a number of hours from 0 to 24`);
    }
    if (!new Decimal(value).times(100).isInteger()) throw new BadRequestException(`weeklyHours.${key} may have at most two decimals`);
    if (value > 0) out[key as keyof WeeklyHours] = value;
  }
  return out;
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
  async update(builderId: string, dto: UpdateTeamMemberDto): Promise<TeamMember> {
    const values = {
      ...(dto.level !== undefined && { level: dto.level }),
      ...(dto.hourlyRate !== undefined && { hourly_rate: new Decimal(dto.hourlyRate).toFixed(2) }),
      ...(dto.weeklyHours !== undefined && { weekly_hours: JSON.stringify(parseWeeklyHours(dto.weeklyHours)) }),
      ...(dto.active !== undefined && { active: dto.active }),
    };
    if (Object.keys(values).length === 0) throw new BadRequestException('Send at least one of level, hourlyRate, weeklyHours, active.');
    const updated = await this.team.update(this.db, builderId, values);
    if (!updated) throw new NotFoundException('There is no builder with that id on the team.');
    return (await this.list()).find((m) => m.id === builderId)!;
  }
}
