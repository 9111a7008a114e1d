import type { MailTemplate } from '../mail.types';

type Stored = Record<string, unknown>;

const given = (value: unknown): value is string => typeof value === 'string' && value.trim() !== '';

/**
 * Moves a value from an older key to the one key the templates read now, then drops the older
 * key. `preferOld` keeps the precedence the templates used to give the older key when a row
 * carries both.
 */
function rename(data: Stored, from: string, to: string, preferOld = false) {
  if (!(from in data)) return;
  if (given(data[from]) && (preferOld || !given(data[to]))) data[to] = data[from];
  delete data[from];
}

/**
 * What to send, as the scheduled letter used to write it from `pedals` and the flags: the pedals
 * by name, a power supply unless `powerSupply` was false, a switcher only when `switcher` was true.
 */
function whatToShipFromPedals(data: Stored) {
  const pedals = Array.isArray(data.pedals) ? data.pedals.filter(given) : [];
  const listed = Array.isArray(data.whatToShip) ? data.whatToShip.filter(given) : [];
  if (listed.length === 0 && pedals.length > 0) {
    data.whatToShip = [
      `Your pedals (${pedals.length}): ${pedals.join(', ')}.`,
      ...(data.powerSupply === false ? [] : ['Your power supply, with all its leads.']),
      ...(data.switcher === true ? ['Your loop switcher, with its power lead and any MIDI or control cables.'] : []),
    ];
  }
  delete data.pedals;
  delete data.powerSupply;
  delete data.switcher;
}

/**
 * The one read-time upgrade of an outbox row's data: rows written before each datum had one key
 * name (the recipient as `customerName`, the booking page as `buildUrl`, the invitation link as
 * `acceptUrl`, a balance due as `amount`, the money paid as `depositPaid`, what to ship as
 * `pedals` with flags) read as if written today, so a pending row after an upgrade and a resend of
 * an old row render the same message they always did. Applied wherever stored data is read back
 * (rendering for delivery, renewing a resend's links); returns a new object.
 */
export function upgradeMailData(template: MailTemplate, stored: unknown): Stored {
  const data: Stored = stored && typeof stored === 'object' && !Array.isArray(stored) ? { ...(stored as Stored) } : {};
  rename(data, 'customerName', 'name');
  rename(data, 'buildUrl', 'bookingUrl');
  if (template === 'staff-invite') rename(data, 'acceptUrl', 'inviteUrl');
  if (template === 'balance-requested') {
    // The letter read `amount` before `balanceDue`.
    rename(data, 'amount', 'balanceDue', true);
    rename(data, 'depositPaid', 'paidSoFar');
  }
  if (template === 'booking-scheduled' || template === 'booking-rescheduled') whatToShipFromPedals(data);
  return data;
}
