import { z } from "zod";
import { AppError, PayloadTooLargeError, ValidationError, type ErrorBody } from "./errors";

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

/** Byte caps on request bodies: a push carries up to 500 items; anything else is small. */
export const BODY_LIMIT = { default: 64 * 1024, push: 1024 * 1024 } as const;

/**
 * The body as text, refusing (413) as soon as more than `maxBytes` have arrived: the stream is
 * counted while it is read, so a missing or false Content-Length changes nothing.
 */
export async function readBody(request: Request, maxBytes: number): Promise<string> {
  const declared = Number(request.headers.get("content-length"));
  if (Number.isFinite(declared) && declared > maxBytes) throw new PayloadTooLargeError(maxBytes);
  if (!request.body) return "";
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read().catch(() => {
      throw new AppError("bad_body", "The request body could not be read.", 400);
    });
    if (done) break;
    size += value.byteLength;
    if (size > maxBytes) {
      await reader.cancel().catch(() => undefined);
      throw new PayloadTooLargeError(maxBytes);
    }
    chunks.push(value);
  }
  const bytes = new Uint8Array(size);
  let at = 0;
  for (const c of chunks) {
    bytes.set(c, at);
    at += c.byteLength;
  }
  return new TextDecoder().decode(bytes);
}

/**
 * Reads a JSON body of at most `maxBytes` (default 64 kB; over it → 413) and parses it with the
 * schema before any I/O; a bad body is a 400/422, not a crash.
 */
export async function parseJson<T extends z.ZodType>(
  request: Request,
  schema: T,
  options: { maxBytes?: number } = {},
): Promise<z.infer<T>> {
  const text = await readBody(request, options.maxBytes ?? BODY_LIMIT.default);
  let raw: unknown;
  try {
    raw = JSON.parse(text);
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
