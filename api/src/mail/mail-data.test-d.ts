/*
 * Compile-time checks of the mail data types (vitest typecheck: this file is compiled by tsc, never
 * run). Each `@ts-expect-error` line must fail to compile; if a change made it compile, tsc reports
 * the directive as unused and the test fails.
 */
import { describe, expectTypeOf, it } from 'vitest';
import type { Executor } from '../database/database';
import type { MailService } from './mail.service';
import type { MailTemplateData, OutgoingMail } from './mail.types';
import { requireString } from './templates/format';
import { renderMail, type ShopContext } from './templates/render';

declare const mail: MailService;
declare const trx: Executor;
declare const shop: ShopContext;
const to = 'rosa@mail.example';

describe('OutgoingMail is typed by its template', () => {
  it('carries exactly the data its template reads', () => {
    expectTypeOf<OutgoingMail<'deposit-refunded'>['data']>().toEqualTypeOf<MailTemplateData['deposit-refunded']>();
    expectTypeOf<Parameters<MailService['enqueue']>[1]>().toEqualTypeOf<OutgoingMail>();
    void mail.enqueue(trx, {
      template: 'deposit-refunded',
      to,
      data: { name: 'Rosa', reference: 'LW-1', amount: '280.00', currency: 'USD' },
    });
  });

  it('refuses a missing key', () => {
    // @ts-expect-error `reference` is missing
    void mail.enqueue(trx, { template: 'deposit-refunded', to, data: { name: 'Rosa', amount: '280.00', currency: 'USD' } });
    // @ts-expect-error `balanceDue` is missing
    void mail.enqueue(trx, { template: 'balance-requested', to, data: { name: 'Rosa', reference: 'LW-1', currency: 'USD' } });
  });

  it('refuses a misspelt key and the older alternative names', () => {
    void mail.enqueue(trx, {
      template: 'deposit-refunded',
      to,
      // @ts-expect-error `refrence` is not a key of deposit-refunded
      data: { name: 'Rosa', refrence: 'LW-1', amount: '280.00', currency: 'USD' },
    });
    // @ts-expect-error the recipient is `name`, not `customerName`
    void mail.enqueue(trx, { template: 'shop-note', to, data: { customerName: 'Rosa', reference: 'LW-1', note: 'Hello' } });
    // @ts-expect-error the invitation link is `inviteUrl`, not `acceptUrl`
    void mail.enqueue(trx, { template: 'staff-invite', to, data: { name: 'Ivo', acceptUrl: 'http://x/accept' } });
    void mail.enqueue(trx, {
      template: 'payment-failed',
      to,
      // @ts-expect-error the booking page is `bookingUrl`, not `buildUrl`
      data: { name: 'Rosa', reference: 'LW-1', amount: '1.00', currency: 'USD', reason: 'Closed', buildUrl: 'http://x/b' },
    });
  });

  it("refuses another template's data and an unknown template", () => {
    // @ts-expect-error welcome's data is not a password reset's
    void mail.enqueue(trx, { template: 'password-reset', to, data: { name: 'Rosa', configureUrl: 'http://x/c' } });
    // @ts-expect-error there is no template called newsletter
    void mail.enqueue(trx, { template: 'newsletter', to, data: { name: 'Rosa' } });
  });

  it('types the renderers the same way', () => {
    renderMail('welcome', { name: 'Rosa' }, shop);
    // @ts-expect-error `reason` is missing
    renderMail('booking-cancelled', { name: 'Rosa', reference: 'LW-1', currency: 'USD' }, shop);
    const welcome: MailTemplateData['welcome'] = { name: 'Rosa' };
    // @ts-expect-error a renderer cannot read a key its template's type lacks
    requireString(welcome, 'customerName');
  });
});
