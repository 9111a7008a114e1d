import { Injectable } from '@nestjs/common';
import { BookingsRepository } from '../bookings/bookings.repository';

/** Reads what a build sheet prints through the bookings' own repository: the booking and its people. */
@Injectable()
export class BuildSheetsRepository {
  constructor(private readonly bookings: BookingsRepository) {}

  findBooking(id: string) {
    return this.bookings
      .withPeopleNamed()
      .select([
        'b.configuration',
        'b.customer_notes',
        'b.bench_date',
        'b.expected_completion',
        'c.email as customer_email',
        'bu.name as builder_name',
        'bl.level as builder_level',
      ])
      .where('b.id', '=', id)
      .executeTakeFirst();
  }
}
