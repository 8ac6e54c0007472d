/**
 * The pilot's hangar on the phone: the models fetched from /api/models whenever there is signal,
 * kept in localStorage per account so the field can offer them with none, and the model each
 * pilot flew last (preselected next time). A model choice itself is a "model" event of the run,
 * recorded and synced like every tap.
 */
export type CachedModel = { id: string; name: string; status: string };

const modelsKey = (userId: string) => `windowcall.hangar.models.${userId}`;
const lastKey = (userId: string) => `windowcall.hangar.last-model.${userId}`;

export function cachedModels(userId: string): CachedModel[] {
  try {
    const list = JSON.parse(localStorage.getItem(modelsKey(userId)) ?? "[]") as CachedModel[];
    return Array.isArray(list) ? list.filter((m) => typeof m.id === "string" && typeof m.name === "string") : [];
  } catch {
    return [];
  }
}

/** Fetches the hangar and keeps it; offline (or on any error) the cached list stays as it was. */
export async function refreshModels(userId: string): Promise<CachedModel[]> {
  try {
    const res = await fetch("/api/models", { cache: "no-store" });
    if (!res.ok) return cachedModels(userId);
    const { models } = (await res.json()) as { models: CachedModel[] };
    const list = models.map((m) => ({ id: m.id, name: m.name, status: m.status }));
    localStorage.setItem(modelsKey(userId), JSON.stringify(list));
    return list;
  } catch {
    return cachedModels(userId);
  }
}

export function lastModel(userId: string): string | null {
  return localStorage.getItem(lastKey(userId));
}

export function rememberModel(userId: string, modelId: string): void {
  localStorage.setItem(lastKey(userId), modelId);
}
