// All fake state lives here, in memory only; `reset()` empties it between tests.
import type {
  CheckoutLineItem,
  CheckoutSession,
  Customer,
  Invoice,
  PortalSession,
  Price,
  Product,
  Subscription,
} from '../objects/types';
import type { Metadata } from '../http/params';

/** Checkout inputs Stripe keeps server-side and applies when the session completes. */
export interface CheckoutExtras {
  lineItems: CheckoutLineItem[];
  subscriptionMetadata: Metadata;
  trialPeriodDays: number | null;
}

/** A refused API request, kept so the error's `request_log_url` leads somewhere. */
export interface FailedRequest {
  method: string;
  path: string;
  status: number;
  body: object;
}

/** Enough for any test run to look its failures up; older ones are forgotten. */
const FAILED_REQUESTS_KEPT = 500;

export interface IdempotentReply {
  fingerprint: string;
  status: number;
  body: string;
}

export class Store {
  customers = new Map<string, Customer>();
  products = new Map<string, Product>();
  prices = new Map<string, Price>();
  checkoutSessions = new Map<string, CheckoutSession>();
  checkoutExtras = new Map<string, CheckoutExtras>();
  subscriptions = new Map<string, Subscription>();
  invoices = new Map<string, Invoice>();
  portalSessions = new Map<string, PortalSession>();
  idempotency = new Map<string, IdempotentReply>();
  idempotencyInFlight = new Set<string>();
  failedRequests = new Map<string, FailedRequest>();
  /** Insertion order, so lists are newest-first even within one second. */
  private order = new Map<string, number>();
  private sequence = 0;

  track(id: string): void {
    if (!this.order.has(id)) this.order.set(id, ++this.sequence);
  }

  rank(id: string): number {
    return this.order.get(id) ?? 0;
  }

  logFailure(requestId: string, failure: FailedRequest): void {
    this.failedRequests.set(requestId, failure);
    if (this.failedRequests.size > FAILED_REQUESTS_KEPT) {
      this.failedRequests.delete(this.failedRequests.keys().next().value as string);
    }
  }

  /** Finds any stored API object by id, for `expand[]`. */
  find(id: string): object | undefined {
    for (const map of [this.customers, this.products, this.prices, this.checkoutSessions, this.subscriptions, this.invoices]) {
      const hit = (map as Map<string, object>).get(id);
      if (hit) return hit;
    }
    return undefined;
  }

  reset(): void {
    this.customers.clear();
    this.products.clear();
    this.prices.clear();
    this.checkoutSessions.clear();
    this.checkoutExtras.clear();
    this.subscriptions.clear();
    this.invoices.clear();
    this.portalSessions.clear();
    this.idempotency.clear();
    this.idempotencyInFlight.clear();
    this.failedRequests.clear();
    this.order.clear();
    this.sequence = 0;
  }

  counts(): Record<string, number> {
    return {
      customers: this.customers.size,
      products: this.products.size,
      prices: this.prices.size,
      checkout_sessions: this.checkoutSessions.size,
      subscriptions: this.subscriptions.size,
      invoices: this.invoices.size,
      billing_portal_sessions: this.portalSessions.size,
    };
  }
}
