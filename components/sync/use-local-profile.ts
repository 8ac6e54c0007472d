"use client";

import { useLiveQuery } from "dexie-react-hooks";
import { getMeta, getWindowcallDb, type MetaValues } from "@/lib/offline/db";

/** The signed-in user as last seen online (undefined while loading, null if never cached). */
export function useLocalProfile(): MetaValues["profile"] | null | undefined {
  return useLiveQuery(async () => (await getMeta(getWindowcallDb(), "profile")) ?? null, []);
}
