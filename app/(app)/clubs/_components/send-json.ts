"use client";

export type Reply<T = unknown> = { ok: true; data: T } | { ok: false; status: number; message: string; issues?: { path: string; message: string }[] };

/** A same-origin JSON request from a club screen; a network failure is a reply with status 0 and a sentence. */
export async function sendJson<T = unknown>(method: "POST" | "PUT" | "PATCH" | "DELETE", url: string, body?: unknown): Promise<Reply<T>> {
  const init: RequestInit = { method, headers: { "content-type": "application/json" } };
  if (body !== undefined) init.body = JSON.stringify(body);
  const res = await fetch(url, init).catch(() => null);
  if (!res) return { ok: false, status: 0, message: "Could not reach the server. Try again when online." };
  const data = (await res.json().catch(() => null)) as { error?: { message?: string; issues?: { path: string; message: string }[] } } | null;
  if (res.ok) return { ok: true, data: data as T };
  return { ok: false, status: res.status, message: data?.error?.message ?? "Something went wrong. Try again.", issues: data?.error?.issues };
}
