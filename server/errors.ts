/**
 * The errors the product raises on purpose. Actions turn them into an ActionState with a clear
 * message; route handlers into a JSON body with the matching HTTP status.
 */
export class AppError extends Error {
  constructor(
    message: string,
    public readonly status: number,
    public readonly code: string,
  ) {
    super(message);
    this.name = new.target.name;
  }
}

/** No valid session: 401 (pages redirect to sign-in instead). */
export class UnauthenticatedError extends AppError {
  constructor(message = 'Please sign in.') {
    super(message, 401, 'unauthenticated');
  }
}

/** Signed in, but the role may not do this: 403. */
export class ForbiddenError extends AppError {
  constructor(message = 'Your role does not allow this.') {
    super(message, 403, 'forbidden');
  }
}

/** Missing, or belongs to another company — never tell the two apart: 404. */
export class NotFoundError extends AppError {
  constructor(what = 'That item') {
    super(`${what} was not found.`, 404, 'not_found');
  }
}

/** Input that parsed but cannot be accepted (field-level where possible): 422. */
export class InvalidInputError extends AppError {
  constructor(
    message: string,
    public readonly fieldErrors: Record<string, string[]> = {},
  ) {
    super(message, 422, 'invalid_input');
  }
}

/** The request conflicts with the current state (last admin, already accepted…): 409. */
export class ConflictError extends AppError {
  constructor(message: string) {
    super(message, 409, 'conflict');
  }
}

/** A plan limit is reached; the message names the limit and how to raise it: 403 with code plan_limit. */
export class PlanLimitError extends AppError {
  constructor(
    public readonly limit: 'seats' | 'studiesPerMonth' | 'activeLinks' | 'uploadsPerMonth' | 'apiAccess' | 'quoteBranding' | 'campaignSites',
    message: string,
  ) {
    super(message, 403, 'plan_limit');
  }
}

/** Too many attempts; retryAfterSeconds tells the client when to come back: 429. */
export class RateLimitedError extends AppError {
  constructor(
    public readonly retryAfterSeconds: number,
    message = `Too many attempts. Try again in ${Math.max(1, Math.ceil(retryAfterSeconds / 60))} minutes.`,
  ) {
    super(message, 429, 'rate_limited');
  }
}

/** The job queue (Redis) cannot be reached: 503 with words; nothing was queued. */
export class QueueUnavailableError extends AppError {
  constructor(message = 'Campaigns cannot be started right now: the job queue (Redis) is out of reach. Nothing was queued; try again in a minute, or ask your administrator to start Redis.') {
    super(message, 503, 'queue_unavailable');
  }
}
