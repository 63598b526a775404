export type FieldErrors = Record<string, string[]>;

export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: FieldErrors | Record<string, unknown>,
  ) {
    super(message);
    this.name = new.target.name;
  }
}

export class ValidationError extends AppError {
  constructor(details: FieldErrors, message = 'Some fields need attention.') {
    super(400, 'validation_failed', message, details);
  }
}
export class UnauthenticatedError extends AppError {
  constructor(message = 'Please sign in.') {
    super(401, 'unauthenticated', message);
  }
}
export class ForbiddenError extends AppError {
  constructor(message = 'You do not have permission to do that.') {
    super(403, 'forbidden', message);
  }
}
export class NotFoundError extends AppError {
  constructor(message = 'Not found.') {
    super(404, 'not_found', message);
  }
}
export class ConflictError extends AppError {
  constructor(message: string, details?: FieldErrors) {
    super(409, 'conflict', message, details);
  }
}
export class RateLimitedError extends AppError {
  constructor(readonly retryAfterSeconds: number) {
    super(429, 'rate_limited', `Too many sign-in attempts. Try again in ${Math.ceil(retryAfterSeconds / 60)} minute(s).`);
  }
}
/** A request the programme's own rules do not allow without a recorded reason (e.g. a step down with unmet rules). */
export class PolicyNotMetError extends AppError {
  constructor(message: string, unmet: { code: string; message: string }[]) {
    super(422, 'policy_not_met', message, { unmet });
  }
}
/** A plausible-but-unusual value the user must confirm before it is saved (e.g. a weight under 1 kg). */
export class NeedsConfirmationError extends AppError {
  constructor(message: string, details: FieldErrors) {
    super(422, 'needs_confirmation', message, details);
  }
}
export class ServiceUnavailableError extends AppError {
  constructor(message = 'Nestflow is briefly unavailable. Please try again in a moment.') {
    super(503, 'unavailable', message);
  }
}
