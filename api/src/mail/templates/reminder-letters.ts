import type { MailTemplateData } from '../mail.types';
import { amountOf, formatDay, formatMoney, optionalString, requireString, requireWhole } from './format';
import type { Block, Letter } from './layout';

/**
 * The letters the reminder jobs send (api/src/reminders/): the ship-by day near without a
 * tracking number (to the player, and to the build's builder), a balance still unpaid after the
 * board is ready, an unfinished checkout, and a request expired without its deposit. Days are the
 * shop's calendar days and money the shop's currency, through the one shared formatter.
 */
type Draft = { subject: string; letter: Omit<Letter, 'shopName'> };
type ReminderTemplate = 'ship-by-reminder' | 'shop-ship-by-reminder' | 'balance-reminder' | 'checkout-reminder' | 'request-expired';

const recipient = (data: { name: string }) => requireString(data, 'name');
const link = (label: string, url: string | undefined): Block[] => (url ? [{ kind: 'link', label, url }] : []);
const dueIn = (days: number) => (days <= 0 ? 'today' : days === 1 ? 'tomorrow' : `in ${days} days`);

export const reminderDrafts = {
  'ship-by-reminder': (data: MailTemplateData['ship-by-reminder']): Draft => {
    const reference = requireString(data, 'reference');
    const shipBy = formatDay(requireString(data, 'shipBy'));
    return {
      subject: `Your pedals for ${reference} are due ${dueIn(requireWhole(data, 'daysLeft'))}, by ${shipBy}`,
      letter: {
        heading: 'Your pedals are due at the bench soon',
        blocks: [
          {
            kind: 'p',
            text: `Hello ${recipient(data)}, build ${reference} is on the bench from ${formatDay(requireString(data, 'benchDate'))}. Your pedals need to reach us by ${shipBy}, and we have no tracking number for the parcel yet.`,
          },
          {
            kind: 'list',
            title: 'Before you send them',
            items: [
              'Pack each pedal on its own and take out any batteries.',
              'Label the power supply and any switcher with your name and the build reference.',
              'Add the carrier and tracking number on your build page once the parcel is on its way, so we can watch for it.',
            ],
          },
          {
            kind: 'p',
            text: 'If you are dropping them off instead, or cannot make the day, reply to this e-mail and we will plan around it.',
          },
          ...link('Add the tracking number', optionalString(data, 'bookingUrl')),
        ],
      },
    };
  },
  'shop-ship-by-reminder': (data: MailTemplateData['shop-ship-by-reminder']): Draft => {
    const reference = requireString(data, 'reference');
    const shipBy = formatDay(requireString(data, 'shipBy'));
    return {
      subject: `No tracking yet for ${reference}: pedals due by ${shipBy}`,
      letter: {
        heading: 'A parcel is due and has no tracking number',
        blocks: [
          {
            kind: 'facts',
            rows: [
              ['Booking', reference],
              ['Player', requireString(data, 'playerName')],
              ['Ship-by day', shipBy],
              ['Bench date', formatDay(requireString(data, 'benchDate'))],
            ],
          },
          {
            kind: 'p',
            text: 'The player has been reminded too. If the pedals will be late, move the bench date from the booking before the day comes.',
          },
          ...link('Open the booking', requireString(data, 'backofficeUrl')),
        ],
        footer: 'A notice for the shop from Loomwright.',
      },
    };
  },
  'balance-reminder': (data: MailTemplateData['balance-reminder']): Draft => {
    const reference = requireString(data, 'reference');
    const currency = requireString(data, 'currency');
    const due = formatMoney(requireString(data, 'balanceDue'), currency);
    return {
      subject: `Reminder: the balance for ${reference} is still due (${due})`,
      letter: {
        heading: 'Your board is waiting for its balance',
        blocks: [
          {
            kind: 'p',
            text: `Hello ${recipient(data)}, build ${reference} has been ready since ${formatDay(requireString(data, 'readySince'))}.`,
          },
          { kind: 'facts', rows: [['Balance due', due]] },
          {
            kind: 'p',
            text: 'We ship your board, or you can collect it, as soon as the balance is paid. If you have already paid, thank you: nothing more is needed.',
          },
          ...link('Pay the balance', optionalString(data, 'payUrl') ?? optionalString(data, 'bookingUrl')),
        ],
      },
    };
  },
  'checkout-reminder': (data: MailTemplateData['checkout-reminder']): Draft => {
    const reference = requireString(data, 'reference');
    const what = optionalString(data, 'kind') === 'balance' ? 'balance' : 'deposit';
    const amount = amountOf(data);
    return {
      subject: `Your ${what} payment for ${reference} was not finished`,
      letter: {
        heading: `Finish paying the ${what}?`,
        blocks: [
          {
            kind: 'p',
            text: `Hello ${recipient(data)}, you started paying the ${what} of ${amount} for build ${reference} but the payment was not finished, so nothing was taken.`,
          },
          {
            kind: 'p',
            text:
              what === 'deposit'
                ? 'The deposit holds your place in the bench queue. Pay it from your build page whenever you are ready.'
                : 'We ship your board, or you can collect it, once the balance is paid. Pay it from your build page whenever you are ready.',
          },
          ...link(`Pay the ${what}`, optionalString(data, 'payUrl') ?? optionalString(data, 'bookingUrl')),
        ],
      },
    };
  },
  'request-expired': (data: MailTemplateData['request-expired']): Draft => {
    const reference = requireString(data, 'reference');
    const days = requireWhole(data, 'days');
    return {
      subject: `Your request ${reference} has expired`,
      letter: {
        heading: 'Your request has expired',
        blocks: [
          {
            kind: 'p',
            text: `Hello ${recipient(data)}, the deposit for request ${reference} was not paid within ${days} ${days === 1 ? 'day' : 'days'}, so we have closed the request. Nothing was charged and no bench time was held for it.`,
          },
          {
            kind: 'p',
            text: 'Prices and bench dates may have changed since. To build this board, configure it again and send a new request; we will be glad to hear from you.',
          },
          ...link('Configure a board', optionalString(data, 'configureUrl')),
        ],
      },
    };
  },
} satisfies { [T in ReminderTemplate]: (data: MailTemplateData[T]) => Draft };
