// Stripe-shaped errors: the SDK turns `{ error: { type, message, param, code, doc_url,
// request_log_url } }` plus the HTTP status into StripeInvalidRequestError (400/404),
// StripeAuthenticationError (any 401), StripeIdempotencyError, etc. Stripe's documented `type`
// values are api_error, card_error, idempotency_error and invalid_request_error; a refused key is
// an invalid_request_error with status 401, and the SDK picks the class by that status.
export type StripeErrorType = 'invalid_request_error' | 'idempotency_error' | 'api_error' | 'card_error';

/**
 * Codes that have a page under Stripe's error-code reference; only these get a `doc_url`, so the
 * fake never hands out a link to a page that does not exist.
 */
const DOCUMENTED_CODES = new Set([
  'email_invalid',
  'lock_timeout',
  'parameter_missing',
  'parameter_unknown',
  'resource_already_exists',
  'resource_missing',
  'url_invalid',
]);

export interface ErrorBody {
  error: { type: StripeErrorType; message: string; param?: string; code?: string; doc_url?: string; request_log_url?: string };
}

export class StripeApiError extends Error {
  readonly status: number;
  readonly type: StripeErrorType;
  readonly param?: string;
  readonly code?: string;

  constructor(
    status: number,
    message: string,
    options: { param?: string; code?: string; type?: StripeErrorType } = {},
  ) {
    super(message);
    this.status = status;
    this.type = options.type ?? 'invalid_request_error';
    this.param = options.param;
    this.code = options.code;
  }

  /** `requestLogUrl`: where this request can be looked up again (Stripe links its Dashboard log). */
  toBody(requestLogUrl?: string): ErrorBody {
    const error: ErrorBody['error'] = { type: this.type, message: this.message };
    if (this.code) error.code = this.code;
    if (this.code && DOCUMENTED_CODES.has(this.code)) {
      error.doc_url = `https://stripe.com/docs/error-codes/${this.code.replace(/_/g, '-')}`;
    }
    if (this.param) error.param = this.param;
    if (requestLogUrl) error.request_log_url = requestLogUrl;
    return { error };
  }
}

const OBJECT_NAMES: Record<string, string> = {
  cus: 'customer',
  prod: 'product',
  price: 'price',
  cs: 'checkout.session',
  sub: 'subscription',
  si: 'subscription_item',
  in: 'invoice',
  evt: 'event',
  bps: 'billing_portal.session',
};

export function noSuch(kind: string, id: string, param = 'id'): StripeApiError {
  const name = OBJECT_NAMES[kind] ?? kind;
  return new StripeApiError(404, `No such ${name}: '${id}'`, { param, code: 'resource_missing' });
}

export function missingParam(param: string): StripeApiError {
  return new StripeApiError(400, `Missing required param: ${param}.`, { param, code: 'parameter_missing' });
}

export function invalidParam(param: string, message: string): StripeApiError {
  return new StripeApiError(400, message, { param, code: 'parameter_invalid' });
}

/** Stripe's answer to a parameter the endpoint does not take, nested names included. */
export function unknownParam(param: string): StripeApiError {
  return new StripeApiError(400, `Received unknown parameter: ${param}`, { param, code: 'parameter_unknown' });
}
