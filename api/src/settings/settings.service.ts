import { BadRequestException, Injectable, NotFoundException } from '@nestjs/common';
import type { AddClosureResponse, ShopClosureView, ShopSettingsView } from '@loomwright/shared';
import { addDays, daysBetween, todayIn } from '../bench/calendar-days';
import { isKnownCountry, publicHolidaysBetween } from '../bench/public-holidays';
import { Database } from '../database/database';
import type { CreateClosureDto } from './dto/create-closure.dto';
import type { UpdateSettingsDto } from './dto/update-settings.dto';
import { SettingsRepository } from './settings.repository';

const MAX_CLOSURE_DAYS = 366;

export function isTimeZone(name: string): boolean {
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: name });
    return true;
  } catch {
    return false;
  }
}

@Injectable()
export class SettingsService {
  constructor(
    private readonly db: Database,
    private readonly settings: SettingsRepository,
  ) {}

  async get(): Promise<ShopSettingsView> {
    const row = await this.settings.find();
    if (!row) throw new NotFoundException('The shop has not been set up yet; run the seed or add its settings.');
    const closures = await this.closures();
    const today = todayIn(row.timezone);
    const holidays = publicHolidaysBetween(row.country_code.trim(), today, addDays(today, 365));
    return {
      name: row.name,
      tagline: row.tagline,
      currency: row.currency.trim(),
      countryCode: row.country_code.trim(),
      timezone: row.timezone,
      contactEmail: row.contact_email,
      closures,
      upcomingHolidays: [...holidays.entries()].map(([date, name]) => ({ date, name })),
    };
  }

  async update(dto: UpdateSettingsDto): Promise<ShopSettingsView> {
    if (dto.countryCode && !isKnownCountry(dto.countryCode)) {
      throw new BadRequestException(`countryCode ${dto.countryCode.toUpperCase()} has no public-holiday data; use a two-letter ISO 3166-1 code like US or GB.`);
    }
    if (dto.timezone !== undefined && !isTimeZone(dto.timezone)) {
      throw new BadRequestException(`timezone ${dto.timezone} is not an IANA time zone name like America/Chicago.`);
    }
    const values = {
      ...(dto.name !== undefined && { name: dto.name.trim() }),
      ...(dto.tagline !== undefined && { tagline: dto.tagline.trim() }),
      ...(dto.contactEmail !== undefined && { contact_email: dto.contactEmail.trim().toLowerCase() }),
      ...(dto.countryCode !== undefined && { country_code: dto.countryCode.toUpperCase() }),
      ...(dto.timezone !== undefined && { timezone: dto.timezone }),
    };
    if (Object.keys(values).length === 0) throw new BadRequestException('Send at least one of name, tagline, contactEmail, countryCode, timezone.');
    const updated = await this.settings.update(this.db, values);
    if (!updated) throw new NotFoundException('The shop has not been set up yet; run the seed or add its settings.');
    return this.get();
  }

  async closures(): Promise<ShopClosureView[]> {
    return (await this.settings.closures()).map((c) => ({ id: c.id, startsOn: c.starts_on, endsOn: c.ends_on, reason: c.reason }));
  }

  /** Adds a closure; builds already on the bench in those days are listed so the shop can move them. */
  async addClosure(dto: CreateClosureDto): Promise<AddClosureResponse> {
    const span = daysBetween(dto.startsOn, dto.endsOn);
    if (span < 0) throw new BadRequestException('endsOn must be on or after startsOn.');
    if (span >= MAX_CLOSURE_DAYS) throw new BadRequestException(`A closure can last at most ${MAX_CLOSURE_DAYS} days; add another for longer.`);
    return this.db.transaction().execute(async (trx) => {
      const row = await this.settings.insertClosure(trx, { startsOn: dto.startsOn, endsOn: dto.endsOn, reason: dto.reason.trim() });
      const affected = await this.settings.buildsWithBenchTimeBetween(trx, dto.startsOn, dto.endsOn);
      return {
        id: row.id,
        startsOn: row.starts_on,
        endsOn: row.ends_on,
        reason: row.reason,
        buildsOnBenchThen: affected.map((a) => ({ bookingId: a.id, reference: a.reference, days: a.days })),
      };
    });
  }

  async deleteClosure(id: string): Promise<void> {
    const deleted = await this.settings.deleteClosure(this.db, id);
    if (!deleted) throw new NotFoundException('There is no closure with that id.');
  }
}
