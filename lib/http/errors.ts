/**
 * The one error type of Correlary's services. `code` is `<kind>:<subject>`, e.g.
 * `not_found:correlation` or `forbidden:approve-own-version`; the kind decides the HTTP status.
 */
export class AppError extends Error {
  constructor(
    readonly code: string,
    message: string,
    readonly details?: unknown,
    readonly headers?: Record<string, string>,
  ) {
    super(message);
    this.name = 'AppError';
  }
}

const STATUS_BY_KIND: Record<string, number> = {
  bad_request: 400,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  too_large: 413,
  invalid: 422,
  rate_limited: 429,
  unavailable: 503,
};

export function statusOf(code: string): number {
  return STATUS_BY_KIND[code.split(':')[0]] ?? 500;
}

export interface FieldIssue {
  path: string;
  message: string;
}

/** Turns a list of field issues into a 422 error carrying them as details. */
export function invalid(subject: string, message: string, issues: FieldIssue[]): AppError {
  return new AppError(`invalid:${subject}`, message, { issues });
}
