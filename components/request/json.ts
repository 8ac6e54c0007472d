"use client";

/** A field's complaint from the server's zod check (`{ error: { issues } }`, lib/api.ts). */
export type Issue = { path: string; message: string };

/** What a same-origin JSON request came back with: the body on success, the server's sentence on refusal. */
export type Reply<T = unknown> =
  | { ok: true; status: number; data: T }
  | { ok: false; status: number; code?: string; message: string; issues?: Issue[] };

type Method = "GET" | "POST" | "PUT" | "PATCH" | "DELETE";

/** The sentence for a request that never reached the server (status 0). */
export const UNREACHABLE = "Could not reach the server. This needs a connection: try again when online.";
const FALLBACK = "Something went wrong. Try again.";

/**
 * THE same-origin JSON request of every screen: sends `body` as JSON (none when undefined; a write is
 * always typed application/json, as the proxy requires), never
 * throws, and answers with the reply's body or the server's refusal (`{ error: { code, message,
 * issues } }`, lib/api.ts). A network failure is a refusal with status 0 and {@link UNREACHABLE}.
 */
export async function sendJson<T = unknown>(method: Method, url: string, body?: unknown): Promise<Reply<T>> {
  // every write says JSON, body or not: the proxy refuses a write of any other type (lib/security/request-origin.ts)
  const init: RequestInit = { method, cache: "no-store", ...(method === "GET" ? {} : { headers: { "content-type": "application/json" } }) };
  if (body !== undefined) init.body = JSON.stringify(body);
  const res = await fetch(url, init).catch(() => null);
  if (!res) return { ok: false, status: 0, message: UNREACHABLE };
  const data = res.status === 204 ? null : ((await res.json().catch(() => null)) as unknown);
  if (res.ok) return { ok: true, status: res.status, data: data as T };
  const error = (data as { error?: { code?: string; message?: string; issues?: Issue[] } } | null)?.error;
  return { ok: false, status: res.status, code: error?.code, message: error?.message ?? FALLBACK, issues: error?.issues };
}

/** {@link sendJson} for TanStack Query and other callers that want a throw: the body, or an Error carrying the server's sentence. */
export async function requestJson<T = unknown>(method: Method, url: string, body?: unknown): Promise<T> {
  const reply = await sendJson<T>(method, url, body);
  if (!reply.ok) throw new Error(reply.message);
  return reply.data;
}
