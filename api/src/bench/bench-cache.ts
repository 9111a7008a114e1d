import { Injectable } from '@nestjs/common';
import type { BenchLeadTime } from '@loomwright/shared';
import { DatabaseChanges, HeldWhileListening } from '../database/change-notifications';
import type { BenchRepository } from './bench.repository';
import type { ShopCalendar } from './bench.service';
import type { HourSlice } from './scheduling';

/** The channel the triggers of migration 20261203_0700 notify on every change the bench's reads depend on. */
export const BENCH_CHANNEL = 'bench_changed';

/** The tables whose triggers notify it (users: a builder's name, e-mail or password). */
export const BENCH_TABLES = [
  'bench_allocations',
  'shop_closures',
  'builder_absences',
  'shop_settings',
  'shop_holiday_choices',
  'builders',
  'users',
] as const;

export type BenchBuilderRow = Awaited<ReturnType<BenchRepository['listBuilders']>>[number];

/** A slice of bench time held by a booking, in centihours. */
export interface HeldSlice extends HourSlice {
  bookingId: string;
}

/**
 * The bench as the public lead time and the accept suggestions read it, on the shop's day it was
 * read: the calendar, the whole team (by name), every slice from that day on by builder and day,
 * and what has already been worked out from it (lead-time answers, each builder's first free day,
 * ship-by days).
 */
export interface BenchSnapshot {
  shop: ShopCalendar;
  team: BenchBuilderRow[];
  slices: Map<string, Map<string, HeldSlice[]>>;
  leadTimes: Map<string, BenchLeadTime>;
  /** Each builder's first day with free time on or after a day (`${builderId} ${from}`), null if none. */
  firstFreeDays: Map<string, string | null>;
  /** Each bench date's ship-by day. */
  shipBy: Map<string, string>;
  /** The first bench date the player can still ship for (`earliestBenchDateFor` the snapshot's today). */
  firstShippable?: string;
}

/**
 * Keeps the bench snapshot in memory while this process hears every change to it (`DatabaseChanges`):
 * statement triggers on bench_allocations, shop_closures, builder_absences, shop_settings,
 * shop_holiday_choices and builders, and a row trigger on a builder's account, notify
 * `bench_changed`. The writing process drops its copy as soon as its transaction commits (the
 * database driver reports this process's committed writes), so its very next read sees the write.
 */
@Injectable()
export class BenchCache extends HeldWhileListening<BenchSnapshot> {
  constructor(changes: DatabaseChanges) {
    super(changes, BENCH_CHANNEL, BENCH_TABLES);
  }
}
