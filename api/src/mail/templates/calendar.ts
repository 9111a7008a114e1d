import ical, { ICalCalendarMethod, ICalEventStatus } from 'ical-generator';

export interface HandoverEvent {
  /** Stable per booking, so a re-sent invitation updates the same calendar entry (RFC 5545 §3.8.4.7 UID). */
  uid: string;
  day: string;
  summary: string;
  description: string;
  location?: string;
  shopName: string;
  /**
   * RFC 5545 §3.8.7.4 SEQUENCE: 0 on the first file, one more on every revision, so a calendar
   * program replaces the event it holds under the same UID instead of adding a second one.
   */
  sequence?: number;
  /** Withdraws the event: METHOD:CANCEL with STATUS:CANCELLED (RFC 5546 §3.2.5, RFC 5545 §3.8.1.11). */
  cancelled?: boolean;
}

/**
 * The ship-by or drop-off day as an RFC 5545 all-day event: DTSTART;VALUE=DATE on the day and
 * DTEND on the next (RFC 5545 §3.6.1: an all-day event's DTEND is exclusive), METHOD:PUBLISH
 * since nobody is asked to reply (METHOD:CANCEL when the booking is cancelled).
 */
export function handoverCalendar(event: HandoverEvent): string {
  const [y, m, d] = event.day.split('-').map(Number);
  // UTC-midnight Dates: with no calendar time zone, ical-generator writes an all-day date from the
  // Date's UTC parts, so the day is the same whatever the server's time zone is.
  const start = new Date(Date.UTC(y, m - 1, d));
  const end = new Date(Date.UTC(y, m - 1, d + 1));
  const calendar = ical({
    name: `${event.shopName}: your build`,
    prodId: { company: 'Loomwright', product: 'bookings', language: 'EN' },
    method: event.cancelled ? ICalCalendarMethod.CANCEL : ICalCalendarMethod.PUBLISH,
  });
  calendar.createEvent({
    id: event.uid,
    start,
    end,
    allDay: true,
    summary: event.summary,
    description: event.description,
    location: event.location ?? null,
    stamp: new Date(),
    sequence: event.sequence ?? 0,
    ...(event.cancelled ? { status: ICalEventStatus.CANCELLED } : {}),
  });
  return calendar.toString();
}
