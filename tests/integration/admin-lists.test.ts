import "./support/session";
import { afterAll, describe, expect, it } from "vitest";
import { clubs, memberships, syncRejections } from "@/db/schema";
import { sql } from "drizzle-orm";
import { listAdminActions, listClubsWithCounts, listSyncRejections } from "@/db/queries/admin-lists";
import { searchUsers } from "@/db/queries/admin";
import { actAs } from "./support/session";
import { patchUser } from "./support/admin";
import { db, freshUser, getPool } from "./support/db";

/** What /admin lists: accounts found by e-mail or name, clubs with member counts, refused sync items, the audit log. */

afterAll(async () => {
  actAs(null);
  await getPool().end();
});

describe("admin lists", () => {
  it("finds accounts by part of the e-mail or the name, in any case, with % and _ taken literally", async () => {
    const tag = crypto.randomUUID().slice(0, 8);
    const a = await freshUser(`find-${tag}`);
    expect((await searchUsers(db, { q: `FIND-${tag}`, page: 1 })).users.map((u) => u.id)).toEqual([a.id]);
    expect((await searchUsers(db, { q: `Test find-${tag}`, page: 1 })).users.map((u) => u.id)).toEqual([a.id]); // the name
    expect((await searchUsers(db, { q: `find_${tag}`, page: 1 })).total).toBe(0);
    expect((await searchUsers(db, { q: "%", page: 1 })).total).toBe(0);
  });

  it("pages through the matches on the server", async () => {
    const tag = crypto.randomUUID().slice(0, 8);
    for (let i = 0; i < 23; i++) await freshUser(`page-${tag}`);
    const first = await searchUsers(db, { q: `page-${tag}`, page: 1 });
    const second = await searchUsers(db, { q: `page-${tag}`, page: 2 });
    expect([first.total, first.users.length, second.users.length]).toEqual([23, 20, 3]);
    expect(new Set([...first.users, ...second.users].map((u) => u.id)).size).toBe(23);
  });

  it("counts each club's members", async () => {
    const slug = `admin-list-${crypto.randomUUID().slice(0, 8)}`;
    const [club] = await db.insert(clubs).values({ name: "Quarry Lane Flyers", slug }).returning();
    const [empty] = await db.insert(clubs).values({ name: "Quarry Lane Empty", slug: `${slug}-empty` }).returning();
    for (const role of ["officer", "member"] as const) await db.insert(memberships).values({ clubId: club!.id, userId: (await freshUser("club")).id, role });
    const listed = await listClubsWithCounts(db);
    expect(listed.find((c) => c.id === club!.id)?.members).toBe(2);
    expect(listed.find((c) => c.id === empty!.id)?.members).toBe(0);
  });

  it("lists a refused sync item with its device, reason and account", async () => {
    const pilot = await freshUser("refused");
    const deviceId = `admin-list-${crypto.randomUUID()}`;
    await db.insert(syncRejections).values({ itemId: crypto.randomUUID(), deviceId, userId: pilot.id, reason: "runs: too many for one day" });
    expect((await listSyncRejections(db)).rows.find((r) => r.deviceId === deviceId)).toMatchObject({ reason: "runs: too many for one day", userEmail: pilot.email });
  });

  it("pages through refused sync items, newest first: every row once, 50 a page, the last page says there is no more", async () => {
    const pilot = await freshUser("refused-pages");
    const deviceId = `admin-pages-${crypto.randomUUID()}`;
    await db.insert(syncRejections).values(Array.from({ length: 120 }, (_, i) => ({
      itemId: crypto.randomUUID(), deviceId, userId: pilot.id, reason: `refusal ${i}`, createdAt: new Date(Date.UTC(2026, 0, 1, 0, 0, i)),
    })));
    const total = Number((await db.execute<{ n: string }>(sql`select count(*) as n from sync_rejections`)).rows[0]!.n);
    const seen: { id: string; at: number }[] = [];
    let page = 1;
    for (let more = true; more; page++) {
      const got = await listSyncRejections(db, page);
      expect(got.rows.length).toBe(got.more ? 50 : total - (page - 1) * 50);
      seen.push(...got.rows.map((r) => ({ id: r.id, at: r.createdAt.getTime() })));
      more = got.more;
    }
    expect(page - 1).toBe(Math.ceil(total / 50));
    expect(new Set(seen.map((r) => r.id)).size).toBe(total);
    expect(seen.every((r, i) => i === 0 || seen[i - 1]!.at >= r.at)).toBe(true);
    expect((await listSyncRejections(db, page)).rows).toEqual([]);
  });

  it("shows each admin action with who did it to whom", async () => {
    const admin = await freshUser("audit-admin", { role: "admin" });
    const pilot = await freshUser("audit-pilot");
    actAs(admin);
    expect((await patchUser(pilot.id, { action: "disable" })).status).toBe(200);
    const [latest] = (await listAdminActions(db)).rows.filter((a) => a.targetEmail === pilot.email);
    expect(latest).toMatchObject({ action: "user.disable", actorEmail: admin.email, targetEmail: pilot.email });
  });
});
