"use client";

import type { PilotGrantRow, RosterPilot } from "@/lib/coach/types";

export type { PilotGrantRow, RosterPilot };

export { coachKeys } from "./coach-keys";

/** A same-origin JSON request; a refusal throws an Error carrying the server's message. */
export async function coachRequest<T>(url: string, init: { method?: "GET" | "POST" | "PATCH" | "DELETE"; body?: unknown } = {}): Promise<T> {
  const res = await fetch(url, {
    method: init.method ?? "GET",
    cache: "no-store",
    headers: init.body === undefined ? {} : { "content-type": "application/json" },
    body: init.body === undefined ? undefined : JSON.stringify(init.body),
  }).catch(() => null);
  if (!res) throw new Error("Could not reach the server. This needs a connection.");
  if (res.status === 204) return undefined as T;
  const data = (await res.json().catch(() => null)) as (T & { error?: { message?: string } }) | null;
  if (!res.ok) throw new Error(data?.error?.message ?? "Something went wrong. Try again.");
  return data as T;
}
