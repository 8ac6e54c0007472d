"use client";

import { useLiveQuery } from "dexie-react-hooks";
import { getWindowcallDb } from "@/lib/offline/db";

/** Field names of the sessions on this phone (its own and synced ones), newest first, each once. */
export function useEarlierFields(limit = 20): string[] {
  return (
    useLiveQuery(async () => {
      const sessions = await getWindowcallDb().sessions.orderBy("startedAtWallMs").reverse().toArray();
      const seen = new Map<string, string>();
      for (const s of sessions) {
        const name = s.fieldName.trim();
        if (name && !seen.has(name.toLocaleLowerCase())) seen.set(name.toLocaleLowerCase(), name);
      }
      return [...seen.values()].slice(0, limit);
    }, [limit]) ?? []
  );
}
