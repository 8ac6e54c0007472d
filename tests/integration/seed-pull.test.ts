import "./support/session";
import { afterAll, describe, expect, it } from "vitest";
import { pullReplySchema } from "@/lib/validations/sync";
import { actAs } from "./support/session";
import { demoUser, getPool } from "./support/db";
import { pull } from "./sync-fixtures";

/**
 * The seeded demo data is what `npm start` shows: every demo account's phone must be able to
 * take its pull. The phone parses each page with the same schema (lib/offline/pull.ts); a page
 * it refuses is fetched again and again, and the phone never shows the runs.
 */
describe("seeded demo data", () => {
  afterAll(async () => getPool().end());

  for (const email of ["ada@example.com", "tobi@example.com", "lena@example.com", "mara@example.com"]) {
    it(`${email}: every page of a pull from 0 passes the phone's pull schema`, async () => {
      actAs(await demoUser(email));
      let cursor: string | number = 0;
      for (let pages = 0; pages < 50; pages++) {
        const { status, body } = await pull(cursor);
        expect(status).toBe(200);
        const parsed = pullReplySchema.safeParse(body);
        expect(parsed.success ? [] : parsed.error.issues.slice(0, 3)).toEqual([]);
        if (!body.hasMore) return;
        cursor = body.nextCursor;
      }
      throw new Error("more than 50 pages");
    });
  }

  it("mara@example.com keeps time in round 1 of the demo contest and for Bea's re-flight in round 2: her pull's last page carries those duties", async () => {
    actAs(await demoUser("mara@example.com"));
    let cursor: string | number = 0;
    for (let pages = 0; pages < 50; pages++) {
      const { body } = await pull(cursor);
      if (body.hasMore) { cursor = body.nextCursor; continue; }
      const duties = pullReplySchema.parse(body).contestDuties ?? [];
      const cup = duties.filter((d) => d.contestName === "Heronmoor Winter Cup");
      const groups = cup.filter((d) => d.reflightId === undefined);
      expect(groups.length).toBeGreaterThan(0);
      // the seed's re-flight (db/seed/demo-reflights.ts): Bea flies round 2 again, timed by Mara
      expect(cup.filter((d) => d.reflightId !== undefined).map((d) => [d.roundNumber, d.pilots.map((p) => p.name)])).toEqual([[2, ["Bea Quillfeather"]]]);
      for (const d of groups) {
        expect(d.roundNumber).toBe(1);
        expect(d.pilots.length).toBeGreaterThan(0);
        expect(d.pilots.length).toBeLessThanOrEqual(4);
      }
      return;
    }
    throw new Error("more than 50 pages");
  });
});
