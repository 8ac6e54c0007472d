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

  it("the demo contest's entries are drawn in the same order on every install: their ids sort as the seed lists them", async () => {
    // the draw orders entries by id (lib/contests/entries-draw.ts), so with the seed's fixed draw seed
    // this order is what makes the demo's groups — and which pilot gets round 2's card penalty — the same everywhere
    const pool = getPool();
    const members = await pool.query<{ name: string }>(
      "select name from users where email in ('ada@example.com', 'tobi@example.com', 'lena@example.com') order by name collate \"C\"");
    const entries = await pool.query<{ pilot_name: string }>(
      `select e.pilot_name from contest_entries e join contests c on c.id = e.contest_id
       where c.name = 'Heronmoor Winter Cup' and e.withdrawn_at is null order by e.id`);
    expect(entries.rows.map((r) => r.pilot_name)).toEqual([
      ...members.rows.map((r) => r.name),
      "Oren Halloway", "Bea Quillfeather", "Cass Merriden", "Dov Ashgrove", "Elin Tarrow", "Finn Brackley", "Gus Wendle", "Hana Roskell", "Ivo Pettaway",
    ]);
  });
});
