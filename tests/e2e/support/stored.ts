import type { Page } from "@playwright/test";

/** Field names of every session held in any IndexedDB database of the page's origin (all accounts' device databases). */
export async function storedFieldNames(page: Page): Promise<string[]> {
  return page.evaluate(async () => {
    const found: string[] = [];
    for (const { name } of await indexedDB.databases()) {
      if (!name) continue;
      const idb = await new Promise<IDBDatabase>((resolve, reject) => {
        const open = indexedDB.open(name);
        open.onsuccess = () => resolve(open.result);
        open.onerror = () => reject(open.error);
      });
      if (idb.objectStoreNames.contains("sessions")) {
        const all = await new Promise<{ fieldName: string }[]>((resolve) => {
          const req = idb.transaction("sessions").objectStore("sessions").getAll();
          req.onsuccess = () => resolve(req.result);
        });
        found.push(...all.map((s) => s.fieldName));
      }
      idb.close();
    }
    return found;
  });
}
