/** Typed errors with a code and an HTTP status; the one mapper turns anything into a safe reply. */
export class AppError extends Error {
  constructor(
    readonly code: string,
    message: string,
    readonly status: number,
  ) {
    super(message);
    this.name = "AppError";
  }
}

export class UnauthorizedError extends AppError {
  constructor(message = "Sign in to continue.") {
    super("unauthorized", message, 401);
  }
}

export class ForbiddenError extends AppError {
  constructor(message = "You are not allowed to do this.") {
    super("forbidden", message, 403);
  }
}

export class NotFoundError extends AppError {
  constructor(message = "Not found.") {
    super("not_found", message, 404);
  }
}

export class ValidationError extends AppError {
  constructor(
    message: string,
    readonly issues: { path: string; message: string }[] = [],
  ) {
    super("invalid_input", message, 422);
  }
}

export class ConflictError extends AppError {
  constructor(code: string, message: string) {
    super(code, message, 409);
  }
}

export class PayloadTooLargeError extends AppError {
  constructor(maxBytes: number) {
    super("too_large", `The request body is larger than ${Math.round(maxBytes / 1024)} kB.`, 413);
  }
}

export class RateLimitError extends AppError {
  constructor(message = "Too many attempts. Wait a few minutes and try again.") {
    super("rate_limited", message, 429);
  }
}

export type ErrorBody = { error: { code: string; message: string; issues?: { path: string; message: string }[] } };
