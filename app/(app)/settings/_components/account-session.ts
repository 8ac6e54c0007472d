"use client";

import { signOut } from "next-auth/react";
import { getWindowcallDb } from "@/lib/offline/db";
import { clearAccountOnDevice, endServerSession } from "@/lib/offline/sign-out";

/** Field errors from a zod-shaped list of issues (the first message per field). */
export function fieldErrors<K extends string>(issues: { path: PropertyKey[] | string; message: string }[]): Partial<Record<K, string>> {
  const out: Partial<Record<K, string>> = {};
  for (const issue of issues) {
    const key = (Array.isArray(issue.path) ? String(issue.path[0] ?? "") : String(issue.path).split(".")[0]) as K;
    out[key] ??= issue.message;
  }
  return out;
}

/**
 * Signs this browser out: the sync client sends nothing more, the server session ends (offline: at
 * the next request that reaches the server), this account is cleared from the phone
 * (lib/offline/sign-out.ts: unsent records stay sealed for this account, nothing else is kept), and
 * the sign-in page loads afresh on the origin in use (a full load, so nothing stays in memory).
 */
export async function signOutHere(query = "", client?: { close(): void } | null): Promise<void> {
  client?.close();
  await endServerSession(() => signOut({ redirect: false })); // offline: finished at the next request that reaches the server
  await clearAccountOnDevice(getWindowcallDb()).catch(() => undefined);
  window.location.assign(new URL(`/sign-in${query}`, window.location.origin).href);
}
