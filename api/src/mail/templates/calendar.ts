import ical, { ICalCalendarMethod } from 'ical-generator';

export interface HandoverEvent {
  /** Stable per booking, so a re-sent invitation updates the same calendar entry (RFC 5545 §3.8.4.7 UID). */
  uid: string;
  day: string;
  summary: string;
  description: string;
  location?: string;
  shopName: string;
}

/**
 * The ship-by or drop-off day as an RFC 5545 all-day event: DTSTART;VALUE=DATE on the day and
 * DTEND on the next (RFC 5545 §3.6.1: an all-day event's DTEND is exclusive), METHOD:PUBLISH
 * since nobody is asked to reply.
 */
export function handoverCalendar(event: HandoverEvent): string {
  const [y, m, d] = event.day.split('-').map(Number);
  // Local-midnight Dates: ical-generator writes an all-day date from the Date's local parts,
  // so this stays on the same calendar day whatever the server's time zone is.
  const start = new Date(y, m - 1, d);
  const end = new Date(y, m - 1, d + 1);
  const calendar = ical({
    name: `${event.shopName}: your build`,
    prodId: { company: 'Loomwright', product: 'bookings', language: 'EN' },
    method: ICalCalendarMethod.PUBLISH,
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
  });
  return calendar.toString();
}
