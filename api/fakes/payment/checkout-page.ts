import type Stripe from 'stripe';
import { amountExponent, majorUnits } from './currency-rules';
import type { SessionExtra } from './store';
import { TEST_ROUTING_NUMBER } from './test-cards';

const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

/** The amount as the fake reads the provider's tables (currency-rules.ts), never as the product does. */
function money(minor: number, currency: string): string {
  const exp = amountExponent(currency);
  // An ISK, HUF or TWD amount is whole units written in hundredths: show the whole units.
  const shown = ['isk', 'huf', 'twd'].includes(currency.toLowerCase()) ? 0 : exp;
  return new Intl.NumberFormat('en', {
    style: 'currency',
    currency: currency.toUpperCase(),
    minimumFractionDigits: shown,
    maximumFractionDigits: shown,
  }).format(majorUnits(minor, currency) as unknown as number);
}

/**
 * The hosted page a player types a card into. Our own plain design: one card on a warm ground,
 * the amount large, the test card numbers listed so nobody has to look them up.
 */
export function checkoutPage(
  session: Stripe.Checkout.Session,
  extra: SessionExtra,
  options: { error?: string | null; typed?: string; method?: string } = {},
): string {
  const amount = money(session.amount_total ?? 0, session.currency ?? 'usd');
  const lines = extra.lineItems
    .map(
      (l) =>
        `<li><span>${escapeHtml(l.name)}${l.description ? `<small>${escapeHtml(l.description)}</small>` : ''}</span><b>${money(l.unitAmount * l.quantity, session.currency ?? 'usd')}</b></li>`,
    )
    .join('');
  const error = options.error ?? extra.lastError;
  const bank = session.payment_method_types.includes('us_bank_account');
  const cardForm = `
    <form method="post" action="/pay/${escapeHtml(session.id)}" novalidate aria-label="Pay by card">
      <input type="hidden" name="method" value="card">
      <label for="card">Card number</label>
      <input id="card" name="card" inputmode="numeric" autocomplete="cc-number" required value="${escapeHtml(options.method === 'card' || !options.method ? (options.typed ?? '') : '')}" placeholder="4242 4242 4242 4242" ${error ? 'aria-describedby="card-error" aria-invalid="true"' : ''}>
      <div class="row">
        <span><label for="expiry">Expiry (MM/YY)</label><input id="expiry" name="expiry" autocomplete="cc-exp" placeholder="12/34" required></span>
        <span><label for="cvc">Security code</label><input id="cvc" name="cvc" inputmode="numeric" autocomplete="cc-csc" placeholder="123" required></span>
      </div>
      <button type="submit">Pay ${amount}</button>
    </form>`;
  const bankForm = bank
    ? `
    <h2>Or pay from a US bank account</h2>
    <p class="small">A bank debit takes a few working days to settle; the shop confirms your booking once it has.</p>
    <form method="post" action="/pay/${escapeHtml(session.id)}" novalidate aria-label="Pay from a bank account">
      <input type="hidden" name="method" value="us_bank_account">
      <label for="routing">Routing number</label>
      <input id="routing" name="routing" inputmode="numeric" placeholder="${TEST_ROUTING_NUMBER}" required>
      <label for="account">Account number</label>
      <input id="account" name="account" inputmode="numeric" placeholder="000123456789" required>
      <button type="submit">Debit ${amount} from the bank account</button>
    </form>`
    : '';
  const body =
    session.status === 'complete'
      ? `<p class="done" role="status">${session.payment_status === 'paid' ? 'This payment is complete.' : 'This payment has been started and is settling with the bank.'}</p><p><a class="button" href="${escapeHtml((session.success_url ?? '').replace('{CHECKOUT_SESSION_ID}', session.id))}">Back to the shop</a></p>`
      : session.status === 'expired'
        ? `<p class="error" role="alert">This checkout has expired. Go back to the shop and start the payment again.</p>`
        : `
    ${error ? `<p class="error" role="alert" id="card-error">${escapeHtml(error)} Check the number or try another card.</p>` : ''}
    ${cardForm}
    ${bankForm}
    ${session.cancel_url ? `<p><a href="${escapeHtml(session.cancel_url)}">Cancel and go back to the shop</a></p>` : ''}`;
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>Pay ${amount} — test checkout</title>
<style>
  body { margin: 0; font: 16px/1.5 system-ui, sans-serif; background: #f6f3ee; color: #2a211b; }
  main { max-width: 26rem; margin: 3rem auto; background: #fff; border: 1px solid #ddd5ca; border-radius: 12px; padding: 2rem; }
  h1 { font-size: 1.25rem; margin: 0 0 .25rem; } h2 { font-size: 1rem; margin: 2rem 0 .25rem; } .small { color: #6b5f55; font-size: .875rem; margin: 0; } .amount { font-size: 2.5rem; font-weight: 700; margin: 0 0 1rem; font-variant-numeric: tabular-nums; }
  ul { list-style: none; padding: 0; margin: 0 0 1.5rem; border-top: 1px solid #ece6dd; }
  li { display: flex; justify-content: space-between; gap: 1rem; padding: .5rem 0; border-bottom: 1px solid #ece6dd; }
  li small { display: block; color: #6b5f55; font-size: .875rem; }
  label { display: block; font-weight: 600; margin: .75rem 0 .25rem; }
  input { width: 100%; box-sizing: border-box; font: inherit; padding: .6rem .75rem; border: 1px solid #9b8f84; border-radius: 8px; }
  input:focus, button:focus, a:focus { outline: 3px solid #1f5d57; outline-offset: 2px; }
  .row { display: flex; gap: 1rem; } .row span { flex: 1; }
  button, .button { display: inline-block; margin-top: 1.25rem; width: 100%; text-align: center; box-sizing: border-box; font: inherit; font-weight: 700; padding: .75rem; border: 0; border-radius: 8px; background: #1f5d57; color: #fff; cursor: pointer; text-decoration: none; }
  a { color: #1f5d57; } .error { background: #fbeceb; border-left: 4px solid #9c2b23; padding: .75rem; } .done { font-weight: 700; }
  .note { color: #6b5f55; font-size: .875rem; margin-top: 2rem; }
</style></head>
<body><main>
  <h1>Test checkout</h1>
  <p class="amount">${amount}</p>
  <ul>${lines}</ul>
  ${body}
  <p class="note">Nothing is charged here: this is the local test payment service. Test cards: 4242 4242 4242 4242 pays; 4000 0000 0000 0002 is declined; 4000 0000 0000 9995 is declined for insufficient funds; 4000 0000 0000 0259 pays and is then disputed; 4000 0000 0000 5126 pays, and its refund later fails. Any future expiry and any three digits. Bank accounts: routing ${TEST_ROUTING_NUMBER}; account 000123456789 settles later, 000111111113 fails later (account closed), 000222222227 fails later (insufficient funds).</p>
</main></body></html>`;
}
