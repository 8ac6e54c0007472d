import "./support/session";
import { afterAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import { coachGrants, devices, events, syncRejections } from "@/db/schema";
import { POST as timeRoute } from "@/app/api/time/route";
import { actAs } from "./support/session";
import { db, demoUser, getPool } from "./support/db";
import { deviceId, pull, push, recorder, run, session, T0 } from "./sync-fixtures";
import { POST as pushRoute } from "@/app/api/sync/push/route";
import { listChanges } from "@/db/queries/sync-pull";
import { cursorAfter } from "@/lib/validations/sync";

afterAll(async () => {
  await getPool().end();
});

const post = (body: unknown) => timeRoute(new Request("http://test/api/time", { method: "POST", body: JSON.stringify(body) }));

describe("POST /api/time", () => {
  it("is 401 signed out, 422 without t1, and echoes t1 with t2 ≤ t3 from the server clock", async () => {
    actAs(null);
    expect((await post({ t1: 1 })).status).toBe(401);
    actAs(await demoUser("ada@example.com"));
    expect((await post({})).status).toBe(422);
    const before = Date.now();
    const res = await post({ t1: 12.5 });
    const after = Date.now();
    const body = await res.json();
    expect(body.t1).toBe(12.5);
    expect(body.t2).toBeGreaterThanOrEqual(before);
    expect(body.t3).toBeGreaterThanOrEqual(body.t2);
    expect(body.t3).toBeLessThanOrEqual(after);
  });
});

describe("POST /api/sync/push — access", () => {
  it("is 401 signed out and 422 for a malformed body, writing nothing", async () => {
    actAs(null);
    expect((await push({ deviceId: "x", sessions: [], runs: [], events: [] })).status).toBe(401);
    actAs(await demoUser("ada@example.com"));
    const dev = deviceId();
    const res = await push({ deviceId: dev, sessions: [], runs: [] });
    expect(res.status).toBe(422);
    expect(await db.select().from(devices).where(eq(devices.id, dev))).toEqual([]);
    expect((await pushRoute(new Request("http://test/api/sync/push", { method: "POST", body: "{not json" }))).status).toBe(400);
  });

  it("gives a device to the first user who pushes from it; another user gets 403", async () => {
    const ada = await demoUser("ada@example.com");
    const dev = deviceId();
    actAs(ada);
    expect((await push({ deviceId: dev, sessions: [], runs: [], events: [] })).status).toBe(200);
    actAs(await demoUser("tobi@example.com"));
    const s = session((await demoUser("tobi@example.com")).id);
    const res = await push({ deviceId: dev, sessions: [s], runs: [], events: [] });
    expect(res.status).toBe(403);
    expect(res.body.error?.code).toBe("forbidden");
    const [row] = await db.select().from(devices).where(eq(devices.id, dev));
    expect(row?.userId).toBe(ada.id);
  });

  it("refuses with 409 a push or pull that names another account's device database, claiming nothing", async () => {
    const ada = await demoUser("ada@example.com");
    const tobi = await demoUser("tobi@example.com");
    actAs(tobi);
    const dev = deviceId();
    const res = await push({ deviceId: dev, account: ada.id, sessions: [session(ada.id)], runs: [], events: [] });
    expect(res.status).toBe(409);
    expect(res.body.error?.code).toBe("other_account");
    expect(await db.select().from(devices).where(eq(devices.id, dev))).toEqual([]);
    expect((await pull(`0&account=${ada.id}`)).status).toBe(409);
    expect((await push({ deviceId: dev, account: tobi.id, sessions: [], runs: [], events: [] })).status).toBe(200);
    expect((await pull(`0&account=${tobi.id}`)).status).toBe(200);
  });
});

describe("POST /api/sync/push — items", () => {
  it("stores each item once: the same batch twice gives duplicate acks and one row", async () => {
    const ada = await demoUser("ada@example.com");
    actAs(ada);
    const phone = recorder(deviceId());
    const s = session(ada.id);
    const r = run(s.id, [{ lane: 0, pilotName: "Ada", pilotUserId: ada.id }]);
    const batch = { deviceId: phone.id, sessions: [s], runs: [r], events: [phone.at(r.id, T0, { kind: "window-start" }), ...phone.flights(r.id, 0, [63], T0 + 1000)] };
    const first = await push(batch);
    expect(first.status).toBe(200);
    expect(first.body.acks.map((a) => a.status)).toEqual(["applied", "applied", "applied", "applied", "applied"]);
    const second = await push(batch);
    expect(second.body.acks.map((a) => a.status)).toEqual(["duplicate", "duplicate", "duplicate", "duplicate", "duplicate"]);
    const rows = await db.select().from(events).where(eq(events.runId, r.id));
    expect(rows).toHaveLength(3);
    expect(second.body.serverSeq).toBeGreaterThanOrEqual(first.body.serverSeq);
  });

  it("refuses an event for someone else's run, with the reason, and records the refusal", async () => {
    const ada = await demoUser("ada@example.com");
    actAs(ada);
    const adaPhone = recorder(deviceId());
    const s = session(ada.id);
    const r = run(s.id, [{ lane: 0, pilotName: "Ada", pilotUserId: ada.id }]);
    await push({ deviceId: adaPhone.id, sessions: [s], runs: [r], events: [] });

    actAs(await demoUser("lena@example.com"));
    const lenaPhone = recorder(deviceId());
    const intruder = lenaPhone.at(r.id, T0, { kind: "launch", lane: 0 });
    const res = await push({ deviceId: lenaPhone.id, sessions: [], runs: [], events: [intruder] });
    expect(res.body.acks).toEqual([{ id: intruder.id, status: "rejected", reason: "You neither created this run nor fly in it." }]);
    expect(await db.select().from(events).where(eq(events.id, intruder.id))).toEqual([]);
    const [logged] = await db.select().from(syncRejections).where(and(eq(syncRejections.itemId, intruder.id), eq(syncRejections.deviceId, lenaPhone.id)));
    expect(logged?.reason).toMatch(/neither created/);
  });

  it("refuses an event whose run is not on the server, saying so", async () => {
    actAs(await demoUser("ada@example.com"));
    const phone = recorder(deviceId());
    const orphan = phone.at("0190a000-0000-7000-8000-000000000000", T0, { kind: "launch", lane: 0 });
    const res = await push({ deviceId: phone.id, sessions: [], runs: [], events: [orphan] });
    expect(res.body.acks[0]).toMatchObject({ status: "rejected", reason: expect.stringMatching(/run is not on the server/) });
  });

  it("refuses an event recorded on another device, a session for someone else, and a stranger as pilot", async () => {
    const ada = await demoUser("ada@example.com");
    const admin = await demoUser("admin@example.com");
    actAs(ada);
    const phone = recorder(deviceId());
    const other = recorder(deviceId());
    const own = session(ada.id);
    const foreign = session(admin.id);
    const r = run(own.id, [{ lane: 0, pilotName: "Site Admin", pilotUserId: admin.id }]);
    const stray = other.at(r.id, T0, { kind: "window-start" });
    const res = await push({ deviceId: phone.id, sessions: [own, foreign], runs: [r], events: [stray] });
    const byId = new Map(res.body.acks.map((a) => [a.id, a]));
    expect(byId.get(own.id)?.status).toBe("applied");
    expect(byId.get(foreign.id)).toMatchObject({ status: "rejected", reason: "A session can only be created by its owner." });
    expect(byId.get(r.id)).toMatchObject({ status: "rejected", reason: expect.stringMatching(/not in a club with you/) });
    expect(byId.get(stray.id)).toMatchObject({ status: "rejected", reason: expect.stringMatching(/another device/) });
  });

  it("lets a timekeeper and the lane's pilot both record a run; the pilot sees it in their pull", async () => {
    const ines = await demoUser("ines@example.com");
    const tobi = await demoUser("tobi@example.com");
    actAs(ines);
    const keeper = recorder(deviceId());
    const s = session(ines.id);
    const r = run(s.id, [{ lane: 0, pilotName: "Tobi", pilotUserId: tobi.id }]);
    const keeperPush = await push({ deviceId: keeper.id, sessions: [s], runs: [r], events: [keeper.at(r.id, T0, { kind: "window-start" }), ...keeper.flights(r.id, 0, [50], T0 + 2000)] });
    expect(keeperPush.body.acks.every((a) => a.status === "applied")).toBe(true);

    actAs(tobi);
    const tobiPhone = recorder(deviceId());
    const self = await push({ deviceId: tobiPhone.id, sessions: [], runs: [], events: tobiPhone.flights(r.id, 0, [52], T0 + 1900) });
    expect(self.body.acks.every((a) => a.status === "applied")).toBe(true);
    let cursor = "0";
    let found: { session?: { id: string }; results?: { resultTenths: number; versions: unknown[] }[] } | undefined;
    for (let hasMore = true; hasMore; ) {
      const page = await pull(cursor);
      found = page.body.items.find((i: { type: string; data: { id: string } }) => i.type === "run" && i.data.id === r.id) ?? found;
      ({ nextCursor: cursor, hasMore } = page.body);
    }
    expect(found?.session?.id).toBe(s.id); // Ines's session comes with the run
    // Ines holds no contest assignment, so neither record is official: the pilot's own goes first
    expect(found?.results?.[0]?.resultTenths).toBe(520);
    expect(found?.results?.[0]?.versions).toEqual([
      expect.objectContaining({ official: false, chosen: true, resultTenths: 520 }),
      expect.objectContaining({ official: false, chosen: false, resultTenths: 500 }),
    ]);
    expect(found?.results?.[0]?.versions).toHaveLength(2);
  });
});

describe("GET /api/sync/pull", () => {
  it("is 401 signed out and 422 for a bad cursor", async () => {
    actAs(null);
    expect((await pull(0)).status).toBe(401);
    actAs(await demoUser("ada@example.com"));
    expect((await pull("minus-one")).status).toBe(422);
  });

  it("pages through everything with a strictly increasing cursor and no repeats (pages of 37)", async () => {
    const ada = await demoUser("ada@example.com");
    let cursor = "0";
    const seen = new Set<string>();
    let pages = 0;
    for (let hasMore = true; hasMore; pages++) {
      const body = await listChanges(db, { userId: ada.id, cursor, limit: 37 });
      for (const item of body.items as { type: string; seq: number; data: { id: string } }[]) {
        const key = `${item.type}:${item.data.id}`;
        expect(seen.has(key)).toBe(false);
        seen.add(key);
      }
      if (body.hasMore) expect(cursorAfter(body.nextCursor, cursor)).toBe(true);
      cursor = body.nextCursor;
      hasMore = body.hasMore;
    }
    expect(pages).toBeGreaterThan(5); // Ada's seeded season spans many pages of 37
    actAs(ada);
    const whole = await pull(0); // the route: pages of 500
    expect(whole.status).toBe(200);
    const viaRoute = new Set<string>();
    for (let body = whole.body; ; ) {
      for (const i of body.items as { type: string; data: { id: string } }[]) viaRoute.add(`${i.type}:${i.data.id}`);
      if (!body.hasMore) break;
      body = (await pull(body.nextCursor)).body;
    }
    expect(viaRoute).toEqual(seen);
    const again = await pull(cursor);
    expect(again.body).toEqual({ items: [], nextCursor: cursor, hasMore: false, scope: expect.any(String), models: expect.any(Array), coaching: expect.any(String), notes: expect.any(Array), plans: expect.any(Array), contestDuties: expect.any(Array) });
    // with the fingerprint of what it holds, a phone gets no notes nor plans again
    const held = await pull(`${cursor}&coaching=${again.body.coaching}`);
    expect(held.body).toEqual({ items: [], nextCursor: cursor, hasMore: false, scope: expect.any(String), models: expect.any(Array), coaching: again.body.coaching, contestDuties: expect.any(Array) });
  });

  it("shows a coach the runs of a pilot who granted access, not of one who did not", async () => {
    actAs(await demoUser("mara@example.com"));
    const ada = await demoUser("ada@example.com");
    const lena = await demoUser("lena@example.com");
    const pilots = new Set<string>();
    let cursor = "0";
    for (let hasMore = true; hasMore; ) {
      const { body } = await pull(cursor);
      for (const i of body.items) if (i.type === "run") for (const l of i.data.lanes) if (l.pilotUserId) pilots.add(l.pilotUserId);
      ({ nextCursor: cursor, hasMore } = body);
    }
    expect(pilots.has(ada.id)).toBe(true);
    expect(pilots.has(lena.id)).toBe(false); // the seed gives Lena no coach grant
  });

  it("changes the pull scope when a pilot grants access later, and a pull from 0 then brings their older runs", async () => {
    const mara = await demoUser("mara@example.com");
    const lena = await demoUser("lena@example.com");
    actAs(mara);
    const pilotsFrom = async (from: string) => {
      const pilots = new Set<string>();
      let cursor = from;
      let scope: string | undefined;
      for (let hasMore = true; hasMore; ) {
        const { body } = await pull(cursor);
        for (const i of body.items) if (i.type === "run") for (const l of i.data.lanes) if (l.pilotUserId) pilots.add(l.pilotUserId);
        ({ nextCursor: cursor, hasMore, scope } = body);
      }
      return { pilots, cursor, scope };
    };
    const before = await pilotsFrom("0");
    const [grant] = await db.insert(coachGrants).values({ pilotId: lena.id, coachId: mara.id }).returning();
    try {
      const caughtUp = await pilotsFrom(before.cursor);
      expect(caughtUp.pilots.has(lena.id)).toBe(false); // her runs lie below the coach's cursor …
      expect(caughtUp.scope).not.toBe(before.scope); // … so the reply says what may be seen changed
      expect((await pilotsFrom("0")).pilots.has(lena.id)).toBe(true);
    } finally {
      await db.delete(coachGrants).where(eq(coachGrants.id, grant!.id));
    }
    expect((await pilotsFrom("0")).scope).toBe(before.scope);
  });
});

