import { Injectable } from '@nestjs/common';

/**
 * The clock messages and their e-mail windows are written by. One place to read the time, so a
 * test can move it on five minutes without waiting five minutes.
 */
@Injectable()
export class MessageClock {
  now(): Date {
    return new Date();
  }
}
