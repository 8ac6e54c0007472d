"use client";

import { useLiveQuery } from "dexie-react-hooks";
import { useEffect } from "react";
import { z } from "zod";
import type { ClubMate } from "@/lib/field/new-window";
import { getMeta, getWindowcallDb, setMeta } from "@/lib/offline/db";

const replySchema = z.object({ mates: z.array(z.object({ id: z.string().uuid(), name: z.string().min(1).max(200) })).max(5000) });

/**
 * The people who share a club with the signed-in pilot, as last fetched with signal and kept
 * on the device, so the set-up form can link a lane to a club mate's account offline.
 * Refreshed once per mount when the browser is online; a failed fetch keeps the last copy.
 */
export function useClubMates(): readonly ClubMate[] {
  const mates = useLiveQuery(async () => (await getMeta(getWindowcallDb(), "clubMates")) ?? [], []);
  useEffect(() => {
    if (!navigator.onLine) return;
    const controller = new AbortController();
    void (async () => {
      const res = await fetch("/api/club-mates", { cache: "no-store", signal: controller.signal });
      if (!res.ok) return;
      const parsed = replySchema.safeParse(await res.json());
      if (parsed.success) await setMeta(getWindowcallDb(), "clubMates", parsed.data.mates);
    })().catch(() => undefined);
    return () => controller.abort();
  }, []);
  return mates ?? [];
}
