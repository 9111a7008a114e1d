import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BenchLeadTime, BenchSuggestResponse } from '@loomwright/shared';
import { addDays } from '../src/bench/calendar-days';
import { ACCEPTANCE_ALLOWANCE_DAYS, BenchService } from '../src/bench/bench.service';
import { createBooking, signIn } from './support/bench-fixtures';
import { createTestApp, type TestApp } from './support/test-app';

/**
 * GET /api/bench/lead-time: the date a player sees before paying. A builder accepting the paid
 * request must be able to offer it or an earlier day, so it is checked against the staff
 * suggestion for a booking of the same hours and level, on the same bench.
 */
describe('GET /api/bench/lead-time', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(async () => t.close());

  it('gives a stranger a date the shop can keep: the accept dialog offers it or an earlier one, and shipping starts two days out', async () => {
    const answer = (await request(t.app.getHttpServer()).get('/api/bench/lead-time?hours=7.00&level=journeyman').expect(200))
      .body as BenchLeadTime;
    expect(answer.earliestBenchDate).toMatch(/^\d{4}-\d{2}-\d{2}$/);
    expect(answer.expectedCompletion! >= answer.earliestBenchDate!).toBe(true);
    expect(answer.shipBy! < answer.earliestBenchDate!).toBe(true);
    // The player still has to pay and a builder to accept: shipping never starts today or tomorrow.
    const { today } = await t.app.get(BenchService).shopCalendar();
    expect(answer.shipBy! >= addDays(today, ACCEPTANCE_ALLOWANCE_DAYS)).toBe(true);
    // Nothing about who builds it or what else is booked.
    expect(Object.keys(answer).sort()).toEqual(['earliestBenchDate', 'expectedCompletion', 'laborHours', 'level', 'shipBy']);

    const booking = await createBooking(t.db, { laborHours: '7.00', minimumLevel: 'journeyman', state: 'deposit_paid' });
    const builder = await signIn(t.app, 'builder@shop.example');
    const suggest = (await builder.get(`/api/bench/suggest?bookingId=${booking.id}`).expect(200)).body as BenchSuggestResponse;
    const offered = suggest.suggestions
      .filter((s) => s.meetsMinimumLevel)
      .map((s) => s.benchDate)
      .sort();
    expect(offered[0]! <= answer.earliestBenchDate!).toBe(true);
  });

  it('counts only builders of the level asked for: a master rig waits for the master bench', async () => {
    const server = t.app.getHttpServer();
    const master = (await request(server).get('/api/bench/lead-time?hours=20&level=master').expect(200)).body as BenchLeadTime;
    const apprentice = (await request(server).get('/api/bench/lead-time?hours=20&level=apprentice').expect(200)).body as BenchLeadTime;
    // Every master may take an apprentice's rig, so the apprentice date is never later.
    expect(apprentice.earliestBenchDate! <= master.earliestBenchDate!).toBe(true);
  });

  it('answers bad input with a 400 in words, never 500', async () => {
    const server = t.app.getHttpServer();
    for (const query of [
      '',
      'hours=abc&level=master',
      'hours=0&level=master',
      'hours=-3&level=master',
      'hours=1e3&level=master',
      'hours=7&level=wizard',
      'hours=7',
      'level=master',
      'hours=7&hours=8&level=master',
    ]) {
      const res = await request(server).get(`/api/bench/lead-time?${query}`);
      expect(res.status, query).toBe(400);
      expect(JSON.stringify(res.body.message), query).toMatch(/Hours must|Choose a level/);
    }
  });
});
