"use client";

export type JsonReply = { ok: boolean; status: number; message?: string; issues?: { path: string; message: string }[] };

/** A same-origin JSON POST from the signed-out pages; a network failure is a reply with status 0. */
export async function postJson(url: string, body: unknown): Promise<JsonReply> {
  const res = await fetch(url, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) }).catch(() => null);
  if (!res) return { ok: false, status: 0, message: "Could not reach the server. Try again when online." };
  if (res.ok) return { ok: true, status: res.status };
  const data = (await res.json().catch(() => null)) as { error?: { message?: string; issues?: JsonReply["issues"] } } | null;
  return { ok: false, status: res.status, message: data?.error?.message ?? "Something went wrong. Try again.", issues: data?.error?.issues };
}
