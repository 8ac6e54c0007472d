import { liveQuery } from "dexie";
import { describe, expect, it } from "vitest";
import { sharedLiveQuery } from "@/lib/offline/shared-live-query";
import { freshDb } from "./helpers";

/** Resolves once `check` holds, polling the event loop (Dexie answers live queries asynchronously). */
async function until(check: () => boolean): Promise<void> {
  for (let i = 0; i < 200 && !check(); i++) await new Promise((r) => setTimeout(r, 5));
  expect(check()).toBe(true);
}

describe("one live query for every listener (ours: issue #10, /field's load)", () => {
  it("runs once per change however many components listen, and every listener sees the answer", async () => {
    const db = freshDb();
    const count = () => db.meta.toArray().then((rows) => rows.length);
    // what useLiveQuery in each of two components does: a live query of its own each
    let ownReads = 0;
    const own = [1, 2].map(() =>
      liveQuery(() => {
        ownReads++;
        return count();
      }).subscribe({ next: () => undefined }),
    );
    let sharedReads = 0;
    const query = sharedLiveQuery(() => {
      sharedReads++;
      return count();
    });
    let heardA = 0;
    let heardB = 0;
    const stopA = query.subscribe(() => heardA++);
    const stopB = query.subscribe(() => heardB++);
    await until(() => query.getSnapshot() === 0);
    await db.meta.put({ key: "pullCursor", value: "0.1" });
    await until(() => query.getSnapshot() === 1 && ownReads >= 2 * sharedReads);
    await new Promise((r) => setTimeout(r, 50));
    expect(sharedReads).toBeGreaterThan(0);
    expect(ownReads).toBe(2 * sharedReads); // two listeners, the reads of one
    expect(heardA).toBe(heardB);
    stopA();
    stopB();
    own.forEach((s) => s.unsubscribe());
  });

  it("stops with the last listener, forgets its answer, and starts afresh with the next", async () => {
    const db = freshDb();
    let reads = 0;
    const query = sharedLiveQuery(async () => {
      reads++;
      return (await db.meta.toArray()).length;
    });
    const stop = query.subscribe(() => undefined);
    await until(() => query.getSnapshot() === 0);
    await new Promise((r) => setTimeout(r, 50));
    stop();
    expect(query.getSnapshot()).toBeUndefined();
    const readsWhileListened = reads;
    await db.meta.put({ key: "pullCursor", value: "0.1" });
    await new Promise((r) => setTimeout(r, 50));
    expect(reads).toBe(readsWhileListened); // nobody listening: the write re-ran nothing
    const again = query.subscribe(() => undefined);
    await until(() => query.getSnapshot() === 1);
    expect(reads).toBeGreaterThan(readsWhileListened);
    again();
  });

  it("hands the query's error to the component, as useLiveQuery does", async () => {
    const query = sharedLiveQuery<number>(async () => {
      throw new Error("storage is gone");
    });
    const stop = query.subscribe(() => undefined);
    await until(() => {
      try {
        query.getSnapshot();
        return false;
      } catch {
        return true;
      }
    });
    expect(() => query.getSnapshot()).toThrow("storage is gone");
    stop();
  });
});
