import { getMeta, setMeta, type WindowcallDb } from "./db";
import type { PulledModel } from "@/lib/validations/sync";

/**
 * The pilot's hangar on the phone: the account's device database keeps the list (meta "models"),
 * written by every pull (pullReplySchema.models: so a second phone of the same pilot has the
 * same models) and by a fetch of /api/models when the field opens with signal; the field offers
 * them with none. The model each pilot flew last on this phone is a preference of the phone
 * (localStorage). A model choice itself is a "model" event of the run, synced like every tap.
 */
export type CachedModel = PulledModel;

export async function cachedModels(db: WindowcallDb): Promise<CachedModel[]> {
  return (await getMeta(db, "models")) ?? [];
}

/** Fetches the hangar and keeps it; offline (or on any error) the kept list stays as it was. */
export async function refreshModels(db: WindowcallDb): Promise<void> {
  try {
    const res = await fetch("/api/models", { cache: "no-store" });
    if (!res.ok) return;
    const { models } = (await res.json()) as { models: CachedModel[] };
    await setMeta(db, "models", models.map((m) => ({ id: m.id, name: m.name, status: m.status })));
  } catch {
    // offline: the list from the last pull or fetch stays
  }
}

const lastKey = (userId: string) => `windowcall.hangar.last-model.${userId}`;

export function lastModel(userId: string): string | null {
  return localStorage.getItem(lastKey(userId));
}

export function rememberModel(userId: string, modelId: string): void {
  localStorage.setItem(lastKey(userId), modelId);
}
