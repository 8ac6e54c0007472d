"use client";

import { useLiveQuery } from "dexie-react-hooks";
import { useEffect } from "react";
import { z } from "zod";
import { getMeta, getWindowcallDb, setMeta } from "@/lib/offline/db";

const note = z.string().max(600).nullable();
const fieldSchema = z.object({
  id: z.string().uuid(),
  name: z.string().min(1).max(80),
  clubName: z.string().min(1).max(200),
  latitude: z.number().nullable(),
  longitude: z.number().nullable(),
  launchDirection: note,
  safetyAreas: note,
  localRules: note,
});
const replySchema = z.object({ fields: z.array(fieldSchema).max(500) });
export type StoredClubField = z.infer<typeof fieldSchema>;

/**
 * The fields of the pilot's clubs with their cautions, as last fetched with signal and kept on the
 * device (the set-up form works offline). Refreshed once per mount when online; a failed fetch keeps
 * the last copy.
 */
export function useClubFields(): readonly StoredClubField[] {
  const fields = useLiveQuery(async () => (await getMeta(getWindowcallDb(), "clubFields")) ?? [], []);
  useEffect(() => {
    if (!navigator.onLine) return;
    const controller = new AbortController();
    void (async () => {
      const res = await fetch("/api/club-fields", { cache: "no-store", signal: controller.signal });
      if (!res.ok) return;
      const parsed = replySchema.safeParse(await res.json());
      if (parsed.success) await setMeta(getWindowcallDb(), "clubFields", parsed.data.fields);
    })().catch(() => undefined);
    return () => controller.abort();
  }, []);
  return fields ?? [];
}

/** The club field the typed name means (same name, ignoring case and outer spaces), if any. */
export function matchClubField(fields: readonly StoredClubField[], typed: string): StoredClubField | undefined {
  const name = typed.trim().toLocaleLowerCase();
  return name ? fields.find((f) => f.name.trim().toLocaleLowerCase() === name) : undefined;
}
