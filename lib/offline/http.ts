import type { z } from "zod";

/** The fetch the sync client uses (injected in tests). */
export type FetchLike = (input: string, init?: RequestInit) => Promise<Response>;

/** Outcome of one JSON request, sorted by what the caller should do about it. */
export type HttpResult<T> =
  | { kind: "ok"; value: T }
  /** No answer at all (offline, DNS, connection reset): retry later. */
  | { kind: "network"; message: string }
  /** 401: stop and ask the user to sign in again. */
  | { kind: "signed-out" }
  /** Any other non-2xx status: retry later, showing the status. */
  | { kind: "http"; status: number; message: string }
  /** A 2xx whose body does not match the protocol: retry later, showing why. */
  | { kind: "bad-reply"; message: string };

/** Human-readable line for a failed result (for `lastError`). */
export function describeFailure(r: Exclude<HttpResult<unknown>, { kind: "ok" }>): string {
  switch (r.kind) {
    case "network":
      return `network: ${r.message}`;
    case "signed-out":
      return "signed out";
    case "http":
      return `server answered ${r.status}${r.message ? `: ${r.message}` : ""}`;
    case "bad-reply":
      return `unexpected reply: ${r.message}`;
  }
}

async function errorMessage(res: Response): Promise<string> {
  try {
    const body = (await res.json()) as { error?: { message?: unknown } };
    return typeof body?.error?.message === "string" ? body.error.message : "";
  } catch {
    return "";
  }
}

/** Send one request and parse a JSON reply with `schema`. Never throws. */
export async function requestJson<S extends z.ZodType>(
  fetchFn: FetchLike,
  url: string,
  init: RequestInit,
  schema: S,
): Promise<HttpResult<z.infer<S>>> {
  let res: Response;
  try {
    res = await fetchFn(url, { cache: "no-store", credentials: "same-origin", ...init });
  } catch (e) {
    return { kind: "network", message: e instanceof Error ? e.message : String(e) };
  }
  if (res.status === 401) return { kind: "signed-out" };
  if (!res.ok) return { kind: "http", status: res.status, message: await errorMessage(res) };
  try {
    const parsed = schema.safeParse(await res.json());
    if (!parsed.success) return { kind: "bad-reply", message: parsed.error.issues[0]?.message ?? "invalid" };
    return { kind: "ok", value: parsed.data };
  } catch (e) {
    return { kind: "bad-reply", message: e instanceof Error ? e.message : String(e) };
  }
}

/** A JSON POST body. */
export function postJson(body: unknown): RequestInit {
  return { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) };
}
