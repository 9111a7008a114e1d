import { bookingStateLabels, messageWords, type BookingState } from '@loomwright/shared';
import { isMailTemplate, type MailTemplate, type MailTemplateData, type QuoteMailLine } from '../mail.types';
import { handoverCalendar } from './calendar';
import { amountOf, formatDay, formatInstant, formatMoney, inShopVoice, MailDataError, optionalString, requireString } from './format';
import { letterHtml, letterText, type Block, type Letter } from './layout';
import { reminderDrafts } from './reminder-letters';
import { upgradeMailData } from './upgrade-data';

export interface ShopContext {
  name: string;
  contactEmail: string;
  timezone: string;
  /** BCP 47 locale and ISO 4217 currency of the shop: how amounts, days and moments are written. */
  locale?: string;
  currency?: string;
  /** The shop's postal address on one line, once the owner has set it (Settings). */
  postalAddress?: string | null;
  /** The storefront's address, for links a caller did not give (a booking's page). */
  publicUrl?: string;
}

/** Facts of the outbox row itself that a template may fall back on. */
export interface MessageContext {
  bookingId?: string | null;
}

export interface RenderedMail {
  subject: string;
  html: string;
  text: string;
  /** `content` is text, or base64 when `encoding` says so (a PDF). */
  attachments: { filename: string; contentType: string; content: string; encoding?: 'base64' }[];
}

type Draft = { subject: string; letter: Omit<Letter, 'shopName'>; attachments?: RenderedMail['attachments'] };
/** What a template's renderer reads: exactly its MailTemplateData, so a key the type lacks fails to compile. */
type Drafts = { [T in MailTemplate]: (data: MailTemplateData[T], shop: ShopContext) => Draft };
type Data<T extends MailTemplate> = MailTemplateData[T];

const levelWords: Record<string, string> = {
  apprentice: 'Apprentice builder',
  journeyman: 'Journeyman builder',
  master: 'Master builder',
};

const open = (label: string, url: string): Block => ({ kind: 'link', label, url });
const openIf = (label: string, url: string | undefined): Block[] => (url ? [open(label, url)] : []);

const recipient = (data: { name: string }) => requireString(data, 'name');

function strings(value: unknown): string[] {
  return Array.isArray(value) ? value.filter((v): v is string => typeof v === 'string' && v.trim() !== '') : [];
}

/**
 * A quote's line items as rows of a facts table: "Patch cables (19 pcs)" → "$96.00", a labor line
 * as its range. `lines` is [{label, quantity?, amount, amountHigh?}] with decimal-string amounts.
 */
function quoteLineRows(lines: QuoteMailLine[] | undefined, currency: string): [string, string][] {
  if (!Array.isArray(lines)) return [];
  return lines.map((line, i) => {
    const l: Partial<QuoteMailLine> = line ?? {};
    const label = optionalString(l, 'label');
    const amount = optionalString(l, 'amount');
    if (!label || !amount) throw new MailDataError(`line ${i + 1} of "lines" has no label or amount`);
    const quantity = optionalString(l, 'quantity');
    const high = optionalString(l, 'amountHigh');
    const value =
      high && high !== amount ? `${formatMoney(amount, currency)} to ${formatMoney(high, currency)}` : formatMoney(amount, currency);
    return [quantity ? `${label} (${quantity})` : label, value];
  });
}

// Packing and safety advice for the pedals, the supply and any switcher (common practice in the
// trade, no published source): loose batteries leak and short in transit; pedals packed
// together scratch and bend jacks; an unlabelled supply gets mixed up with the shop's own.
const packing: string[] = [
  'Take the batteries out of every pedal.',
  'Wrap each pedal on its own (bubble wrap or a soft cloth) so knobs and jacks cannot knock together.',
  'Put a label with your name and booking reference on the power supply, its leads and any switcher.',
  'Leave out patch cables, hook-and-loop and the old board unless we asked for them: we make new ones to length.',
  'Fill the box so nothing moves, and keep the tracking number; add it to your booking when you have it.',
];

/** The booking's calendar event is the ship-by (or drop-off) day, one UID per booking for its whole life. */
const handoverUid = (reference: string) => `handover-${reference}@loomwright.app`;

function calendarSequence(data: { calendarSequence?: number }): number {
  const value = data.calendarSequence ?? 0;
  if (typeof value !== 'number' || !Number.isInteger(value) || value < 0)
    throw new MailDataError('"calendarSequence" must be a whole number from 0');
  return value;
}

/** What a new bench date means for the player: the old date, how far it moved, and why. */
interface Move {
  previousBenchDate: string;
  shift: string;
  reason: string;
}

function bookingScheduled(data: Data<'booking-scheduled'>, shop: ShopContext, move?: Move): Draft {
  const reference = requireString(data, 'reference');
  const shipBy = requireString(data, 'shipBy');
  const level = requireString(data, 'builderLevel');
  if (!levelWords[level]) throw new MailDataError(`the builder level "${level}" is not apprentice, journeyman or master`);
  const bring = strings(data.whatToShip);
  if (bring.length === 0) throw new MailDataError('the data has no "whatToShip" (what the player must send)');
  const dropOff = data.handover === 'drop-off';
  const shipTo =
    optionalString(data, 'shipTo') ??
    (shop.postalAddress ? `${shop.name}, ${shop.postalAddress}` : `${shop.name} (ask ${shop.contactEmail} for the address)`);
  const currency = optionalString(data, 'currency');
  const figures: [string, string][] = currency
    ? (
        [
          ['Firm quote', optionalString(data, 'firmTotal')],
          ['Deposit paid', optionalString(data, 'deposit')],
          ['Balance due when the board is ready', optionalString(data, 'balanceDue')],
        ] as [string, string | undefined][]
      )
        .filter((row): row is [string, string] => !!row[1])
        .map(([label, amount]) => [label, formatMoney(amount, currency)])
    : [];
  const verb = dropOff ? 'Drop off' : 'Ship';
  const shipByWords = formatDay(shipBy);
  // Once the pedals are in, there is nothing left to ship: no calendar file to update.
  const pedalsIn = data.pedalsReceived === true;
  const calendar = handoverCalendar({
    uid: handoverUid(reference),
    sequence: calendarSequence(data),
    day: shipBy,
    summary: `${verb} your pedals to ${shop.name} (booking ${reference})`,
    description: [
      `${dropOff ? 'Bring' : 'Send'} by ${shipByWords}:`,
      ...bring.map((b) => `- ${b}`),
      '',
      'Packing:',
      ...packing.map((p) => `- ${p}`),
    ].join('\n'),
    location: shipTo,
    shopName: shop.name,
  });
  const benchDate = formatDay(requireString(data, 'benchDate'));
  const quotedHigh = optionalString(data, 'quotedHigh');
  const overrideReason = optionalString(data, 'levelOverrideReason');
  const priceBlocks: Block[] = [
    ...(overrideReason ? [{ kind: 'p' as const, text: `Why this builder: ${overrideReason}` }] : []),
    ...(data.priceConsentNeeded === true && currency && quotedHigh
      ? [
          {
            kind: 'p' as const,
            text: `The firm quote is above the estimate we gave you (up to ${formatMoney(quotedHigh, currency)}). We keep your deposit only once you agree to the new price on your booking page; if you would rather not, cancel there and the whole deposit comes back to you.`,
          },
        ]
      : []),
  ];
  return {
    subject: move
      ? `Moved: bench date ${benchDate} for ${reference} (was ${formatDay(move.previousBenchDate)})`
      : `Booked: bench date ${benchDate} for ${reference}`,
    letter: {
      heading: move ? 'Your build has a new bench date' : `Your build has a bench date`,
      blocks: [
        move
          ? {
              kind: 'p',
              text: `Hello ${recipient(data)}, we moved your build ${reference} to ${benchDate}, ${move.shift} than before. Why: ${move.reason}`,
            }
          : { kind: 'p', text: `Hello ${recipient(data)}, your build ${reference} is on our bench schedule.` },
        {
          kind: 'facts',
          rows: [
            ['Bench date', benchDate],
            ...(move ? [['Was', formatDay(move.previousBenchDate)] as [string, string]] : []),
            ...(pedalsIn ? [] : [[dropOff ? 'Drop off by' : 'Ship to arrive by', shipByWords] as [string, string]]),
            ['Builder', optionalString(data, 'builderName') ? `${data.builderName} (${levelWords[level]})` : levelWords[level]],
            ['Expected completion', formatDay(requireString(data, 'expectedCompletion'))],
            [dropOff ? 'Drop off at' : 'Ship to', shipTo],
            ...figures,
          ],
        },
        ...priceBlocks,
        ...(pedalsIn
          ? [{ kind: 'p' as const, text: 'Your pedals are already with us; there is nothing to send.' }]
          : [
              { kind: 'list' as const, title: `What to ${dropOff ? 'bring' : 'send'}`, items: bring },
              { kind: 'list' as const, title: 'How to pack', items: packing },
            ]),
        {
          kind: 'caution',
          text: 'A loaded board in a road case is heavy: lift it with two people. Do not open or rewire your power supply; anything on the mains side is work for a qualified person under your local electrical codes.',
        },
        ...(pedalsIn
          ? []
          : [
              {
                kind: 'p' as const,
                text: move
                  ? `The attached calendar file updates the ${dropOff ? 'drop-off' : 'shipping'} day already in your calendar.`
                  : `The attached calendar file puts the ${dropOff ? 'drop-off' : 'shipping'} day in your calendar.`,
              },
            ]),
        ...openIf('See your booking', optionalString(data, 'bookingUrl')),
      ],
    },
    attachments: pedalsIn
      ? []
      : [
          {
            filename: `${reference}-${dropOff ? 'drop-off' : 'ship-by'}.ics`,
            contentType: 'text/calendar; charset=utf-8; method=PUBLISH',
            content: calendar,
          },
        ],
  };
}

function bookingRescheduled(data: Data<'booking-rescheduled'>, shop: ShopContext): Draft {
  return bookingScheduled(data, shop, {
    previousBenchDate: requireString(data, 'previousBenchDate'),
    shift: requireString(data, 'shift'),
    reason: requireString(data, 'reason'),
  });
}

function bookingCancelled(data: Data<'booking-cancelled'>, shop: ShopContext): Draft {
  const reference = requireString(data, 'reference');
  const currency = requireString(data, 'currency');
  const refund = optionalString(data, 'refundAmount');
  const kept = optionalString(data, 'keptAmount');
  const shipBy = optionalString(data, 'shipBy');
  const calendar = shipBy
    ? handoverCalendar({
        uid: handoverUid(reference),
        sequence: calendarSequence(data),
        cancelled: true,
        day: shipBy,
        summary: `Cancelled: ship your pedals to ${shop.name} (booking ${reference})`,
        description: `Booking ${reference} is cancelled; there is nothing to send.`,
        shopName: shop.name,
      })
    : null;
  return {
    subject: `Cancelled: build ${reference}`,
    letter: {
      heading: 'Your build is cancelled',
      blocks: [
        {
          kind: 'p',
          text: `Hello ${recipient(data)}, your build ${reference} is cancelled and its bench time released. Why: ${requireString(data, 'reason')}`,
        },
        {
          kind: 'facts',
          rows: [
            ...(refund ? [['Refunded to you', formatMoney(refund, currency)] as [string, string]] : []),
            ...(kept ? [['Deposit kept, per the deposit policy', formatMoney(kept, currency)] as [string, string]] : []),
          ],
        },
        ...(data.pedalsAtShop === true
          ? [{ kind: 'p' as const, text: 'Your pedals are with us: we will write to arrange their return.' }]
          : []),
        ...(calendar ? [{ kind: 'p' as const, text: 'The attached calendar file removes the shipping day from your calendar.' }] : []),
        ...openIf('See your booking', optionalString(data, 'bookingUrl')),
      ],
    },
    attachments: calendar
      ? [{ filename: `${reference}-cancelled.ics`, contentType: 'text/calendar; charset=utf-8; method=CANCEL', content: calendar }]
      : [],
  };
}

const statusWords: Partial<Record<BookingState, { subject: string; heading: string; text: string }>> = {
  pedals_received: {
    subject: 'Your pedals have arrived',
    heading: 'Your pedals are here and checked in',
    text: 'We unpacked your parcel and tested every pedal and the power supply. If anything was already faulty we will tell you before the build starts, since it may change the plan.',
  },
  on_bench: {
    subject: 'Your build is on the bench',
    heading: 'Your build is on the bench',
    text: 'Your builder has started mounting and wiring your board.',
  },
  testing: {
    subject: 'Your board is being tested',
    heading: 'Your board is being tested',
    text: 'We are testing every path of the signal chain and every switcher preset.',
  },
  ready: {
    subject: 'Your board is ready',
    heading: 'Your board is finished and tested',
    text: 'Your board is built and has passed its tests. Once the balance is paid we ship it or you can collect it.',
  },
  delivered: {
    subject: 'Your board is on its way to you',
    heading: 'Your board has been handed over',
    text: 'Your board has left the shop. Thank you for building with us.',
  },
};

function statusChanged(data: Data<'status-changed'>): Draft {
  const reference = requireString(data, 'reference');
  const state = requireString(data, 'state');
  const words = statusWords[state as BookingState];
  const label = bookingStateLabels[state as BookingState];
  if (!words && !label) throw new MailDataError(`"${state}" is not a build state`);
  const note = optionalString(data, 'note');
  const tracking = optionalString(data, 'tracking');
  const faulty = Array.isArray(data.faultyItems)
    ? (data.faultyItems as { item?: unknown; note?: unknown }[])
        .filter((f) => typeof f?.item === 'string')
        .map((f) => (typeof f.note === 'string' && f.note.trim() ? `${f.item as string}: ${f.note}` : (f.item as string)))
    : [];
  return {
    subject: `${words?.subject ?? `Your build is now: ${label}`} (${reference})`,
    letter: {
      heading: words?.heading ?? `Your build is now: ${label}`,
      blocks: [
        { kind: 'p', text: `Hello ${recipient(data)}, an update on build ${reference}.` },
        ...(words ? [{ kind: 'p' as const, text: words.text }] : []),
        ...(note ? [{ kind: 'p' as const, text: `From your builder: ${note}` }] : []),
        ...(faulty.length
          ? [
              {
                kind: 'list' as const,
                title: 'Already faulty when it arrived (we will talk with you before the build starts)',
                items: faulty,
              },
            ]
          : []),
        ...(tracking ? [{ kind: 'facts' as const, rows: [['Tracking', tracking]] as [string, string][] }] : []),
        ...(state === 'delivered'
          ? [
              {
                kind: 'caution' as const,
                text: "A loaded board in a road case is heavy: lift it with two people. Check each pedal's voltage and polarity before you power up anything you add later.",
              },
            ]
          : []),
        ...openIf('See your booking', optionalString(data, 'bookingUrl')),
      ],
    },
  };
}

/** An extra (with its price) or a top-view layout waiting for the player's yes or no. */
function approvalRequested(data: Data<'approval-requested'>): Draft {
  const reference = requireString(data, 'reference');
  const kind = requireString(data, 'kind');
  if (kind !== 'extra' && kind !== 'layout') throw new MailDataError(`the approval kind "${kind}" is not extra or layout`);
  const message = optionalString(data, 'message');
  const answer = optionalString(data, 'approveUrl') ?? optionalString(data, 'bookingUrl');
  if (kind === 'extra') {
    const description = requireString(data, 'description');
    const price = amountOf(data);
    return {
      subject: `Your approval, please: ${description} for ${price} (${reference})`,
      letter: {
        heading: 'An extra for your board needs your yes',
        blocks: [
          { kind: 'p', text: `Hello ${recipient(data)}, while working on build ${reference} your builder found something it needs.` },
          {
            kind: 'facts',
            rows: [
              ['Extra', description],
              ['Price', price],
              ['Why', requireString(data, 'reason')],
            ],
          },
          {
            kind: 'p',
            text: 'Nothing is added to your bill unless you approve it. Approve or decline on your build page; you can add a comment for the builder.',
          },
          ...openIf('Approve or decline', answer),
        ],
      },
    };
  }
  return {
    subject: `Your approval, please: the layout of build ${reference}`,
    letter: {
      heading: 'Please look over your board layout',
      blocks: [
        {
          kind: 'p',
          text: `Hello ${recipient(data)}, before cutting cables your builder would like you to check the top view of your board for build ${reference}.`,
        },
        ...(message ? [{ kind: 'p' as const, text: `From your builder: ${message}` }] : []),
        { kind: 'p', text: 'The build waits for your answer. Approve it, or decline with a comment saying what you would like moved.' },
        ...openIf('See the layout and answer', answer),
      ],
    },
  };
}

const drafts: Drafts = {
  ...reminderDrafts,
  'approval-requested': (data) => approvalRequested(data),
  'build-messages': (data) => buildMessages(data),
  'shop-note': (data) => {
    const reference = requireString(data, 'reference');
    return {
      subject: `A note about build ${reference}`,
      letter: {
        heading: 'A note from your builder',
        blocks: [
          { kind: 'p', text: `Hello ${recipient(data)}, a word about build ${reference}:` },
          { kind: 'p', text: requireString(data, 'note') },
          ...openIf('See your booking', optionalString(data, 'bookingUrl')),
        ],
      },
    };
  },
  welcome: (data, shop) => ({
    subject: `Welcome to ${shop.name}`,
    letter: {
      heading: `Welcome, ${recipient(data)}`,
      blocks: [
        { kind: 'p', text: 'Your account is ready. You can configure a board, see a live estimate and request a build whenever you like.' },
        ...openIf('Configure a board', optionalString(data, 'configureUrl')),
        ...openIf('Sign in', optionalString(data, 'signInUrl')),
        ...openIf('Your account', optionalString(data, 'accountUrl')),
      ],
    },
  }),
  'password-reset': (data, shop) => ({
    subject: `Reset your ${shop.name} password`,
    letter: {
      heading: 'Reset your password',
      blocks: [
        {
          kind: 'p',
          text: `Hello ${recipient(data)}, someone asked to reset the password of this account. If it was you, choose a new one with the link below.`,
        },
        open('Choose a new password', requireString(data, 'resetUrl')),
        { kind: 'facts', rows: [['Link works until', formatInstant(requireString(data, 'expiresAt'), shop.timezone)]] },
        { kind: 'p', text: 'If you did not ask for this, ignore this message: your password stays as it is.' },
      ],
    },
  }),
  'password-changed': (data, shop) => ({
    subject: `Your ${shop.name} password was changed`,
    letter: {
      heading: 'Your password was changed',
      blocks: [
        {
          kind: 'p',
          text: `Hello ${recipient(data)}, the password of this account was changed ${
            data.how === 'reset-link' ? 'with a reset link sent to this address' : 'by someone signed in to it'
          }. Every device that was signed in has been signed out.`,
        },
        { kind: 'facts', rows: [['Changed at', formatInstant(requireString(data, 'changedAt'), shop.timezone)]] },
        {
          kind: 'p',
          text: 'If this was you, there is nothing more to do. If it was not, choose a new password now with the link below, and reply to this message so the shop knows.',
        },
        open('Choose a new password', requireString(data, 'forgotPasswordUrl')),
      ],
    },
  }),
  'staff-invite': (data, shop) => ({
    subject: `You are invited to the ${shop.name} backoffice`,
    letter: {
      heading: `Join the ${shop.name} team`,
      blocks: [
        {
          kind: 'p',
          text: `Hello ${recipient(data)}, ${optionalString(data, 'invitedBy') ? `${data.invitedBy} has` : 'you have been'} invited you to the shop's backoffice${
            typeof data.level === 'string'
              ? ` as a ${data.level} builder`
              : data.role === 'owner'
                ? ' as an owner'
                : data.role === 'builder'
                  ? ' as a builder'
                  : ''
          }. Set your password with the link below.`,
        },
        open('Accept the invitation', requireString(data, 'inviteUrl')),
        ...(optionalString(data, 'expiresAt')
          ? [
              {
                kind: 'facts' as const,
                rows: [['Invitation works until', formatInstant(data.expiresAt!, shop.timezone)]] as [string, string][],
              },
            ]
          : []),
      ],
    },
  }),
  'booking-requested': (data, shop) => {
    const reference = requireString(data, 'reference');
    const currency = requireString(data, 'currency');
    return {
      subject: `We have your build request ${reference}`,
      letter: {
        heading: 'Your build request is in',
        blocks: [
          { kind: 'p', text: `Hello ${recipient(data)}, thank you for your request ${reference}.` },
          {
            kind: 'facts',
            rows: [
              [
                'Estimate',
                `${formatMoney(requireString(data, 'totalLow'), currency)} to ${formatMoney(requireString(data, 'totalHigh'), currency)}`,
              ],
              ['Deposit to hold your place', formatMoney(requireString(data, 'deposit'), currency)],
              ...(optionalString(data, 'quoteExpiresAt')
                ? [['Estimate holds until', formatInstant(data.quoteExpiresAt!, shop.timezone)] as [string, string]]
                : []),
            ],
          },
          ...(Array.isArray(data.lines) && data.lines.length
            ? [
                { kind: 'p' as const, text: 'What the estimate is made of:' },
                { kind: 'facts' as const, rows: quoteLineRows(data.lines, currency) },
              ]
            : []),
          {
            kind: 'p',
            text: 'Your place in the queue is held once the deposit is paid. Pedals, power supply and switcher are yours and not part of the price.',
          },
          ...openIf('Pay the deposit', optionalString(data, 'bookingUrl')),
          ...openIf('Open the quote (PDF, after signing in)', optionalString(data, 'quotePdfUrl')),
        ],
      },
    };
  },
  'configuration-quote': (data, shop) => {
    const currency = requireString(data, 'currency');
    const title = optionalString(data, 'title') ?? 'Your quote';
    const pdf = requireString(data, 'pdfBase64');
    const filename = (optionalString(data, 'pdfFilename') ?? 'quote.pdf').replace(/[^A-Za-z0-9._-]+/g, '-');
    return {
      subject: `${title}: your quote from ${shop.name}`,
      letter: {
        heading: title,
        blocks: [
          {
            kind: 'p',
            text: `Hello ${recipient(data)}, here is the quote you asked for. The PDF attached has every line, the layout, the power plan, the patch cables and the cautions.`,
          },
          { kind: 'facts', rows: quoteLineRows(data.lines, currency) },
          {
            kind: 'facts',
            rows: [
              [
                'Estimated total',
                `${formatMoney(requireString(data, 'totalLow'), currency)} to ${formatMoney(requireString(data, 'totalHigh'), currency)}`,
              ],
              ['Deposit to book bench time', formatMoney(requireString(data, 'deposit'), currency)],
              ...(optionalString(data, 'priceBookVersion') ? [['Price book version', data.priceBookVersion!] as [string, string]] : []),
            ],
          },
          {
            kind: 'p',
            text: 'An estimate, priced from today’s price book: the shop confirms a firm price when it accepts a request. Pedals, power supply and switcher are yours and not part of the price.',
          },
          ...openIf('Open this configuration', optionalString(data, 'openUrl')),
        ],
      },
      attachments: [{ filename, contentType: 'application/pdf', content: pdf, encoding: 'base64' }],
    };
  },
  'deposit-received': (data) => {
    const reference = requireString(data, 'reference');
    const expected = optionalString(data, 'expectedBenchDate');
    return {
      subject: `Deposit received for ${reference}: ${amountOf(data)}`,
      letter: {
        heading: 'Thank you, your deposit is paid',
        blocks: [
          { kind: 'p', text: `Hello ${recipient(data)}, we received your deposit for build ${reference}.` },
          {
            kind: 'facts',
            rows: [
              ['Deposit paid', amountOf(data)],
              ...(expected ? [['Expected bench date', formatDay(expected)] as [string, string]] : []),
            ],
          },
          {
            kind: 'list',
            title: 'What happens next',
            items: [
              'A builder reviews your rig and sets a bench date the schedule can hold.',
              'You get an e-mail with the bench date, the day to ship or drop off your pedals, and how to pack them.',
              'Do not send anything yet: wait for that message.',
            ],
          },
          ...openIf('See your booking', optionalString(data, 'bookingUrl')),
        ],
      },
    };
  },
  'booking-scheduled': (data, shop) => bookingScheduled(data, shop),
  'booking-rescheduled': bookingRescheduled,
  'booking-cancelled': bookingCancelled,
  'status-changed': (data) => statusChanged(data),
  'balance-requested': (data) => {
    const reference = requireString(data, 'reference');
    const currency = requireString(data, 'currency');
    const due = formatMoney(requireString(data, 'balanceDue'), currency);
    const breakdown = (
      [
        ['Firm quote', optionalString(data, 'firmTotal')],
        ['Approved extras', optionalString(data, 'extras')],
        ['Paid so far', optionalString(data, 'paidSoFar')],
      ] as [string, string | undefined][]
    )
      .filter((row): row is [string, string] => !!row[1])
      .map(([label, amount]): [string, string] => [label, formatMoney(amount, currency)]);
    return {
      subject: `Balance due for ${reference}: ${due}`,
      letter: {
        heading: 'Your board is ready: the balance is due',
        blocks: [
          { kind: 'p', text: `Hello ${recipient(data)}, build ${reference} is finished and tested.` },
          { kind: 'facts', rows: [...breakdown, ['Balance due', due]] },
          { kind: 'p', text: 'We ship your board, or you can collect it, as soon as the balance is paid.' },
          ...openIf('Pay the balance', optionalString(data, 'payUrl') ?? optionalString(data, 'bookingUrl')),
        ],
      },
    };
  },
  'deposit-refunded': (data) => {
    const reference = requireString(data, 'reference');
    return {
      subject: `Deposit refunded for ${reference}: ${amountOf(data)}`,
      letter: {
        heading: 'Your deposit has been refunded',
        blocks: [
          { kind: 'p', text: `Hello ${recipient(data)}, we refunded the deposit for build ${reference}.` },
          { kind: 'facts', rows: [['Refunded', amountOf(data)]] },
          { kind: 'p', text: 'It goes back to the card you paid with; banks usually take 5 to 10 working days to show it.' },
        ],
      },
    };
  },
  'booking-declined': (data) => {
    const reference = requireString(data, 'reference');
    return {
      subject: `We cannot take on build ${reference}`,
      letter: {
        heading: 'We are sorry: we cannot take on this build',
        blocks: [
          { kind: 'p', text: `Hello ${recipient(data)}, we looked at your request ${reference} and cannot build it.` },
          { kind: 'facts', rows: [['Reason', requireString(data, 'reason')]] },
          ...(data.depositRefunded === true
            ? [
                {
                  kind: 'p' as const,
                  text: `Your deposit${
                    optionalString(data, 'refundAmount') && optionalString(data, 'currency')
                      ? ` of ${formatMoney(data.refundAmount!, data.currency!)}`
                      : ''
                  } is refunded in full${data.refundPending === true ? ' (the payment provider is still processing it)' : ''}; you will get a separate message when it has gone back.`,
                },
              ]
            : []),
          { kind: 'p', text: 'Reply to this message if you would like to talk about a different build.' },
        ],
      },
    };
  },
  'payment-failed': (data) => {
    const reference = requireString(data, 'reference');
    const what = optionalString(data, 'kind') === 'balance' ? 'balance' : 'deposit';
    return {
      subject: `Your ${what} payment for ${reference} did not go through`,
      letter: {
        heading: 'Your bank did not complete the payment',
        blocks: [
          {
            kind: 'p',
            text: `Hello ${recipient(data)}, the bank payment of ${amountOf(data)} for build ${reference} did not go through, so nothing was taken.`,
          },
          { kind: 'facts', rows: [['Reason', requireString(data, 'reason')]] },
          {
            kind: 'p',
            text: `Your booking is kept as it was. Pay the ${what} again from your build page, by card or from another account.`,
          },
          ...openIf('Open your build', optionalString(data, 'bookingUrl')),
        ],
      },
    };
  },
  'shop-payment-alert': (data) => {
    const reference = requireString(data, 'reference');
    const alert = requireString(data, 'alert');
    const words: Record<string, { subject: string; heading: string; next: string }> = {
      'refund-failed': {
        subject: `Refund failed for ${reference}`,
        heading: 'A refund did not reach the player',
        next: 'The money is still with the shop. Refund it again from the booking, or another way, and tell the player.',
      },
      'dispute-opened': {
        subject: `Payment disputed for ${reference}`,
        heading: "The player's bank opened a dispute",
        next: "Answer it with your evidence in the payment provider's dashboard before its deadline. Delivery of this build waits until you decide.",
      },
      'dispute-won': {
        subject: `Dispute decided for the shop: ${reference}`,
        heading: 'The bank decided the dispute for the shop',
        next: 'The money stays with the shop. Release the delivery hold on the booking when you are ready to deliver.',
      },
      'dispute-lost': {
        subject: `Dispute lost: ${reference}`,
        heading: 'The bank decided the dispute for the player',
        next: 'The money was taken back. Decide with the player how the build is paid before you release the delivery hold.',
      },
      'outside-refund': {
        subject: `Refund made outside Loomwright for ${reference}`,
        heading: "A refund was made in the payment provider's dashboard",
        next: 'Loomwright recorded it on the booking. Check that the booking is where it should be.',
      },
    };
    const w = words[alert];
    if (!w) throw new MailDataError(`the alert "${alert}" is not one Loomwright sends`);
    return {
      subject: w.subject,
      letter: {
        heading: w.heading,
        blocks: [
          {
            kind: 'facts',
            rows: [
              ['Booking', reference],
              ['Player', recipient(data)],
              ['Amount', amountOf(data)],
              ['What happened', requireString(data, 'detail')],
            ],
          },
          { kind: 'p', text: w.next },
          open('Open the booking', requireString(data, 'backofficeUrl')),
        ],
        footer: 'A notice for the shop from Loomwright.',
      },
    };
  },
  'shop-new-paid-request': (data) => {
    const reference = requireString(data, 'reference');
    const currency = requireString(data, 'currency');
    const low = optionalString(data, 'totalLow');
    const high = optionalString(data, 'totalHigh');
    return {
      subject: `New paid request ${reference} from ${recipient(data)}`,
      letter: {
        heading: 'A new request has paid its deposit',
        blocks: [
          {
            kind: 'facts',
            rows: [
              ['Booking', reference],
              ['Player', `${recipient(data)} <${requireString(data, 'customerEmail')}>`],
              ['Deposit paid', amountOf(data)],
              ...(low && high ? [['Estimate', `${formatMoney(low, currency)} to ${formatMoney(high, currency)}`] as [string, string]] : []),
            ],
          },
          { kind: 'p', text: 'Accept it and set a bench date, or decline it with a reason.' },
          open('Open the request', requireString(data, 'backofficeUrl')),
        ],
        footer: 'A notice for the shop from Loomwright.',
      },
    };
  },
};

function buildMessages(data: Data<'build-messages'>): Draft {
  const reference = requireString(data, 'reference');
  const audience = requireString(data, 'audience');
  if (audience !== 'player' && audience !== 'shop') throw new MailDataError(`the audience "${audience}" is neither "player" nor "shop"`);
  const list = data.messages;
  if (!Array.isArray(list) || list.length === 0) throw new MailDataError('the data has no "messages"');
  const blocks: Block[] = [];
  for (const item of list) {
    const photos = typeof item.photos === 'number' && item.photos > 0 ? ` (${messageWords.photoCount(item.photos)})` : '';
    blocks.push({ kind: 'p', text: `${requireString(item, 'author')}, ${formatInstant(requireString(item, 'at'))}${photos}:` });
    const body = optionalString(item, 'body');
    if (body) blocks.push({ kind: 'p', text: body });
  }
  const toPlayer = audience === 'player';
  return {
    subject: toPlayer
      ? messageWords.toPlayerSubject(reference, list.length)
      : messageWords.toShopSubject(reference, requireString(data, 'playerName'), list.length),
    letter: {
      heading: toPlayer ? messageWords.toPlayerHeading : messageWords.toShopHeading,
      blocks: [
        {
          kind: 'p',
          text: `Hello ${recipient(data)}, ${toPlayer ? `news on build ${reference}` : `build ${reference} has a new word from ${requireString(data, 'playerName')}`}:`,
        },
        ...blocks,
        { kind: 'p', text: messageWords.answerInApp },
        open(messageWords.openThread, requireString(data, 'bookingUrl')),
      ],
      ...(toPlayer ? {} : { footer: 'A notice for the shop from Loomwright.' }),
    },
  };
}

/**
 * Renders one message from data of its template's type. The types say the data is complete, but
 * data read back from the outbox is checked again at run time: throws MailDataError (naming the
 * key) when it is not.
 */
export function renderMail<T extends MailTemplate>(
  template: T,
  data: MailTemplateData[T],
  shop: ShopContext,
  message: MessageContext = {},
): RenderedMail {
  const draft: Drafts[T] = drafts[template];
  // Two links every template may carry (bookingUrl is BookingLink's, quotePdfUrl booking-requested's).
  const links = data as unknown as { bookingUrl?: string; quotePdfUrl?: string };
  // The booking's page: the caller's link, else the storefront's page for the outbox row's booking.
  const bookingUrl =
    optionalString(links, 'bookingUrl') ??
    (message.bookingId && shop.publicUrl ? `${shop.publicUrl}/builds/${message.bookingId}` : undefined);
  // The booking's quote as a PDF (GET /api/bookings/:id/quote.pdf, opened signed in).
  const quotePdfUrl =
    optionalString(links, 'quotePdfUrl') ??
    (message.bookingId && shop.publicUrl ? `${shop.publicUrl}/api/bookings/${message.bookingId}/quote.pdf` : undefined);
  return inShopVoice(shop, () => {
    const { subject, letter, attachments } = draft(
      { ...data, ...(bookingUrl ? { bookingUrl } : {}), ...(quotePdfUrl ? { quotePdfUrl } : {}) },
      shop,
    );
    const full: Letter = { shopName: shop.name, ...letter };
    return { subject, html: letterHtml(full), text: letterText(full), attachments: attachments ?? [] };
  });
}

/**
 * Renders an outbox row as stored: its template name and JSON data, possibly written by an older
 * version under older key names (upgraded by upgradeMailData first). Throws MailDataError for a
 * template that does not exist or data that lacks what the template needs.
 */
export function renderStoredMail(template: string, stored: unknown, shop: ShopContext, message: MessageContext = {}): RenderedMail {
  if (!isMailTemplate(template)) throw new MailDataError(`there is no template called "${template}"`);
  // Stored JSON, upgraded to today's keys; renderMail checks every key it reads at run time.
  return renderMail(template, upgradeMailData(template, stored) as MailTemplateData[typeof template], shop, message);
}

export { MailDataError };
