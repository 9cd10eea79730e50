// The hosted test customer portal: the customer's subscriptions with plan change, cancel at
// period end (and undo), paying an open invoice, and the invoice history.
import type { Customer, Invoice, PortalSession, Price, Product, Subscription } from '../objects/types';
import { periodOf } from '../objects/billing';
import { day, escapeHtml, intervalLabel, money, page } from './html';
import { DECLINE_LABEL } from './checkout-page';

export interface PortalView {
  session: PortalSession;
  customer: Customer;
  subscriptions: Subscription[];
  invoices: Invoice[];
  prices: Price[];
  products: Map<string, Product>;
  notice: string | null;
}

export const NOTICES: Record<string, string> = {
  plan_changed: 'Your plan was changed.',
  cancel_scheduled: 'Your subscription will end at the close of the current period.',
  cancel_undone: 'Your subscription will renew as usual.',
  invoice_paid: 'Thank you, the open invoice is paid.',
  invoice_declined: 'The card was declined (test card 4000 0000 0000 0002). The invoice is still open.',
};

function priceLabel(price: Price, products: Map<string, Product>): string {
  const name = products.get(price.product)?.name ?? price.nickname ?? price.id;
  const every = price.recurring ? ` ${intervalLabel(price.recurring.interval, price.recurring.interval_count)}` : '';
  return `${name} — ${money(price.unit_amount, price.currency)}${every}`;
}

function statusLine(sub: Subscription, invoices: Invoice[]): string {
  if (sub.status === 'past_due') {
    const open = invoices.find((i) => i.id === sub.latest_invoice && i.status === 'open');
    return `<div class="error" role="status">Payment failed${open ? `: ${escapeHtml(money(open.amount_remaining, open.currency))} is due` : ''}.</div>`;
  }
  if (sub.status === 'paused') return '<p>Paused: nothing is billed until it is resumed.</p>';
  if (sub.cancel_at_period_end) return `<p>Ends on ${day(periodOf(sub).end)}.</p>`;
  if (sub.status === 'trialing' && sub.trial_end) return `<p>Trial ends on ${day(sub.trial_end)}.</p>`;
  return `<p>Renews on ${day(periodOf(sub).end)}.</p>`;
}

function subscriptionCard(view: PortalView, sub: Subscription): string {
  const base = `/portal/${escapeHtml(view.session.id)}/subscriptions/${escapeHtml(sub.id)}`;
  const item = sub.items.data[0];
  const others = view.prices.filter((p) => p.id !== item.price.id && p.currency === sub.currency);
  const change = others.length
    ? `<form method="post" action="${base}/plan" class="row">
        <div><label for="price-${escapeHtml(sub.id)}">Change plan</label>
        <select id="price-${escapeHtml(sub.id)}" name="price">${others
          .map((p) => `<option value="${escapeHtml(p.id)}">${escapeHtml(priceLabel(p, view.products))}</option>`)
          .join('')}</select></div>
        <div><button type="submit" class="secondary">Change plan</button></div>
      </form>`
    : '<p class="muted">No other plans are offered.</p>';
  const cancel = sub.cancel_at_period_end
    ? `<form method="post" action="${base}/renew"><button type="submit" class="secondary">Keep my subscription</button></form>`
    : `<form method="post" action="${base}/cancel"><button type="submit" class="danger">Cancel at period end</button></form>`;
  const open = view.invoices.find((i) => i.id === sub.latest_invoice && i.status === 'open');
  const pay = open
    ? `<form method="post" action="${base}/pay"><button type="submit">Pay ${escapeHtml(money(open.amount_remaining, open.currency))} with test card 4242 4242 4242 4242</button></form>
       <form method="post" action="${base}/decline"><button type="submit" class="danger">${DECLINE_LABEL}</button></form>`
    : '';
  return `<section class="card" aria-label="Subscription ${escapeHtml(sub.id)}">
    <h2>${escapeHtml(priceLabel(item.price, view.products))}</h2>
    <p class="muted">Status: ${escapeHtml(sub.status)}</p>
    ${statusLine(sub, view.invoices)}
    ${pay}
    ${change}
    ${cancel}
  </section>`;
}

function invoiceTable(invoices: Invoice[]): string {
  if (invoices.length === 0) return '';
  const rows = invoices
    .map((i) => `<tr><td>${escapeHtml(i.number ?? 'draft')}</td><td>${day(i.created)}</td><td>${escapeHtml(i.status)}</td>
      <td class="num">${escapeHtml(money(i.total, i.currency))}</td></tr>`)
    .join('');
  return `<section class="card"><h2>Invoices</h2><table>
    <thead><tr><th>Number</th><th>Date</th><th>Status</th><th class="num">Total</th></tr></thead>
    <tbody>${rows}</tbody></table></section>`;
}

export function portalPage(view: PortalView): string {
  const live = view.subscriptions.filter((s) => s.status !== 'canceled');
  const ended = view.subscriptions.filter((s) => s.status === 'canceled');
  const back = view.session.return_url
    ? `<p><a href="${escapeHtml(view.session.return_url)}">Return to the app</a></p>`
    : '';
  const notice = view.notice ? `<div class="notice" role="status">${escapeHtml(view.notice)}</div>` : '';
  const none = live.length === 0 ? '<div class="card"><p>No current subscription.</p></div>' : '';
  const endedList = ended.length
    ? `<section class="card"><h2>Ended</h2><ul>${ended
        .map((s) => `<li>${escapeHtml(priceLabel(s.items.data[0].price, view.products))} — ended ${day(s.ended_at ?? periodOf(s).end)}</li>`)
        .join('')}</ul></section>`
    : '';
  return page('Billing — test portal', `<h1>Billing</h1>
    <p class="muted">${escapeHtml(view.customer.email ?? view.customer.name ?? view.customer.id)}</p>
    ${notice}
    ${back}
    ${none}
    ${live.map((s) => subscriptionCard(view, s)).join('')}
    ${invoiceTable(view.invoices)}
    ${endedList}`);
}

export function errorPage(title: string, message: string, status = 400): { html: string; status: number } {
  return {
    html: page(title, `<div class="card"><h1>${escapeHtml(title)}</h1><div class="error" role="alert">${escapeHtml(message)}</div></div>`),
    status,
  };
}
