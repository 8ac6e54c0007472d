import { BODY_LIMIT, readBody } from "./api";
import { AppError } from "./errors";

type Handler<C> = (request: Request, context: C) => Promise<Response>;

const reply = (status: number, code: string, message: string) => Response.json({ error: { code, message } }, { status });

/**
 * A guard in front of next-auth's own endpoints (app/api/auth/[...nextauth]): it answers the
 * requests next-auth would turn into a 500 with a 4xx instead — a GET to the credentials
 * callback ("not supported", 500), a body over 64 kB or a JSON body that does not parse (thrown
 * from its body reader) — and maps anything else it throws, or answers with a 5xx, on odd input
 * (a callbackUrl that is no URL) to a 400.
 */
export function guardAuthHandler<C>(handler: Handler<C>): Handler<C> {
  return async (request, context) => {
    const parts = new URL(request.url).pathname.split("/").filter(Boolean); // api, auth, action, provider
    if (parts[2] === "callback" && parts[3] === "credentials" && request.method !== "POST") {
      return reply(405, "method_not_allowed", "Sign in with the form: the credentials callback accepts POST only.");
    }
    if (request.method === "POST") {
      try {
        const body = await readBody(request.clone(), BODY_LIMIT.default);
        if ((request.headers.get("content-type") ?? "").includes("application/json")) JSON.parse(body);
      } catch (e) {
        if (e instanceof AppError) return reply(e.status, e.code, e.message);
        return reply(400, "bad_json", "The request body is not valid JSON.");
      }
    }
    let response: Response;
    try {
      response = await handler(request, context);
    } catch (e) {
      console.error("[auth] request refused", e);
      return reply(400, "bad_request", "This sign-in request could not be read.");
    }
    // next-auth answers 500 only to what its own checks refuse in the request (a callbackUrl
    // parameter or cookie that is no URL, a provider type that has no such callback)
    if (response.status >= 500) {
      console.error("[auth] next-auth refused a request with", response.status);
      return reply(400, "bad_request", "This sign-in request could not be read.");
    }
    return response;
  };
}
