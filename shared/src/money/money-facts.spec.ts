import Decimal from 'decimal.js';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { builderLevels } from '../domain';
import { estimateRig } from '../estimate/estimate-rig';
import type { RigConfiguration } from '../estimate/types';
import { demoPriceBook } from '../price-book/demo-price-book';
import { firmQuoteFigures } from './firm-quote';
import { firmQuoteLines, moneyFacts, storedLaborBasis, type MoneyExtraInput, type MoneyPaymentInput } from './money-facts';

/**
 * The oracle works in whole cents with BigInt, an arithmetic independent of decimal.js: ISO 4217
 * gives USD two minor-unit digits (ISO 4217:2015, table A.1), so cents are exact integers.
 */
const cents = (amount: string) => {
  const [whole, frac = ''] = amount.replace('-', '').split('.');
  const value = BigInt(whole) * 100n + BigInt((frac + '00').slice(0, 2));
  return amount.startsWith('-') ? -value : value;
};
const amountOf = (c: bigint) => `${c / 100n}.${String(c % 100n).padStart(2, '0')}`;

const amount = fc.bigInt({ min: 1n, max: 500_000n }).map(amountOf);
const stamp = fc
  .date({ min: new Date('2026-01-01T00:00:00Z'), max: new Date('2027-12-31T00:00:00Z'), noInvalidDate: true })
  .map((d) => d.toISOString());
const extra: fc.Arbitrary<MoneyExtraInput> = fc.record({
  description: fc.constantFrom('Deeper road case', 'Extra buffer', 'Longer patch cables'),
  amount,
  status: fc.constantFrom('proposed' as const, 'approved' as const, 'declined' as const),
});
const payment: fc.Arbitrary<MoneyPaymentInput> = fc
  .record({
    kind: fc.constantFrom('deposit' as const, 'balance' as const),
    amount,
    status: fc.constantFrom('pending', 'paid', 'failed', 'expired', 'refunded'),
    paidAt: stamp,
    refundedAfterMs: fc.integer({ min: 1, max: 90 * 24 * 3600 * 1000 }),
  })
  .map(({ refundedAfterMs, ...p }) => ({
    ...p,
    paidAt: p.status === 'paid' || p.status === 'refunded' ? p.paidAt : null,
    refundedAt: p.status === 'refunded' ? new Date(Date.parse(p.paidAt) + refundedAfterMs).toISOString() : null,
  }));

const rig: fc.Arbitrary<RigConfiguration> = fc
  .record({
    surfaceId: fc.constantFrom(...demoPriceBook.surfaces.map((s) => s.id)),
    caseId: fc.constantFrom(...demoPriceBook.cases.map((c) => c.id)),
    switcher: fc.boolean(),
    functions: fc.subarray(demoPriceBook.functions.map((f) => f.code)),
    level: fc.constantFrom(...builderLevels),
    loops: fc.array(fc.boolean(), { minLength: 1, maxLength: 18 }),
  })
  .map(({ switcher, loops, ...rest }) => ({
    ...rest,
    routing: { mode: switcher ? ('switcher' as const) : ('serial' as const) },
    pedals: loops.map((inLoop, i) => ({ name: `pedal ${i + 1}`, powered: true, inLoop: switcher && inLoop })),
  }));
// Any rate a shop might set, to the cent, within and beyond the demo ranges.
const rate = fc.bigInt({ min: 100n, max: 30_000n }).map(amountOf);

describe('money facts of any booking history (fast-check)', () => {
  it('balance due = firm total + approved extras − net payments (never below zero; any surplus is credit)', () => {
    fc.assert(
      fc.property(
        fc.option(amount, { nil: null }),
        fc.array(extra, { maxLength: 6 }),
        fc.array(payment, { maxLength: 6 }),
        fc.boolean(),
        (firm, extras, payments, waived) => {
          const facts = moneyFacts({ currency: 'USD', firmTotal: firm, extras, payments, balanceWaived: waived });
          const approved = extras.filter((e) => e.status === 'approved').reduce((s, e) => s + cents(e.amount), 0n);
          const paidIn = payments.filter((p) => p.status === 'paid' || p.status === 'refunded').reduce((s, p) => s + cents(p.amount), 0n);
          const back = payments.filter((p) => p.status === 'refunded').reduce((s, p) => s + cents(p.amount), 0n);
          const net = paidIn - back;
          expect(cents(facts.approvedExtras)).toBe(approved);
          expect(cents(facts.netPaid)).toBe(net);
          expect(cents(facts.paid) - cents(facts.refunded)).toBe(cents(facts.netPaid));
          if (firm === null) {
            expect(facts.balanceDue).toBeNull();
            expect(facts.settled).toBe(false);
            return;
          }
          const owed = cents(firm) + approved;
          const due = owed - net > 0n ? owed - net : 0n;
          expect(cents(facts.totalOwed!)).toBe(owed);
          expect(cents(facts.balanceDue!)).toBe(due);
          // What was owed is exactly what came in, plus what is still due, less any surplus held.
          expect(cents(facts.netPaid) + cents(facts.balanceDue!) - cents(facts.credit)).toBe(owed);
          expect(facts.settled).toBe(due === 0n || waived);
          // The ledger: every payment and every refund once, refunds negative and at their own time.
          expect(facts.ledger.reduce((s, e) => s + cents(e.amount), 0n)).toBe(net);
          const refunds = facts.ledger.filter((e) => e.kind === 'refund');
          expect(refunds.map((r) => r.at).sort()).toEqual(
            payments
              .filter((p) => p.status === 'refunded')
              .map((p) => p.refundedAt)
              .sort(),
          );
        },
      ),
      { numRuns: 500 },
    );
  });

  it('the firm quote’s lines add up to its labor total and its total, to the cent, for any rig and rate', () => {
    fc.assert(
      fc.property(rig, rate, (config, hourlyRate) => {
        const estimate = estimateRig(config, demoPriceBook, { version: 1 });
        const figures = firmQuoteFigures({
          hourlyRate,
          laborHours: estimate.laborHours,
          materialsTotal: estimate.materialsTotal,
          deposit: estimate.deposit,
        });
        const lines = firmQuoteLines(estimate.lines, hourlyRate, figures.laborTotal, 'USD');
        const labor = lines.filter((l) => l.kind === 'labor');
        expect(labor.every((l) => l.unitPrice === hourlyRate && l.amountHigh === undefined)).toBe(true);
        // Each labor line explains itself at the one firm rate, never the level's range, with the
        // currency as ECMA-402 Intl.NumberFormat writes US dollars in en-US (CLDR pattern ¤#,##0.00).
        const rateWords = new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD' }).format(Number(hourlyRate));
        expect(
          labor.every(
            (l) => l.explanation === undefined || (l.explanation.endsWith(`, at ${rateWords} per hour`) && !l.explanation.includes('–')),
          ),
        ).toBe(true);
        expect(labor.reduce((s, l) => s + cents(l.amount), 0n)).toBe(cents(figures.laborTotal));
        expect(lines.reduce((s, l) => s + cents(l.amount), 0n)).toBe(cents(figures.total));
        // Each labor line stays within a cent per line of its exact hours × rate.
        for (const l of labor) {
          expect(
            new Decimal(l.amount).minus(new Decimal(l.quantity).times(hourlyRate)).abs().lte(new Decimal('0.01').times(labor.length)),
          ).toBe(true);
        }
      }),
      { numRuns: 300 },
    );
  });
});

describe('money facts, worked by hand', () => {
  it('counts an approved extra, not a proposed or declined one, and a refund at its own time', () => {
    // Hand-worked: $1,550.00 firm + $45.00 approved = $1,595.00 owed; $150.00 deposit paid → $1,445.00 due.
    const facts = moneyFacts({
      currency: 'USD',
      firmTotal: '1550.00',
      extras: [
        { description: 'Deeper road case', amount: '45.00', status: 'approved' },
        { description: 'Second buffer', amount: '60.00', status: 'proposed' },
        { description: 'Longer cables', amount: '12.00', status: 'declined' },
      ],
      payments: [{ kind: 'deposit', amount: '150.00', status: 'paid', paidAt: '2026-11-02T10:00:00.000Z', refundedAt: null }],
      balanceWaived: false,
    });
    expect(facts).toMatchObject({
      totalOwed: '1595.00',
      approvedExtras: '45.00',
      proposedExtras: '60.00',
      netPaid: '150.00',
      balanceDue: '1445.00',
      settled: false,
    });

    const afterBalance = moneyFacts({
      currency: 'USD',
      firmTotal: '1550.00',
      extras: [],
      payments: [
        { kind: 'deposit', amount: '150.00', status: 'paid', paidAt: '2026-11-02T10:00:00.000Z', refundedAt: null },
        { kind: 'balance', amount: '1400.00', status: 'paid', paidAt: '2026-12-20T16:30:00.000Z', refundedAt: null },
      ],
      balanceWaived: false,
    });
    expect(afterBalance).toMatchObject({ balanceDue: '0.00', settled: true });

    const refunded = moneyFacts({
      currency: 'USD',
      firmTotal: null,
      extras: [],
      payments: [
        {
          kind: 'deposit',
          amount: '150.00',
          status: 'refunded',
          paidAt: '2026-11-02T10:00:00.000Z',
          refundedAt: '2026-11-05T09:15:00.000Z',
        },
      ],
      balanceWaived: false,
    });
    expect(refunded.ledger).toEqual([
      { kind: 'payment', paymentKind: 'deposit', amount: '150.00', at: '2026-11-02T10:00:00.000Z' },
      { kind: 'refund', paymentKind: 'deposit', amount: '-150.00', at: '2026-11-05T09:15:00.000Z' },
    ]);
    expect(refunded.netPaid).toBe('0.00');
  });

  it('spreads the labor cents by largest remainder: 3 × 1.5 h at $33.33 = $149.99 (hand-worked)', () => {
    // Hand-worked: 4.5 h × $33.33 = $149.985 → $149.99 (half-up). Each 1.5 h line is exactly $49.995;
    // the floors make 3 × $49.99 = $149.97, so two cents are left and go to the first two lines (equal remainders, in order).
    const lines = [1, 2, 3].map((n) => ({
      code: `labor.${n}`,
      label: `Loop ${n}`,
      kind: 'labor' as const,
      quantity: '1.5',
      unit: 'h',
      unitPrice: '40.00',
      amount: '60.00',
      amountHigh: '75.00',
    }));
    const firm = firmQuoteLines(lines, '33.33', '149.99', 'USD');
    expect(firm.map((l) => l.amount)).toEqual(['50.00', '50.00', '49.99']);
  });

  it('words a labor line stored before lines carried a basis at the firm rate, without rewriting the stored quote', () => {
    // A line as quotes stored it before the basis existed (quotes are never updated afterwards).
    const stored = {
      code: 'labor.pedals',
      label: 'Mounting and wiring',
      kind: 'labor' as const,
      quantity: '6',
      unit: 'h',
      unitPrice: '80.00',
      amount: '480.00',
      amountHigh: '600.00',
      explanation: '6 pedals at 1 h each, at 80.00–100.00 per hour',
    };
    expect(storedLaborBasis(stored.explanation)).toBe('6 pedals at 1 h each');
    expect(storedLaborBasis('Case hardware')).toBeUndefined();
    // 6 h × $95.00 = $570.00, worked by hand; en-US currency wording as Intl.NumberFormat writes it (ECMA-402).
    const [firm] = firmQuoteLines([stored], '95.00', '570.00', 'USD');
    expect(firm.explanation).toBe('6 pedals at 1 h each, at $95.00 per hour');
    expect(firm.amount).toBe('570.00');
    expect(stored.explanation).toBe('6 pedals at 1 h each, at 80.00–100.00 per hour');
  });
});
