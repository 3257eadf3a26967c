/** Machine codes of the API contract and the HTTP status each one answers with. */
export const ERROR_STATUS = {
  bad_request: 400,
  invalid_json: 400,
  validation_failed: 400,
  unauthorized: 401,
  forbidden: 403,
  not_found: 404,
  method_not_allowed: 405,
  conflict: 409,
  payload_too_large: 413,
  unsupported_media_type: 415,
} as const;

export type ErrorCode = keyof typeof ERROR_STATUS;

/** An error whose message is safe to show to the person or program that caused it. */
export class AppError extends Error {
  readonly code: ErrorCode;
  readonly details?: unknown;

  constructor(code: ErrorCode, message: string, details?: unknown) {
    super(message);
    this.name = "AppError";
    this.code = code;
    this.details = details;
  }

  get status(): number {
    return ERROR_STATUS[this.code];
  }
}

export const notFound = (what: string) => new AppError("not_found", `${what} was not found.`);
export const forbidden = (message = "Your role does not allow this.") => new AppError("forbidden", message);
