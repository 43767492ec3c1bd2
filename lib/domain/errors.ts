// The one error type of Hangarleaf. Domain code throws it; route handlers and actions turn it into
// `{ "error": { "code", "message" } }` with the matching status.

export const errorStatus = {
  bad_request: 400,
  unauthorized: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  payload_too_large: 413,
  unsupported_media_type: 415,
  invalid: 422,
  rate_limited: 429,
  internal: 500,
} as const;

export type ErrorCode = keyof typeof errorStatus;

const defaultMessages: Record<ErrorCode, string> = {
  bad_request: "The request could not be read.",
  unauthorized: "Sign in to continue.",
  forbidden: "Your role does not allow this.",
  not_found: "Not found.",
  conflict: "That conflicts with what is already stored.",
  payload_too_large: "That is too large.",
  unsupported_media_type: "That type of file is not accepted here.",
  invalid: "Some fields are not valid.",
  rate_limited: "Too many attempts. Wait a moment and try again.",
  internal: "Something went wrong on the server. Try again; if it keeps happening, tell an admin.",
};

export type FieldErrors = Record<string, string>;

export class AppError extends Error {
  readonly code: ErrorCode;
  readonly fields?: FieldErrors;
  readonly retryAfterSeconds?: number;

  constructor(code: ErrorCode, message?: string, options: { cause?: unknown; fields?: FieldErrors; retryAfterSeconds?: number } = {}) {
    super(message ?? defaultMessages[code], { cause: options.cause });
    this.name = "AppError";
    this.code = code;
    this.fields = options.fields;
    this.retryAfterSeconds = options.retryAfterSeconds;
  }

  get status(): number {
    return errorStatus[this.code];
  }

  toBody() {
    return {
      error: {
        code: this.code,
        message: this.message,
        ...(this.fields ? { fields: this.fields } : {}),
      },
    };
  }

  toResponse(): Response {
    const headers: Record<string, string> = {};
    if (this.retryAfterSeconds !== undefined) headers["Retry-After"] = String(this.retryAfterSeconds);
    return Response.json(this.toBody(), { status: this.status, headers });
  }
}

/** The SQLSTATE of a PostgreSQL error, whether drizzle wrapped it or not ("23505" unique violation). */
export function databaseErrorCode(error: unknown): string | undefined {
  const e = (error ?? {}) as { code?: unknown; cause?: { code?: unknown } };
  if (typeof e.code === "string") return e.code;
  return typeof e.cause?.code === "string" ? e.cause.code : undefined;
}

/** Any thrown value as an AppError; unknown causes are logged and answered with a generic message. */
export function toAppError(error: unknown): AppError {
  if (error instanceof AppError) return error;
  console.error(error);
  return new AppError("internal", undefined, { cause: error });
}
