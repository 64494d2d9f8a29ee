/**
 * The fake service's own pay page: what a client sees instead of the real hosted page. Plain
 * HTML, no script. It lists the test card numbers it accepts; card numbers stay here and never
 * reach Kerfline (the app gets a signed webhook and the browser comes back to the proof page).
 */
import { formatMoney } from '../../../src/lib/payments/money.ts';
import type { FakeSession } from './records.ts';

/** Test card numbers: the first goes through, the second is declined. */
export const TEST_CARDS = {
  pays: '4242 4242 4242 4242',
  declined: '4000 0000 0000 0002',
} as const;

function escape(value: string): string {
  return value.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}

function amountText(session: FakeSession): string {
  return formatMoney({ minor: session.amount_total, currency: session.currency.toUpperCase() }, 'en');
}

function page(title: string, body: string): string {
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escape(title)}</title>
<style>body{font-family:system-ui,sans-serif;max-width:32rem;margin:2rem auto;padding:0 1rem;line-height:1.5}
.note{border:1px solid #b58900;background:#fdf6e3;padding:.5rem .75rem}label{display:block;margin:.75rem 0}
input{font:inherit;padding:.3rem;width:100%;box-sizing:border-box}button{font:inherit;padding:.4rem 1rem;margin-right:.5rem}</style>
</head><body>
<p class="note">Local fake payment service (test mode): no real money moves and nothing leaves this machine.</p>
${body}
</body></html>`;
}

export function payPage(session: FakeSession, problem = ''): string {
  const description = session.line_description ? `<p>${escape(session.line_description)}</p>` : '';
  const error = problem ? `<p role="alert"><strong>${escape(problem)}</strong></p>` : '';
  return page('Pay a deposit (fake payment service)', `
<h1>Pay ${escape(amountText(session))}</h1>
<p>${escape(session.line_name)}</p>
${description}
${error}
<form method="post" action="/pay/${escape(session.id)}">
  <label>Card number <input name="card" inputmode="numeric" autocomplete="off"></label>
  <p>Test card numbers this fake accepts: <code>${TEST_CARDS.pays}</code> (the payment goes through) and
  <code>${TEST_CARDS.declined}</code> (the card is declined). Any expiry date and security code would do; none is asked.</p>
  <button name="choice" value="pay">Pay</button>
  <button name="choice" value="decline" formnovalidate>Decline</button>
</form>
<p><a href="${escape(session.cancel_url)}">Cancel and go back to the shop</a></p>`);
}

export function declinedPage(session: FakeSession): string {
  return page('Payment declined (fake payment service)', `
<h1>The payment was declined</h1>
<p>No money moved. You can try again, or go back to the shop and pay later.</p>
<p><a href="/pay/${escape(session.id)}">Try again</a></p>
<p><a href="${escape(session.cancel_url)}">Go back to the shop</a></p>`);
}

export function closedPage(session: FakeSession | undefined): string {
  const back = session ? `<p><a href="${escape(session.cancel_url)}">Go back to the shop</a></p>` : '';
  const why = !session ? 'There is no such payment.' : session.status === 'complete' ? 'This payment has been made.' : 'This payment page has expired.';
  return page('Payment page closed (fake payment service)', `<h1>This payment page is closed</h1><p>${why}</p>${back}`);
}
