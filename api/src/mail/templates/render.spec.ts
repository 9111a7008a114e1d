import ICAL from 'ical.js';
import { describe, expect, it } from 'vitest';
import { mailTemplates, type MailTemplate, type MailTemplateData } from '../mail.types';
import { formatDay, formatMoney } from './format';
import { MailDataError, renderMail, renderStoredMail, type MessageContext, type ShopContext } from './render';

const shop: ShopContext = { name: 'Copperline Rig Works', contactEmail: 'bench@shop.example', timezone: 'America/Chicago' };

const scheduled: MailTemplateData['booking-scheduled'] = {
  name: 'Rosa Delgado-Finch',
  reference: 'LW-1042',
  benchDate: '2027-01-12',
  shipBy: '2027-01-08',
  builderLevel: 'journeyman',
  builderName: 'Wren Calloway',
  expectedCompletion: '2027-01-15',
  whatToShip: [
    'Your pedals (4): tuner, fuzz, analog delay, plate reverb.',
    'Your power supply, with all its leads.',
    'Your loop switcher, with its power lead and any MIDI or control cables.',
  ],
  bookingUrl: 'http://localhost:3000/builds/abc',
};

/** The same booking moved a week later: the calendar file's first revision. */
const rescheduled: MailTemplateData['booking-rescheduled'] = {
  ...scheduled,
  benchDate: '2027-01-19',
  shipBy: '2027-01-14',
  previousBenchDate: '2027-01-12',
  shift: '7 days later',
  reason: 'Your builder is ill this week.',
  calendarSequence: 1,
};

/** The same booking cancelled with its deposit refunded: the calendar file's second revision. */
const cancelled: MailTemplateData['booking-cancelled'] = {
  name: 'Rosa',
  reference: 'LW-1042',
  reason: 'The shop cannot source the case in time.',
  currency: 'USD',
  refundAmount: '280.00',
  shipBy: '2027-01-08',
  calendarSequence: 2,
};

/** The balance letter as the bench sends it when a build is ready. */
const balanceFromBench: MailTemplateData['balance-requested'] = {
  name: 'Rosa',
  reference: 'LW-1042',
  firmTotal: '1120.00',
  extras: '45.00',
  paidSoFar: '250.00',
  balanceDue: '915.00',
  currency: 'USD',
};

// Typed by template: a sample missing a key its template needs, or carrying one it lacks, fails to compile.
const samples: { [T in MailTemplate]: MailTemplateData[T] } = {
  welcome: { name: 'Rosa', signInUrl: 'http://localhost:3000/sign-in' },
  'password-reset': { name: 'Rosa', resetUrl: 'http://localhost:3000/reset?token=t0k3n', expiresAt: '2027-01-12T20:30:00Z' },
  'staff-invite': { name: 'Ivo', inviteUrl: 'http://localhost:3000/backoffice/invite?token=inv1', role: 'builder' },
  'booking-requested': {
    name: 'Rosa',
    reference: 'LW-1042',
    totalLow: '1120.00',
    totalHigh: '1400.5',
    deposit: '280.00',
    currency: 'USD',
    bookingUrl: 'http://x/b',
  },
  'deposit-received': {
    name: 'Rosa',
    reference: 'LW-1042',
    amount: '280.00',
    currency: 'USD',
    bookingUrl: 'http://x/b',
    expectedBenchDate: '2027-01-12',
  },
  'booking-scheduled': scheduled,
  'booking-rescheduled': rescheduled,
  'booking-cancelled': cancelled,
  'status-changed': { name: 'Rosa', reference: 'LW-1042', state: 'pedals_received', bookingUrl: 'http://x/b' },
  'balance-requested': { name: 'Rosa', reference: 'LW-1042', balanceDue: '1234567.8', currency: 'USD', payUrl: 'http://x/pay' },
  'deposit-refunded': { name: 'Rosa', reference: 'LW-1042', amount: '280.00', currency: 'USD' },
  'booking-declined': { name: 'Rosa', reference: 'LW-1042', reason: 'The rig needs a 14-loop switcher we cannot mount on that surface.' },
  'approval-requested': {
    name: 'Rosa',
    reference: 'LW-1042',
    kind: 'extra',
    description: 'Deeper road case',
    amount: '45.00',
    currency: 'USD',
    reason: 'The wah needs more depth.',
    bookingUrl: 'http://x/b',
  },
  'build-messages': {
    audience: 'player',
    name: 'Rosa',
    reference: 'LW-1042',
    messages: [{ author: 'Ivo', body: 'The case arrived; see the photo.', at: '2027-01-12T15:04:00Z', photos: 1 }],
    bookingUrl: 'http://x/b',
  },
  'shop-note': {
    name: 'Rosa',
    reference: 'LW-1042',
    note: 'Your supply has a spare 18 V output; we left it free.',
    bookingUrl: 'http://x/b',
  },
  'payment-failed': { name: 'Rosa', reference: 'LW-1042', amount: '280.00', currency: 'USD', reason: 'The bank account has been closed.' },
  'shop-payment-alert': {
    name: 'Rosa',
    alert: 'dispute-opened',
    reference: 'LW-1042',
    amount: '280.00',
    currency: 'USD',
    detail: 'fraudulent',
    backofficeUrl: 'http://x/backoffice/requests/1',
  },
  'shop-new-paid-request': {
    reference: 'LW-1042',
    name: 'Rosa',
    customerEmail: 'rosa@mail.example',
    amount: '280.00',
    currency: 'USD',
    backofficeUrl: 'http://x/backoffice/requests/1',
  },
  'ship-by-reminder': {
    name: 'Rosa',
    reference: 'LW-1042',
    shipBy: '2027-01-08',
    benchDate: '2027-01-13',
    daysLeft: 3,
    bookingUrl: 'http://x/b',
  },
  'shop-ship-by-reminder': {
    name: 'Wren',
    reference: 'LW-1042',
    playerName: 'Rosa',
    shipBy: '2027-01-08',
    benchDate: '2027-01-13',
    backofficeUrl: 'http://x/backoffice/requests/1',
  },
  'balance-reminder': {
    name: 'Rosa',
    reference: 'LW-1042',
    balanceDue: '840.00',
    currency: 'USD',
    readySince: '2027-01-15',
    payUrl: 'http://x/b',
  },
  'checkout-reminder': { name: 'Rosa', reference: 'LW-1042', kind: 'deposit', amount: '280.00', currency: 'USD', payUrl: 'http://x/b' },
  'request-expired': { name: 'Rosa', reference: 'LW-1042', days: 30, configureUrl: 'http://x/configure' },
  'password-changed': {
    name: 'Rosa',
    changedAt: '2027-01-10T15:04:00.000Z',
    how: 'signed-in',
    forgotPasswordUrl: 'http://x/forgot-password',
  },
  'configuration-quote': {
    name: 'Rosa',
    title: 'Stage board',
    currency: 'USD',
    totalLow: '1120.00',
    totalHigh: '1400.50',
    deposit: '280.00',
    priceBookVersion: '3',
    lines: [
      { label: 'Patch cables', quantity: '19 pcs', amount: '96.00' },
      { label: 'Mounting and wiring', quantity: '12 h', amount: '960.00', amountHigh: '1200.00' },
    ],
    pdfBase64: Buffer.from('%PDF-1.3 sample').toString('base64'),
    pdfFilename: 'loomwright-quote-stage-board-2026-12-02.pdf',
    openUrl: 'http://x/c/Ab3dE9xQ',
  },
};

describe('formatting', () => {
  it('shows money with the currency symbol, thousands separators and the minor unit', () => {
    // ISO 4217: USD has 2 minor-unit digits, JPY 0 (the Intl tables follow it).
    expect(formatMoney('1120', 'USD')).toBe('$1,120.00');
    expect(formatMoney('1234567.8', 'USD')).toBe('$1,234,567.80');
    expect(formatMoney('3500', 'JPY')).toBe('¥3,500');
    // A decimal string is formatted exactly: no binary float would print this 0.1 + 0.2 as .30.
    expect(formatMoney('0.30', 'USD')).toBe('$0.30');
    expect(() => formatMoney('12,50', 'USD')).toThrow(MailDataError);
  });

  // The default voice outside a shop (en-US); CLDR en yMMMEd is "EEE, MMM d, y".
  it('shows a calendar day with its weekday', () => {
    // 12 Jan 2027 is a Tuesday and 29 Feb 2028 a Tuesday (checked against a printed calendar, from memory).
    expect(formatDay('2027-01-12')).toBe('Tue, Jan 12, 2027');
    expect(formatDay('2028-02-29')).toBe('Tue, Feb 29, 2028');
    expect(() => formatDay('12/01/2027')).toThrow(MailDataError);
  });
});

describe('every template', () => {
  it.each(mailTemplates)('%s renders HTML and plain text with the shop name', (template) => {
    const mail = renderMail(template, samples[template], shop);
    expect(mail.subject.length).toBeGreaterThan(5);
    expect(mail.html).toContain('Copperline Rig Works');
    expect(mail.text).toContain('Copperline Rig Works');
    expect(mail.html).toMatch(/^<!doctype html>/);
    expect(mail.text).not.toMatch(/<\/?(p|table|a|div|h1|ul|li)\b/i);
  });

  // Stored rows are JSON: the types cannot vouch for them, so each renderer checks what it reads.
  it.each(mailTemplates.filter((t) => t !== 'welcome'))('%s refuses stored data without its required keys, naming one', (template) => {
    expect(() => renderStoredMail(template, {}, shop)).toThrow(/the data has no "\w+"/);
  });

  it('rejects an unknown template by name', () => {
    expect(() => renderStoredMail('newsletter', {}, shop)).toThrow('there is no template called "newsletter"');
  });

  it('escapes what a player typed into the HTML', () => {
    const mail = renderMail('booking-declined', { ...samples['booking-declined'], reason: '<script>alert(1)</script> & more' }, shop);
    expect(mail.html).toContain('&lt;script&gt;alert(1)&lt;/script&gt; &amp; more');
    expect(mail.html).not.toContain('<script>');
    expect(mail.text).toContain('<script>alert(1)</script> & more');
  });
});

describe('the values each message must carry', () => {
  it('configuration-quote lists every line (labor as its range), the totals and the link, and attaches the PDF as bytes', () => {
    const mail = renderMail('configuration-quote', samples['configuration-quote'], shop);
    expect(mail.subject).toBe('Stage board: your quote from Copperline Rig Works');
    expect(mail.text).toContain('Patch cables (19 pcs)');
    expect(mail.text).toContain('$96.00');
    expect(mail.text).toContain('$960.00 to $1,200.00');
    expect(mail.text).toContain('$1,120.00 to $1,400.50');
    expect(mail.text).toContain('http://x/c/Ab3dE9xQ');
    expect(mail.attachments).toEqual([
      {
        filename: 'loomwright-quote-stage-board-2026-12-02.pdf',
        contentType: 'application/pdf',
        content: samples['configuration-quote'].pdfBase64,
        encoding: 'base64',
      },
    ]);
  });

  it('configuration-quote refuses a line without an amount, naming it', () => {
    expect(() =>
      renderStoredMail('configuration-quote', { ...samples['configuration-quote'], lines: [{ label: 'Patch cables' }] }, shop),
    ).toThrow('line 1 of "lines"');
  });

  it('booking-requested lists the line items and links to the booking quote PDF', () => {
    const mail = renderMail(
      'booking-requested',
      { ...samples['booking-requested'], lines: [{ label: 'Hook-and-loop', quantity: '8 ft', amount: '40.00' }] },
      { ...shop, publicUrl: 'http://shop.test' },
      { bookingId: 'b-1' },
    );
    expect(mail.text).toContain('Hook-and-loop (8 ft)');
    expect(mail.text).toContain('$40.00');
    expect(mail.text).toContain('http://shop.test/api/bookings/b-1/quote.pdf');
  });

  it('password-reset carries the link and when it stops working, in the shop time zone', () => {
    const mail = renderMail('password-reset', samples['password-reset'], shop);
    expect(mail.html).toContain('http://localhost:3000/reset?token=t0k3n');
    expect(mail.text).toContain('http://localhost:3000/reset?token=t0k3n');
    // 20:30 UTC is 14:30 in Chicago in January (CST = UTC−6, IANA tz database).
    expect(mail.text).toContain('Tue, Jan 12, 2027, 2:30 PM CST');
  });

  it('staff-invite carries the invitation link', () => {
    expect(renderMail('staff-invite', samples['staff-invite'], shop).text).toContain('http://localhost:3000/backoffice/invite?token=inv1');
  });

  it('booking-requested shows the estimate range and the deposit', () => {
    const { text, html } = renderMail('booking-requested', samples['booking-requested'], shop);
    expect(text).toContain('$1,120.00 to $1,400.50');
    expect(text).toContain('$280.00');
    expect(html).toContain('$1,120.00 to $1,400.50');
  });

  it('deposit-received shows the amount and what happens next', () => {
    const { subject, text } = renderMail('deposit-received', samples['deposit-received'], shop);
    expect(subject).toBe('Deposit received for LW-1042: $280.00');
    expect(text).toContain('What happens next');
    expect(text).toContain('Tue, Jan 12, 2027');
  });

  it('booking-scheduled shows the dates, level, what to send and how to pack, and the cautions', () => {
    const { subject, text, html, attachments } = renderMail('booking-scheduled', scheduled, shop);
    expect(subject).toBe('Booked: bench date Tue, Jan 12, 2027 for LW-1042');
    expect(text).toContain('Bench date:');
    expect(text).toContain('Tue, Jan 12, 2027');
    expect(text).toContain('Fri, Jan 8, 2027');
    expect(text).toContain('Fri, Jan 15, 2027');
    expect(text).toContain('Wren Calloway (Journeyman builder)');
    expect(text).toContain('Your pedals (4): tuner, fuzz, analog delay, plate reverb.');
    expect(text).toContain('Your power supply');
    expect(text).toContain('Your loop switcher');
    // Packing advice, common practice in the trade (no published source).
    expect(text).toContain('Take the batteries out of every pedal.');
    expect(text).toContain('Wrap each pedal on its own');
    expect(text).toContain('label');
    expect(text).toContain('two people');
    expect(html).toContain('Take the batteries out of every pedal.');
    expect(attachments).toHaveLength(1);
  });

  it('booking-scheduled lists only what the caller listed, and says drop off for a drop-off', () => {
    const { text, attachments } = renderMail(
      'booking-scheduled',
      { ...scheduled, whatToShip: scheduled.whatToShip.slice(0, 2), handover: 'drop-off' },
      shop,
    );
    expect(text).not.toContain('loop switcher');
    expect(text).toContain('Drop off by:');
    expect(attachments[0].filename).toBe('LW-1042-drop-off.ics');
  });

  it('status-changed has its own words for pedals received, ready and delivered', () => {
    const received = renderMail('status-changed', samples['status-changed'], shop);
    expect(received.subject).toBe('Your pedals have arrived (LW-1042)');
    const ready = renderMail('status-changed', { ...samples['status-changed'], state: 'ready' }, shop);
    expect(ready.subject).toBe('Your board is ready (LW-1042)');
    const delivered = renderMail(
      'status-changed',
      { ...samples['status-changed'], state: 'delivered', tracking: 'Parcel 1Z-TEST-9' },
      shop,
    );
    expect(delivered.text).toContain('Parcel 1Z-TEST-9');
    expect(() => renderMail('status-changed', { ...samples['status-changed'], state: 'teleported' }, shop)).toThrow(
      '"teleported" is not a build state',
    );
  });

  it('balance-requested, deposit-refunded, booking-declined and the shop notice carry their amounts and reason', () => {
    expect(renderMail('balance-requested', samples['balance-requested'], shop).text).toContain('$1,234,567.80');
    expect(renderMail('deposit-refunded', samples['deposit-refunded'], shop).subject).toBe('Deposit refunded for LW-1042: $280.00');
    expect(renderMail('booking-declined', samples['booking-declined'], shop).text).toContain('14-loop switcher');
    const notice = renderMail('shop-new-paid-request', samples['shop-new-paid-request'], shop);
    expect(notice.text).toContain('Rosa <rosa@mail.example>');
    expect(notice.text).toContain('$280.00');
    expect(notice.text).toContain('http://x/backoffice/requests/1');
  });
});

// RFC 5545 (iCalendar), parsed by ical.js, a general-purpose iCalendar library from the npm registry.
function parse(content: string) {
  const component = new ICAL.Component(ICAL.parse(content));
  const event = component.getFirstSubcomponent('vevent')!;
  return { component, event, vevent: new ICAL.Event(event) };
}

describe('the booking-scheduled calendar attachment', () => {
  it('is a VCALENDAR 2.0 with one all-day VEVENT on the ship-by day', () => {
    const [file] = renderMail('booking-scheduled', scheduled, shop).attachments;
    expect(file.contentType).toContain('text/calendar');
    const { component, event, vevent } = parse(file.content);
    // RFC 5545 §3.7.4: VERSION:2.0 is required; §3.7.3 PRODID is required; §3.7.2 METHOD.
    expect(component.getFirstPropertyValue('version')).toBe('2.0');
    expect(component.getFirstPropertyValue('prodid')).toBeTruthy();
    expect(component.getFirstPropertyValue('method')).toBe('PUBLISH');
    // §3.6.1: a VALUE=DATE DTSTART is an all-day event; DTEND is exclusive, so one day is start+1.
    expect(vevent.startDate.isDate).toBe(true);
    expect(vevent.startDate.toString()).toBe('2027-01-08');
    expect(vevent.endDate.toString()).toBe('2027-01-09');
    // §3.8.4.7 UID and §3.8.7.2 DTSTAMP are required in a VEVENT.
    expect(vevent.uid).toBe('handover-LW-1042@loomwright.app');
    expect(event.getFirstPropertyValue('dtstamp')).toBeTruthy();
    expect(vevent.summary).toBe('Ship your pedals to Copperline Rig Works (booking LW-1042)');
    expect(vevent.description).toContain('Take the batteries out of every pedal.');
  });

  it('keeps the day whatever the server time zone (a leap day)', () => {
    const saved = process.env.TZ;
    let file = { content: '' };
    try {
      // Node re-reads TZ when it changes: UTC+14 and UTC−8 are the two ends that shift a date.
      for (const zone of ['Pacific/Kiritimati', 'America/Los_Angeles', 'UTC']) {
        process.env.TZ = zone;
        [file] = renderMail('booking-scheduled', { ...scheduled, shipBy: '2028-02-29' }, shop).attachments;
        expect(parse(file.content).vevent.startDate.toString()).toBe('2028-02-29');
      }
    } finally {
      process.env.TZ = saved;
    }
    // RFC 5545 §3.1: content lines are folded at 75 octets and end in CRLF.
    for (const line of file.content.split('\r\n')) expect(Buffer.byteLength(line)).toBeLessThanOrEqual(75);
  });
});

// The exact data shapes the calling modules send (accounts, bookings and payments, the bench): one
// row a caller, rendered and read for the words and figures that caller relies on.
const withPublicUrl = { ...shop, publicUrl: 'http://localhost:3000' };
interface FromCaller<T extends MailTemplate> {
  what: string;
  template: T;
  data: MailTemplateData[T];
  shop?: ShopContext;
  message?: MessageContext;
  subject?: string;
  texts: string[];
  calendar?: string;
}
// Typed per row: data a template does not take fails to compile.
const fromCaller = <T extends MailTemplate>(row: FromCaller<T>) => row as unknown as FromCaller<MailTemplate>;
const invited: MailTemplateData['staff-invite'] = {
  name: 'Ivo',
  invitedBy: 'Marta Okafor',
  level: 'journeyman',
  inviteUrl: 'http://localhost:3000/backoffice/accept-invite?token=abc',
  expiresAt: '2027-01-20T12:00:00Z',
};
const paidDeposit = { name: 'Rosa Delgado-Finch', reference: 'LW-1042', amount: '250.00', currency: 'USD' };
const paidRequestNotice: MailTemplateData['shop-new-paid-request'] = {
  ...paidDeposit,
  customerEmail: 'rosa@mail.example',
  totalLow: '980.00',
  totalHigh: '1210.00',
  backofficeUrl: 'http://localhost:3000/backoffice/requests',
};

describe('the data the calling modules send', () => {
  it.each([
    fromCaller({
      what: 'welcome from sign-up links to the configurator and the account',
      template: 'welcome',
      data: { name: 'Rosa', configureUrl: 'http://localhost:3000/configure', accountUrl: 'http://localhost:3000/account' },
      texts: ['Configure a board: http://localhost:3000/configure', 'Your account: http://localhost:3000/account'],
    }),
    fromCaller({
      what: 'staff-invite with its link, level and who invited',
      template: 'staff-invite',
      data: invited,
      texts: [
        "Marta Okafor has invited you to the shop's backoffice as a journeyman builder",
        'http://localhost:3000/backoffice/accept-invite?token=abc',
        'Wed, Jan 20, 2027, 6:00 AM CST',
      ],
    }),
    fromCaller({
      what: 'booking-requested without a link falls back to the booking page of the outbox row',
      template: 'booking-requested',
      data: {
        name: 'Rosa',
        reference: 'LW-1042',
        totalLow: '980.00',
        totalHigh: '1210.00',
        deposit: '250.00',
        currency: 'USD',
        quoteExpiresAt: '2027-02-01T18:00:00Z',
      },
      shop: withPublicUrl,
      message: { bookingId: 'b-1' },
      texts: ['$980.00 to $1,210.00', 'Pay the deposit: http://localhost:3000/builds/b-1', 'Estimate holds until:'],
    }),
    fromCaller({
      what: 'deposit-received from the payment webhook',
      template: 'deposit-received',
      data: { ...paidDeposit, bookingUrl: 'http://localhost:3000/builds/b-1' },
      texts: ['See your booking: http://localhost:3000/builds/b-1'],
    }),
    fromCaller({
      what: 'the shop notice from the payment webhook',
      template: 'shop-new-paid-request',
      data: paidRequestNotice,
      subject: 'New paid request LW-1042 from Rosa Delgado-Finch',
      texts: ['$980.00 to $1,210.00'],
    }),
    fromCaller({
      what: 'booking-scheduled from the bench, with its own list of what to ship and the money',
      template: 'booking-scheduled',
      data: {
        name: 'Rosa',
        reference: 'LW-1042',
        benchDate: '2027-01-12',
        shipBy: '2027-01-05',
        expectedCompletion: '2027-01-13',
        builderLevel: 'master',
        builderName: 'Ada Brightwater',
        firmTotal: '1120.00',
        deposit: '250.00',
        balanceDue: '870.00',
        currency: 'USD',
        whatToShip: ['Octave fuzz', 'Tape-style delay', 'Your power supply with its mains lead, labelled with your name'],
      },
      shop: withPublicUrl,
      message: { bookingId: 'b-1' },
      texts: [
        '- Octave fuzz',
        '- Your power supply with its mains lead, labelled with your name',
        '$1,120.00',
        '$870.00',
        'Tue, Jan 5, 2027',
        'See your booking: http://localhost:3000/builds/b-1',
      ],
      calendar: 'DTSTART;VALUE=DATE:20270105',
    }),
    fromCaller({
      what: 'status-changed from the bench lists pedals found faulty at intake',
      template: 'status-changed',
      data: {
        name: 'Rosa',
        reference: 'LW-1042',
        fromState: 'scheduled',
        state: 'pedals_received',
        note: '',
        faultyItems: [{ item: 'Phaser', note: 'crackles when the rate knob turns' }],
      },
      texts: ['Phaser: crackles when the rate knob turns'],
    }),
    fromCaller({
      what: 'balance-requested from the bench shows the breakdown and the amount due',
      template: 'balance-requested',
      data: balanceFromBench,
      subject: 'Balance due for LW-1042: $915.00',
      texts: ['Approved extras:', '$45.00'],
    }),
    fromCaller({
      what: 'booking-declined from the bench says how much was refunded',
      template: 'booking-declined',
      data: {
        name: 'Rosa',
        reference: 'LW-1042',
        reason: 'We do not wire mains inlets.',
        depositRefunded: true,
        refundAmount: '250.00',
        refundPending: false,
        currency: 'USD',
      },
      texts: ['Your deposit of $250.00 is refunded in full'],
    }),
  ])('$what', ({ template, data, shop: context, message, subject, texts, calendar }) => {
    const mail = renderMail(template, data, context ?? shop, message);
    if (subject !== undefined) expect(mail.subject).toBe(subject);
    for (const words of texts) expect(mail.text).toContain(words);
    if (calendar !== undefined) expect(mail.attachments[0].content).toContain(calendar);
  });
});

describe('the calendar file when a booking moves or is cancelled', () => {
  // RFC 5545 (iCalendar) and RFC 5546 (iTIP), parsed by ical.js (parse, above). §3.8.7.4 SEQUENCE:
  // a revision keeps the UID and carries a higher sequence number, so a calendar program updates
  // the event instead of adding a second one.

  const first = renderMail('booking-scheduled', scheduled, shop).attachments[0];

  it('an update keeps the UID, moves the day and raises SEQUENCE (RFC 5545 §3.8.7.4)', () => {
    const original = parse(first.content);
    const { subject, text, attachments } = renderMail('booking-rescheduled', rescheduled, shop);
    const update = parse(attachments[0].content);
    expect(update.component.getFirstPropertyValue('method')).toBe('PUBLISH');
    expect(update.vevent.uid).toBe(original.vevent.uid);
    expect(original.vevent.sequence).toBe(0);
    expect(update.vevent.sequence).toBe(1);
    expect(update.vevent.sequence).toBeGreaterThan(original.vevent.sequence);
    expect(update.vevent.startDate.toString()).toBe('2027-01-14');
    // 19 Jan 2027 is a Tuesday, 12 Jan 2027 a Tuesday (from memory, checked against a printed calendar).
    expect(subject).toBe('Moved: bench date Tue, Jan 19, 2027 for LW-1042 (was Tue, Jan 12, 2027)');
    expect(text).toContain('7 days later than before');
    expect(text).toContain('Your builder is ill this week.');
  });

  it('a cancellation is METHOD:CANCEL with STATUS:CANCELLED under the same UID and a higher SEQUENCE (RFC 5546 §3.2.5)', () => {
    const { attachments, text } = renderMail('booking-cancelled', cancelled, shop);
    expect(attachments[0].contentType).toContain('method=CANCEL');
    const cancel = parse(attachments[0].content);
    expect(cancel.component.getFirstPropertyValue('method')).toBe('CANCEL');
    expect(cancel.event.getFirstPropertyValue('status')).toBe('CANCELLED');
    expect(cancel.vevent.uid).toBe(parse(first.content).vevent.uid);
    expect(cancel.vevent.sequence).toBe(2);
    expect(text).toContain('Refunded to you');
    expect(text).toContain('$280.00');
  });

  it('a move after the pedals are in sends no calendar file and no packing list', () => {
    const { attachments, text } = renderMail('booking-rescheduled', { ...rescheduled, pedalsReceived: true }, shop);
    expect(attachments).toEqual([]);
    expect(text).not.toContain('How to pack');
    expect(text).toContain('already with us');
  });

  it('refuses a calendar sequence that is not a whole number from 0', () => {
    expect(() => renderMail('booking-rescheduled', { ...rescheduled, calendarSequence: -1 }, shop)).toThrow(MailDataError);
  });
});

// Rows written before each datum had one key name are still in outboxes after an upgrade (and are
// resent from the mail log): read through upgradeMailData, they render the same message as the same
// data under today's keys, and the words the older tests of each template expected.
describe('outbox rows stored under the older key names', () => {
  // A calendar file's DTSTAMP is the moment it was written; everything else must match.
  const same = (mail: ReturnType<typeof renderMail>) => ({
    ...mail,
    attachments: mail.attachments.map((a) => ({ ...a, content: a.content.replace(/^DTSTAMP:.*\r\n/m, '') })),
  });

  it('booking-scheduled: customerName, buildUrl and pedals with the flags', () => {
    // Today's data under the older keys: the list of what to ship was a list of pedals and flags.
    const { name, whatToShip: _list, bookingUrl, ...rest } = scheduled;
    const old = {
      ...rest,
      customerName: name,
      pedals: ['tuner', 'fuzz', 'analog delay', 'plate reverb'],
      switcher: true,
      buildUrl: bookingUrl,
    };
    const stored = renderStoredMail('booking-scheduled', old, shop);
    expect(same(stored)).toEqual(same(renderMail('booking-scheduled', scheduled, shop)));
    expect(stored.text).toContain('Hello Rosa Delgado-Finch');
    expect(stored.text).toContain('Your pedals (4): tuner, fuzz, analog delay, plate reverb.');
    expect(stored.text).toContain('Your loop switcher');
    expect(stored.text).toContain('See your booking: http://localhost:3000/builds/abc');
    // No supply when powerSupply was false; no switcher unless switcher was true.
    const bare = renderStoredMail(
      'booking-rescheduled',
      { ...old, switcher: false, powerSupply: false, previousBenchDate: '2027-01-05', shift: '7 days later', reason: 'Parts late.' },
      shop,
    );
    expect(bare.text).toContain('Your pedals (4)');
    expect(bare.text).not.toContain('Your power supply, with all its leads.');
    expect(bare.text).not.toContain('loop switcher');
  });

  it('staff-invite: acceptUrl (and an hourly rate the letter never read)', () => {
    const { inviteUrl, ...rest } = invited;
    const old = { ...rest, hourlyRate: '90.00', acceptUrl: inviteUrl };
    const stored = renderStoredMail('staff-invite', old, shop);
    expect(stored).toEqual(renderMail('staff-invite', invited, shop));
    expect(stored.text).toContain("Marta Okafor has invited you to the shop's backoffice as a journeyman builder");
    expect(stored.text).toContain('http://localhost:3000/backoffice/accept-invite?token=abc');
  });

  it('balance-requested: amount and depositPaid (amount first, as the letter read it)', () => {
    const old = {
      customerName: 'Rosa',
      reference: 'LW-1042',
      firmTotal: '1120.00',
      extras: '45.00',
      depositPaid: '250.00',
      amount: '915.00',
      currency: 'USD',
    };
    const stored = renderStoredMail('balance-requested', old, shop);
    expect(stored).toEqual(renderMail('balance-requested', balanceFromBench, shop));
    expect(stored.subject).toBe('Balance due for LW-1042: $915.00');
    expect(stored.text).toContain('Paid so far:');
    expect(renderStoredMail('balance-requested', { ...old, balanceDue: '1.00' }, shop).subject).toBe('Balance due for LW-1042: $915.00');
  });

  it('deposit-received, the shop notice and payment-failed: one data object with buildUrl', () => {
    const old = { ...paidRequestNotice, summary: '9 pedals, switcher', buildUrl: 'http://localhost:3000/builds/b-1' };
    const received = renderStoredMail('deposit-received', old, withPublicUrl, { bookingId: 'other' });
    expect(received).toEqual(
      renderMail('deposit-received', { ...paidDeposit, bookingUrl: 'http://localhost:3000/builds/b-1' }, withPublicUrl),
    );
    expect(received.text).toContain('See your booking: http://localhost:3000/builds/b-1');
    const notice = renderStoredMail('shop-new-paid-request', old, shop);
    expect(notice.subject).toBe('New paid request LW-1042 from Rosa Delgado-Finch');
    expect(notice.text).toContain('$980.00 to $1,210.00');
    const failed = renderStoredMail('payment-failed', { ...old, reason: 'The account is closed.', kind: 'deposit' }, shop);
    expect(failed.text).toContain('Open your build: http://localhost:3000/builds/b-1');
  });

  it('shop notices and letters named the player customerName', () => {
    for (const template of ['shop-payment-alert', 'shop-new-paid-request', 'booking-declined', 'status-changed'] as const) {
      const { name, ...rest } = samples[template];
      expect(renderStoredMail(template, { ...rest, customerName: name }, shop)).toEqual(renderMail(template, samples[template], shop));
    }
  });
});
