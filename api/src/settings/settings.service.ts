import { BadRequestException, Injectable, NotFoundException } from '@nestjs/common';
import type { AddClosureResponse, CreateClosureInput, ShopClosureView, ShopSettingsView, UpdateSettingsInput } from '@loomwright/shared';
import { addDays, daysBetween, todayIn } from '../bench/calendar-days';
import { isKnownCountry, publicHolidaysBetween } from '../bench/public-holidays';
import { Database } from '../database/database';
import { SettingsRepository } from './settings.repository';


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
      locale: row.locale,
      contactEmail: row.contact_email,
      postalAddress: row.address_line1
        ? { line1: row.address_line1, line2: row.address_line2, city: row.address_city, region: row.address_region, postalCode: row.address_postal_code }
        : null,
      closures,
      upcomingHolidays: [...holidays.entries()].map(([date, name]) => ({ date, name })),
    };
  }

  async update(dto: UpdateSettingsInput): Promise<ShopSettingsView> {
    if (dto.countryCode && !isKnownCountry(dto.countryCode)) {
      throw new BadRequestException(`The country ${dto.countryCode.toUpperCase()} has no public-holiday data here; use a two-letter country code like US or GB.`);
    }
    const values = {
      ...(dto.name !== undefined && { name: dto.name }),
      ...(dto.tagline !== undefined && { tagline: dto.tagline }),
      ...(dto.contactEmail !== undefined && { contact_email: dto.contactEmail }),
      ...(dto.countryCode !== undefined && { country_code: dto.countryCode }),
      ...(dto.timezone !== undefined && { timezone: dto.timezone }),
      ...(dto.locale !== undefined && { locale: dto.locale }),
      ...(dto.postalAddress !== undefined && {
        address_line1: dto.postalAddress.line1,
        address_line2: dto.postalAddress.line2 ?? '',
        address_city: dto.postalAddress.city,
        address_region: dto.postalAddress.region ?? '',
        address_postal_code: dto.postalAddress.postalCode,
      }),
    };
    const updated = await this.settings.update(this.db, values);
    if (!updated) throw new NotFoundException('The shop has not been set up yet; run the seed or add its settings.');
    return this.get();
  }

  async closures(): Promise<ShopClosureView[]> {
    return (await this.settings.closures()).map((c) => ({ id: c.id, startsOn: c.starts_on, endsOn: c.ends_on, reason: c.reason }));
  }

  /** Adds a closure; builds already on the bench in those days are listed so the shop can move them. */
  async addClosure(dto: CreateClosureInput): Promise<AddClosureResponse> {
    return this.db.transaction().execute(async (trx) => {
      const row = await this.settings.insertClosure(trx, { startsOn: dto.startsOn, endsOn: dto.endsOn, reason: dto.reason });
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
