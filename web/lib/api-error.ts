export type FieldErrors = Record<string, string[] | { code: string; message: string }[]>;

/** The messages of one detail entry, whatever its form. */
export const detailMessages = (entry: FieldErrors[string] | undefined): string[] => (entry ?? []).map((m) => (typeof m === 'string' ? m : m.message));

/** Every failed API call rejects with this, decoded from the server's single error shape. */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly details: FieldErrors | undefined;

  constructor(init: { status: number; code: string; message: string; details?: FieldErrors }) {
    super(init.message);
    this.name = 'ApiError';
    this.status = init.status;
    this.code = init.code;
    this.details = init.details;
  }
}

export const isApiError = (error: unknown): error is ApiError => error instanceof ApiError;

export const isServerError = (error: unknown): boolean =>
  isApiError(error) && (error.status >= 500 || error.status === 0);

/** A readable sentence for any thrown value, for toasts and inline alerts. */
export function errorMessage(error: unknown): string {
  if (isApiError(error)) return error.message;
  return 'Something went wrong. Try again in a moment.';
}
