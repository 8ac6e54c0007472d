import { z } from "zod";
import { AppError, ValidationError, type ErrorBody } from "./errors";

/** Maps any thrown value to `{ error: { code, message } }` with the right status; never leaks internals. */
export function handleApiError(error: unknown): Response {
  if (error instanceof z.ZodError) error = toValidationError(error);
  if (error instanceof AppError) {
    const body: ErrorBody = { error: { code: error.code, message: error.message } };
    if (error instanceof ValidationError && error.issues.length) body.error.issues = error.issues;
    return Response.json(body, { status: error.status });
  }
  console.error("[api] unexpected error", error);
  return Response.json({ error: { code: "internal", message: "Something went wrong on our side." } } satisfies ErrorBody, {
    status: 500,
  });
}

/** A readable summary of a zod failure, one line per field. */
export function toValidationError(error: z.ZodError): ValidationError {
  const issues = error.issues.map((i) => ({ path: i.path.join("."), message: i.message }));
  const first = issues[0];
  const summary = first ? (first.path ? `${first.path}: ${first.message}` : first.message) : "Invalid input.";
  return new ValidationError(summary, issues);
}

/** Reads a JSON body and parses it with the schema before any I/O; a bad body is a 400/422, not a crash. */
export async function parseJson<T extends z.ZodType>(request: Request, schema: T): Promise<z.infer<T>> {
  let raw: unknown;
  try {
    raw = await request.json();
  } catch {
    throw new AppError("bad_json", "The request body is not valid JSON.", 400);
  }
  const parsed = schema.safeParse(raw);
  if (!parsed.success) throw toValidationError(parsed.error);
  return parsed.data;
}

/** Wraps a route handler so every error goes through the one mapper. */
export function route<A extends unknown[]>(handler: (...args: A) => Promise<Response>) {
  return async (...args: A): Promise<Response> => {
    try {
      return await handler(...args);
    } catch (error) {
      return handleApiError(error);
    }
  };
}
