// Stripe-shaped errors: the SDK turns `{ error: { type, message, param, code } }` plus the HTTP
// status into StripeInvalidRequestError (400/404), StripeAuthenticationError (401), etc.
export type StripeErrorType = 'invalid_request_error' | 'idempotency_error' | 'api_error' | 'card_error';

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

  toBody(): { error: Record<string, string> } {
    const error: Record<string, string> = { type: this.type, message: this.message };
    if (this.param) error.param = this.param;
    if (this.code) error.code = this.code;
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
