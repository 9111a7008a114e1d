import { Injectable } from '@nestjs/common';

/**
 * The reminder jobs' idea of "now", injected so that tests can set the time (a day, a week, an
 * hour past a reminder's due time) without waiting or touching the system clock.
 */
@Injectable()
export class ReminderClock {
  now(): Date {
    return new Date();
  }
}
