import "./support/session";
import { afterAll, describe, expect, it } from "vitest";
import { and, eq, sql } from "drizzle-orm";
import { devices, events, runs, syncRejections, users } from "@/db/schema";
import { POST as pushRoute } from "@/app/api/sync/push/route";
import { POST as timeRoute } from "@/app/api/time/route";
import { POST as signUpRoute } from "@/app/api/account/sign-up/route";
import { GET as pullRoute } from "@/app/api/sync/pull/route";
import { EPOCH_MS_MAX } from "@/lib/validations/bounds";
import { actAs } from "./support/session";
import { db, demoUser, getPool } from "./support/db";
import { deviceId, push, pushingAs, recorder, run, session, T0 } from "./sync-fixtures";

/** Issue #9: bodies are capped, every value fits its column, and a push answers item by item. */

afterAll(async () => {
  await getPool().end();
});

async function freshUser(prefix: string) {
  const email = `${prefix}-${Date.now()}-${Math.random().toString(36).slice(2)}@example.com`;
  const [row] = await db.insert(users).values({ email, name: "Test Pilot" }).returning();
  return { id: row!.id, email, name: row!.name, role: "member" as const };
}

const json = (url: string, body: string, headers: Record<string, string> = {}) =>
  new Request(url, { method: "POST", body, headers: { "content-type": "application/json", ...headers } });

describe("body caps", () => {
  it("answers 413 to a push over 1 MB and another body over 64 kB, counting the stream, writing nothing", async () => {
    actAs(await demoUser("ada@example.com"));
    const dev = deviceId();
    const huge = JSON.stringify({ deviceId: dev, sessions: [], runs: [], events: [], pad: "x".repeat(1_100_000) });
    const res = await pushRoute(json("http://test/api/sync/push", huge));
    expect(res.status).toBe(413);
    expect((await res.json()).error.code).toBe("too_large");
    expect(await db.select().from(devices).where(eq(devices.id, dev))).toEqual([]);
    // a streamed body with no Content-Length is counted as it arrives
    const stream = new ReadableStream<Uint8Array>({
      start(c) {
        for (let i = 0; i < 20; i++) c.enqueue(new TextEncoder().encode(i === 0 ? '{"t1":1,"pad":"' : "y".repeat(8192)));
        c.close();
      },
    });
    const streamed = await timeRoute(new Request("http://test/api/time", { method: "POST", body: stream, duplex: "half" } as RequestInit));
    expect(streamed.status).toBe(413);
    const email = `big-${Date.now()}@example.com`;
    const signUp = await signUpRoute(json("http://test/api/account/sign-up", JSON.stringify({ name: "Big", email, password: "thermal-hunter-42", pad: "z".repeat(70_000) })));
    expect(signUp.status).toBe(413);
    expect(await db.select().from(users).where(eq(users.email, email))).toEqual([]);
  });

  it("refuses a run whose task carries a huge string in a field the engine does not know, and stores only known fields", async () => {
    const ada = await demoUser("ada@example.com");
    actAs(ada);
    const phone = recorder(deviceId());
    const s = session(ada.id);
    const huge = run(s.id, [{ lane: 0, pilotName: "Ada", pilotUserId: ada.id }]);
    huge.task = { ...huge.task, notes: "H".repeat(200_000) };
    const extra = run(s.id, [{ lane: 0, pilotName: "Ada", pilotUserId: ada.id }]);
    extra.task = { ...extra.task, colour: "red" };
    const res = await push({ deviceId: phone.id, sessions: [s], runs: [huge, extra], events: [] });
    expect(res.status).toBe(200);
    expect(res.body.acks.find((a) => a.id === huge.id)).toMatchObject({ status: "rejected", reason: expect.stringMatching(/task/) });
    expect(await db.select().from(runs).where(eq(runs.id, huge.id))).toEqual([]);
    const [stored] = await db.select().from(runs).where(eq(runs.id, extra.id));
    expect(stored?.task).not.toHaveProperty("colour");
    expect(stored?.task).toMatchObject({ letter: "H" });
  });
});

describe("values the database cannot hold are refused, never a 500", () => {
  it("refuses per item: seq beyond int4, NUL in text, dates out of range; the rest of the batch applies", async () => {
    const ada = await demoUser("ada@example.com");
    actAs(ada);
    const phone = recorder(deviceId());
    const s = session(ada.id);
    const nulSession = session(ada.id, { fieldName: "Meadow\u0000" });
    const farSession = session(ada.id, { startedAtWallMs: EPOCH_MS_MAX + 1 });
    const r = run(s.id, [{ lane: 0, pilotName: "Ada", pilotUserId: ada.id }]);
    const good = phone.at(r.id, T0, { kind: "window-start" });
    const bigSeq = { ...phone.at(r.id, T0 + 1000, { kind: "launch", lane: 0 }), seq: 2 ** 31 };
    const nulPage = phone.at(r.id, T0 + 2000, { kind: "landing", lane: 0 });
    nulPage.stamp.pageId = "page\u0000";
    const res = await push({ deviceId: phone.id, sessions: [s, nulSession, farSession], runs: [r], events: [good, bigSeq, nulPage] });
    expect(res.status).toBe(200);
    const byId = new Map(res.body.acks.map((a) => [a.id, a]));
    expect(byId.get(s.id)?.status).toBe("applied");
    expect(byId.get(r.id)?.status).toBe("applied");
    expect(byId.get(good.id)?.status).toBe("applied");
    for (const bad of [nulSession.id, farSession.id, bigSeq.id, nulPage.id]) expect(byId.get(bad)).toMatchObject({ status: "rejected", reason: expect.stringMatching(/^Invalid/) });
    expect(await db.select({ id: events.id }).from(events).where(eq(events.runId, r.id))).toEqual([{ id: good.id }]);
  });

  it("takes a run created at the last instant the schema allows (9999-12-31) without a 500", async () => {
    const ada = await demoUser("ada@example.com");
    actAs(ada);
    const phone = recorder(deviceId());
    const s = session(ada.id);
    const last = { ...run(s.id, [{ lane: 0, pilotName: "Ada", pilotUserId: ada.id }]), createdAtWallMs: EPOCH_MS_MAX };
    const res = await push({ deviceId: phone.id, sessions: [s], runs: [last], events: [] });
    expect(res.status).toBe(200);
    expect(res.body.acks.find((a) => a.id === last.id)?.status).toBe("applied");
  });

  it("drops a clock estimate of 1.7e308 instead of storing Infinity; an event carrying it is refused alone", async () => {
    const ada = await demoUser("ada@example.com");
    const { phone, run: r, send } = pushingAs(ada);
    const absurd = { thetaMs: 1.7e308, deltaMs: 1.7e308, measuredAtWallMs: 1_767_000_000_000 };
    const e = phone.at(r.id, T0, { kind: "window-start" }, absurd);
    const res = await send([e], { clockEstimates: [absurd] });
    expect(res.status).toBe(200);
    expect(res.body.acks.find((a) => a.id === e.id)?.status).toBe("rejected");
    const stored = await db.execute(sql`select count(*)::int as n from device_clock_estimates where device_id = ${phone.id}`);
    expect(stored.rows[0]).toEqual({ n: 0 });
  });

  it("answers 422 to a sign-up name with a NUL, a time request of 1e309 and a pull cursor past 2^53", async () => {
    const email = `nul-${Date.now()}@example.com`;
    const res = await signUpRoute(json("http://test/api/account/sign-up", JSON.stringify({ name: "Nu\u0000ll", email, password: "thermal-hunter-42" })));
    expect(res.status).toBe(422);
    expect(await db.select().from(users).where(eq(users.email, email))).toEqual([]);
    actAs(await demoUser("ada@example.com"));
    expect((await timeRoute(json("http://test/api/time", '{"t1":1e309}'))).status).toBe(422);
    expect((await pullRoute(new Request("http://test/api/sync/pull?cursor=1e300"))).status).toBe(422);
  });
});

describe("per-item verdicts", () => {
  it("refuses an item that fails its schema by its id; only an item with no usable id fails the batch", async () => {
    const ada = await demoUser("ada@example.com");
    actAs(ada);
    const phone = recorder(deviceId());
    const s = session(ada.id);
    const res = await push({ deviceId: phone.id, sessions: [s, { id: "not-a-session", ownerId: 5 }], runs: [], events: [] });
    expect(res.status).toBe(200);
    expect(res.body.acks).toEqual([
      { id: "not-a-session", status: "rejected", reason: expect.stringMatching(/^Invalid session/) },
      { id: s.id, status: "applied" },
    ]);
    const unnamed = await push({ deviceId: deviceId(), sessions: [{ fieldName: "x" }], runs: [], events: [] });
    expect(unnamed.status).toBe(422);
  });

  it("records each refusal once: replaying the batch adds no rows to sync_rejections", async () => {
    actAs(await demoUser("ada@example.com"));
    const phone = recorder(deviceId());
    const orphan = phone.at("0190a000-0000-7000-8000-000000000000", T0, { kind: "launch", lane: 0 });
    const bad = { id: "bad-item-1", runId: 7 };
    for (let i = 0; i < 3; i++) {
      const res = await push({ deviceId: phone.id, sessions: [], runs: [], events: [orphan, bad] });
      expect(res.body.acks.map((a) => a.status)).toEqual(["rejected", "rejected"]);
    }
    const rows = await db.select().from(syncRejections).where(eq(syncRejections.deviceId, phone.id));
    expect(rows.map((r) => r.itemId).sort()).toEqual([orphan.id, "bad-item-1"].sort());
  });
});

describe("growth caps", () => {
  it("refuses events beyond 20,000 in one run, with the reason", async () => {
    const ada = await freshUser("full"); // its own account: the 20,000 rows would slow every pull of a demo pilot
    const { phone, run: r, send } = pushingAs(ada);
    await send();
    const filler = `filler-${phone.id}`;
    await db.execute(sql`
      insert into events (id, run_id, device_id, seq, recorded_by, kind, body, wall_ms, mono_ms, page_id, corrected_ms)
      select gen_random_uuid(), ${r.id}::uuid, ${filler}, g, ${ada.id}::uuid, 'run-end', '{"kind":"run-end"}'::jsonb, ${T0}, 1, 'p', ${T0}
      from generate_series(1, 19999) g`);
    const [last, over] = [phone.at(r.id, T0, { kind: "window-start" }), phone.at(r.id, T0 + 1, { kind: "launch", lane: 0 })];
    const res = await push({ deviceId: phone.id, sessions: [], runs: [], events: [last, over] });
    expect(res.body.acks).toHaveLength(2);
    expect(res.body.acks).toEqual(
      expect.arrayContaining([
        { id: last.id, status: "applied" },
        { id: over.id, status: "rejected", reason: expect.stringMatching(/20000 events/) },
      ]),
    );
  });

  it("refuses runs beyond 200 on one day for one account", async () => {
    const busy = await freshUser("busy");
    actAs(busy);
    const phone = recorder(deviceId());
    const s = session(busy!.id);
    const day = Array.from({ length: 201 }, (_, i) => ({ ...run(s.id, [{ lane: 0, pilotName: "Busy" }]), createdAtWallMs: 1_767_000_000_000 + i * 1000 }));
    const res = await push({ deviceId: phone.id, sessions: [s], runs: day, events: [] });
    const statuses = res.body.acks.filter((a) => a.id !== s.id).map((a) => a.status);
    expect(statuses.filter((x) => x === "applied")).toHaveLength(200);
    expect(res.body.acks.find((a) => a.id === day[200]!.id)).toMatchObject({ status: "rejected", reason: expect.stringMatching(/200 runs/) });
    const stored = await db.select({ n: sql<number>`count(*)::int` }).from(runs).where(and(eq(runs.createdBy, busy!.id)));
    expect(stored[0]?.n).toBe(200);
  });
});

describe("clock estimates per device", () => {
  it("keeps at most 32, still bracketing an offline period, and replays change nothing", async () => {
    actAs(await demoUser("ada@example.com"));
    const phone = recorder(deviceId());
    const base = 1_767_000_000_000;
    const online = Array.from({ length: 90 }, (_, i) => ({ thetaMs: 200, deltaMs: 10 + ((i * 37) % 50), measuredAtWallMs: base + i * 60_000 }));
    const afterGap = { thetaMs: 900, deltaMs: 25, measuredAtWallMs: base + 90 * 60_000 + 6 * 3_600_000 };
    for (let i = 0; i < 90; i += 30) await push({ deviceId: phone.id, sessions: [], runs: [], events: [], clockEstimates: online.slice(i, i + 30) });
    await push({ deviceId: phone.id, sessions: [], runs: [], events: [], clockEstimates: [afterGap] });
    const count = async () => (await db.execute<{ n: number }>(sql`select count(*)::int as n from device_clock_estimates where device_id = ${phone.id}`)).rows[0]?.n;
    expect(await count()).toBe(32);
    const rows = await db.execute<{ m: number }>(sql`select measured_at_wall_ms as m from device_clock_estimates where device_id = ${phone.id} order by 1`);
    const times = rows.rows.map((r) => Number(r.m));
    expect(times).toContain(afterGap.measuredAtWallMs);
    expect(online.at(-1)!.measuredAtWallMs - times.at(-2)!).toBeLessThanOrEqual(10 * 60_000);
    await push({ deviceId: phone.id, sessions: [], runs: [], events: [], clockEstimates: online.slice(-32) });
    expect(await count()).toBe(32);
  });
});
