import { describe, expect, it } from "vitest";
import { getMeta, type WindowcallDb } from "@/lib/offline/db";
import { pullAll } from "@/lib/offline/pull";
import { freshDbsPerTest, serverWithData } from "./helpers";

// A pulled page is stored in small transactions with a yield between them (issue #10: one transaction per
// page of 500 was one long task of /field's load), and the cursor last, on its own. A tab killed between two
// of them must lose nothing: the next pull asks for the same page again and ends with the same store.

const open = freshDbsPerTest();

const store = async (db: WindowcallDb) => ({
  events: await db.events.orderBy("id").toArray(),
  sessions: await db.sessions.orderBy("id").toArray(),
  runs: await db.runs.orderBy("id").toArray(),
  cursor: await getMeta(db, "pullCursor"),
});

class Killed extends Error {}

describe("pull in slices", () => {
  it("stores a page in transactions of at most writeSlice records, the cursor after them", async () => {
    const { server } = await serverWithData(open, 6, ["East field", "West field"]); // 2 sessions + 2 runs + 12 events = 16 items
    server.pullPageSize = 7;
    const db = open();
    const cursors: unknown[] = [];
    let slices = 0;
    const outcome = await pullAll({
      db, fetch: server.fetch, writeSlice: 3,
      afterSlice: () => {
        slices++;
        cursors.push(getMeta(db, "pullCursor"));
      },
    });
    expect(outcome).toEqual({ kind: "ok", items: 16 });
    // pages of 7, 7 and 2 items: 3 + 3 + 1 transactions of records
    expect(slices).toBe(7);
    // while a page's records were being stored, the cursor still named the page before it
    expect(await Promise.all(cursors)).toEqual([undefined, undefined, undefined, "1.7", "1.7", "1.7", "1.14"]);
    expect((await store(db)).cursor).toBe("1.16");
  });

  it("a pull killed between any two slices resumes and ends with the same store as an uninterrupted one", async () => {
    const { server } = await serverWithData(open, 6, ["East field", "West field"]);
    server.pullPageSize = 7;
    const whole = open();
    expect(await pullAll({ db: whole, fetch: server.fetch, writeSlice: 3 })).toEqual({ kind: "ok", items: 16 });
    const expected = await store(whole);
    for (let killAt = 1; killAt <= 7; killAt++) {
      const db = open();
      let slices = 0;
      const kill = () => {
        if (++slices === killAt) throw new Killed(`killed after slice ${killAt}`);
      };
      await expect(pullAll({ db, fetch: server.fetch, writeSlice: 3, afterSlice: kill })).rejects.toBeInstanceOf(Killed);
      const partial = await store(db);
      // the slices done so far are stored (pages of 7, 7, 2 in slices of 3, 3, 1 | 3, 3, 1 | 2),
      // but the cursor never passes a page not stored whole
      expect(partial.events.length + partial.sessions.length + partial.runs.length).toBe([3, 6, 7, 10, 13, 14, 16][killAt - 1]);
      expect(partial.cursor).toBe(killAt <= 3 ? undefined : killAt <= 6 ? "1.7" : "1.14");
      expect(await pullAll({ db, fetch: server.fetch, writeSlice: 3 })).toMatchObject({ kind: "ok" });
      expect(await store(db)).toEqual(expected);
    }
  });
});
