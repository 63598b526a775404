// Delivery outcome classes the worker acts on: a temporary failure is retried with backoff, a permanent one is
// marked failed and alerts the coordinator. Messages never carry the recipient, so they are safe to log.
interface SendErrorDetails {
  providerCode?: string | number;
  cause?: unknown;
}

export class TemporarySendError extends Error {
  readonly providerCode?: string | number;
  constructor(message: string, details: SendErrorDetails = {}) {
    super(message, { cause: details.cause });
    this.name = 'TemporarySendError';
    this.providerCode = details.providerCode;
  }
}

export class PermanentSendError extends Error {
  readonly providerCode?: string | number;
  constructor(message: string, details: SendErrorDetails = {}) {
    super(message, { cause: details.cause });
    this.name = 'PermanentSendError';
    this.providerCode = details.providerCode;
  }
}
