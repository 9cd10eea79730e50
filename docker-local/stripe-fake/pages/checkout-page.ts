// The hosted test checkout: order summary, pay with the always-succeeding test card, or decline.
import type { CheckoutExtras } from '../state/store';
import type { CheckoutSession, Customer } from '../objects/types';
import { escapeHtml, intervalLabel, money, page } from './html';

export const PAY_LABEL = 'Pay with test card 4242 4242 4242 4242';
export const DECLINE_LABEL = 'Decline (card 4000 0000 0000 0002)';

function summary(session: CheckoutSession, extras: CheckoutExtras): string {
  const rows = extras.lineItems
    .map((item) => {
      const recurring = item.price.recurring;
      const every = recurring ? ` ${intervalLabel(recurring.interval, recurring.interval_count)}` : '';
      return `<tr><td>${escapeHtml(item.description)}${item.quantity > 1 ? ` × ${item.quantity}` : ''}</td>
        <td class="num">${escapeHtml(money(item.amount_total, item.currency))}${escapeHtml(every)}</td></tr>`;
    })
    .join('');
  const trial = extras.trialPeriodDays
    ? `<p class="muted">Includes a ${extras.trialPeriodDays}-day trial; nothing is due today.</p>`
    : '';
  const dueToday = extras.trialPeriodDays ? 0 : session.amount_total;
  return `<table><tbody>${rows}</tbody>
    <tfoot><tr><th>Due today</th><th class="num">${escapeHtml(money(dueToday, session.currency))}</th></tr></tfoot></table>${trial}`;
}

export function checkoutPage(session: CheckoutSession, extras: CheckoutExtras, customer: Customer | undefined): string {
  if (session.status === 'complete') {
    return page('Checkout complete', `<div class="card"><h1>This checkout is already paid</h1>
      <p><a href="${escapeHtml(session.success_url.split('{CHECKOUT_SESSION_ID}').join(session.id))}">Continue</a></p></div>`);
  }
  if (session.status === 'expired') {
    const back = session.cancel_url ? `<p><a href="${escapeHtml(session.cancel_url)}">Go back</a></p>` : '';
    return page('Checkout expired', `<div class="card"><h1>This checkout has expired</h1>${back}</div>`);
  }
  const email = customer?.email ?? session.customer_email;
  const emailField = email
    ? `<p class="muted">Billed to ${escapeHtml(email)}</p>`
    : `<label for="email">Email for receipts</label><input id="email" name="email" type="email" required autocomplete="email">`;
  const cancel = session.cancel_url
    ? `<p class="muted"><a href="${escapeHtml(session.cancel_url)}">Cancel and go back</a></p>`
    : '';
  return page('Test checkout', `<div class="card">
    <h1>Test checkout</h1>
    ${summary(session, extras)}
    <form method="post" action="/checkout/${escapeHtml(session.id)}/pay">
      ${emailField}
      <p class="muted">Card 4242 4242 4242 4242 always succeeds.</p>
      <button type="submit">${PAY_LABEL}</button>
    </form>
    <form method="post" action="/checkout/${escapeHtml(session.id)}/decline">
      <button type="submit" class="danger">${DECLINE_LABEL}</button>
    </form>
    ${cancel}
  </div>`);
}

export function declinedPage(session: CheckoutSession): string {
  const back = session.cancel_url ? ` <a href="${escapeHtml(session.cancel_url)}">Return without paying</a>` : '';
  return page('Card declined', `<div class="card">
    <h1>Your card was declined</h1>
    <div class="error" role="alert">Test card 4000 0000 0000 0002 is always declined (generic decline).
      Nothing was charged and no subscription was created.</div>
    <p><a href="/checkout/${escapeHtml(session.id)}">Try another card</a> ·${back}</p>
  </div>`);
}
