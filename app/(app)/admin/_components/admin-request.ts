"use client";

export type AdminReply = { ok: true } | { ok: false; message: string };

/** A same-origin JSON write to /api/admin/**; the server's message on refusal, a plain one when offline. */
export async function adminRequest(url: string, method: "PATCH" | "POST", body: unknown): Promise<AdminReply> {
  const res = await fetch(url, { method, headers: { "content-type": "application/json" }, body: JSON.stringify(body) }).catch(() => null);
  if (!res) return { ok: false, message: "Could not reach the server. Administration needs a connection." };
  if (res.ok) return { ok: true };
  const data = (await res.json().catch(() => null)) as { error?: { message?: string } } | null;
  return { ok: false, message: data?.error?.message ?? "Something went wrong. Try again." };
}
