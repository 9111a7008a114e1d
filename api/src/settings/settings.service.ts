import { BadRequestException, Injectable, NotFoundException } from '@nestjs/common';
import {
  shopWords,
  type AddClosureResponse,
  type AuthUser,
  type CreateClosureInput,
  type HolidayChoiceInput,
  type HolidayChoiceResponse,
  type HolidayChoiceView,
  type ShopClosureView,
  type ShopSettingsView,
  type UpdateSettingsInput,
} from '@loomwright/shared';
import { addDays, todayIn } from '../bench/calendar-days';
import { publicHolidaysBetween } from '../bench/public-holidays';
import { Database } from '../database/database';
import { BenchRepository } from '../bench/bench.repository';
import { shopProfileFields, shopSetUp } from '../shop/shop-profile';
import { SettingsRepository } from './settings.repository';

/** How many of the owner's holiday choices the settings page shows. */
const HOLIDAY_HISTORY_LINES = 20;

function choiceView(c: {
  day: string;
  holiday_name: string;
  shop_works: boolean;
  decided_at: Date;
  decided_by_name: string | null;
}): HolidayChoiceView {
  return { day: c.day, name: c.holiday_name, shopWorks: c.shop_works, decidedBy: c.decided_by_name, decidedAt: c.decided_at.toISOString() };
}

@Injectable()
export class SettingsService {
  constructor(
    private readonly db: Database,
    private readonly settings: SettingsRepository,
    private readonly bench: BenchRepository,
  ) {}

  async get(): Promise<ShopSettingsView> {
    const row = shopSetUp(await this.settings.find());
    const country = row.country_code.trim();
    const [closures, choices, history] = await Promise.all([
      this.closures(),
      this.bench.holidayChoices(this.db, country, { latestPerDay: true }),
      this.bench.holidayChoices(this.db, country, { newest: HOLIDAY_HISTORY_LINES }),
    ]);
    const worked = new Set(choices.filter((c) => c.shop_works).map((c) => c.day));
    const today = todayIn(row.timezone);
    const holidays = publicHolidaysBetween(country, today, addDays(today, 365));
    return {
      ...shopProfileFields(row),
      closures,
      upcomingHolidays: [...holidays.entries()].map(([date, name]) => ({ date, name, shopWorks: worked.has(date) })),
      holidayHistory: history.map(choiceView),
    };
  }

  async update(dto: UpdateSettingsInput): Promise<ShopSettingsView> {
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
    shopSetUp(await this.settings.update(this.db, values));
    return this.get();
  }

  /**
   * Switches one public holiday of the shop's country off (the shop works, the bench is open) or back
   * on. Each change adds a history row with who and when; asking for the state a day is already in
   * changes nothing. Closing a day again lists the builds that already hold bench time on it.
   */
  async chooseHoliday(user: AuthUser, day: string, dto: HolidayChoiceInput): Promise<HolidayChoiceResponse> {
    return this.db.transaction().execute(async (trx) => {
      const row = shopSetUp(await this.settings.find(trx));
      const country = row.country_code.trim();
      const name = publicHolidaysBetween(country, day, day).get(day);
      if (!name) throw new BadRequestException(shopWords.notAHoliday(day, country));
      await this.bench.lockHolidayDay(trx, country, day);
      const latest = (await this.bench.holidayChoices(trx, country, { latestPerDay: true })).find((c) => c.day === day);
      const current: HolidayChoiceView = latest ? choiceView(latest) : { day, name, shopWorks: false, decidedBy: null, decidedAt: '' };
      let view = current;
      if (current.shopWorks !== dto.shopWorks) {
        const inserted = await this.bench.insertHolidayChoice(trx, {
          countryCode: country,
          day,
          name,
          shopWorks: dto.shopWorks,
          decidedBy: user.id,
        });
        view = choiceView({ ...inserted, decided_by_name: user.name });
      }
      const affected = dto.shopWorks ? [] : await this.bench.buildsWithBenchTimeBetween(trx, day, day);
      return { ...view, buildsOnBenchThen: affected.map((a) => ({ bookingId: a.id, reference: a.reference, days: a.days })) };
    });
  }

  async closures(): Promise<ShopClosureView[]> {
    return (await this.bench.closures()).map((c) => ({ id: c.id, startsOn: c.starts_on, endsOn: c.ends_on, reason: c.reason }));
  }

  /** Adds a closure; builds already on the bench in those days are listed so the shop can move them. */
  async addClosure(dto: CreateClosureInput): Promise<AddClosureResponse> {
    return this.db.transaction().execute(async (trx) => {
      const row = await this.bench.insertClosure(trx, { startsOn: dto.startsOn, endsOn: dto.endsOn, reason: dto.reason });
      const affected = await this.bench.buildsWithBenchTimeBetween(trx, dto.startsOn, dto.endsOn);
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
    const deleted = await this.bench.deleteClosure(this.db, id);
    if (!deleted) throw new NotFoundException('There is no closure with that id.');
  }
}
