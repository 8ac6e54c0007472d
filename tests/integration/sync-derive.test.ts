import "./support/session";
import { afterAll, describe, expect, it } from "vitest";
import { asc, eq } from "drizzle-orm";
import { events, runLanes } from "@/db/schema";
import { scoreTask } from "@/lib/tasks";
import { actAs } from "./support/session";
import { db, demoUser, getPool } from "./support/db";
import { deviceId, push, recorder, run, session, T0 } from "./sync-fixtures";
import { backToBack } from "../unit/tasks/helpers";

afterAll(async () => {
  await getPool().end();
});

async function lanesOf(runId: string) {
  return db.select().from(runLanes).where(eq(runLanes.runId, runId)).orderBy(asc(runLanes.lane));
}

describe("server derivation through push", () => {
  it("F3K.11.8 task H: flights 63, 239, 182, 90 → 569 s, equal to the engine's scoreTask", async () => {
    const ada = await demoUser("ada@example.com");
    actAs(ada);
    const phone = recorder(deviceId());
    const s = session(ada.id);
    const r = run(s.id, [{ lane: 0, pilotName: "Ada", pilotUserId: ada.id }]);
    const evs = [phone.at(r.id, T0, { kind: "window-start" }), ...phone.flights(r.id, 0, [63, 239, 182, 90], T0 + 1000)];
    expect((await push({ deviceId: phone.id, sessions: [s], runs: [r], events: evs })).status).toBe(200);
    const [lane] = await lanesOf(r.id);
    // RULES.md (F3K.11.8 example): 60 + 239 + 180 + 90 = 569 s
    expect(lane?.resultTenths).toBe(5690);
    expect(lane?.resultTenths).toBe(scoreTask({ task: "H", flights: backToBack([63, 239, 182, 90]) }).tenths);
    expect(lane?.needsReview).toBe(false);
  });

  it("two devices, one 10 min slow with a measured offset, give the result of one true clock", async () => {
    const ines = await demoUser("ines@example.com");
    const tobi = await demoUser("tobi@example.com");
    const secs = [63, 239, 182, 90];

    // reference: one device with a true clock does everything
    actAs(ines);
    const truth = recorder(deviceId());
    const s1 = session(ines.id);
    const r1 = run(s1.id, [{ lane: 0, pilotName: "Tobi", pilotUserId: tobi.id }]);
    await push({ deviceId: truth.id, sessions: [s1], runs: [r1], events: [truth.at(r1.id, T0, { kind: "window-start" }), ...truth.flights(r1.id, 0, secs, T0 + 1000)] });

    // the same window: Ines gives the signal on a true clock, a second timekeeper times the flights on a phone 10 min slow
    const signal = recorder(deviceId());
    const s2 = session(ines.id);
    const r2 = run(s2.id, [{ lane: 0, pilotName: "Tobi", pilotUserId: tobi.id }]);
    await push({ deviceId: signal.id, sessions: [s2], runs: [r2], events: [signal.at(r2.id, T0, { kind: "window-start" })] });
    const slow = recorder(deviceId(), { thetaMs: 600_000 }); // server = device + 10 min, measured with δ = 20 ms
    const slowEvents = slow.flights(r2.id, 0, secs, T0 + 1000);
    expect(slowEvents[0]!.stamp.wallMs).toBe(T0 + 1000 - 600_000);
    await push({ deviceId: slow.id, sessions: [], runs: [], events: slowEvents });

    const [reference] = await lanesOf(r1.id);
    const [skewed] = await lanesOf(r2.id);
    expect(reference?.resultTenths).toBe(5690);
    expect(skewed?.resultTenths).toBe(reference?.resultTenths);
    expect(skewed?.needsReview).toBe(false); // 1 s after the signal, clocks good to ±20 ms
    const stored = await db.select().from(events).where(eq(events.id, slowEvents[0]!.id));
    expect(stored[0]?.wallMs).toBe(T0 + 1000 - 600_000); // the raw stamp is kept
    expect(stored[0]?.correctedMs).toBeCloseTo(T0 + 1000, 3);
  });

  it("a launch 40 ms after a signal given on another phone, clocks ±30 ms each → needs review", async () => {
    const ines = await demoUser("ines@example.com");
    const tobi = await demoUser("tobi@example.com");
    actAs(ines);
    const estimate = (thetaMs: number) => ({ thetaMs, deltaMs: 60, measuredAtWallMs: T0 - thetaMs - 5000 });
    const signal = recorder(deviceId(), { thetaMs: 0, estimate: estimate(0) });
    const s = session(ines.id);
    const r = run(s.id, [{ lane: 0, pilotName: "Tobi", pilotUserId: tobi.id }]);
    await push({ deviceId: signal.id, sessions: [s], runs: [r], events: [signal.at(r.id, T0, { kind: "window-start" })] });
    actAs(tobi);
    const self = recorder(deviceId(), { thetaMs: 2500, estimate: estimate(2500) });
    await push({ deviceId: self.id, sessions: [], runs: [], events: self.flights(r.id, 0, [120], T0 + 40) });
    const [lane] = await lanesOf(r.id);
    expect(lane?.needsReview).toBe(true);
    expect(lane?.reviewReason).toMatch(/^Flight 1: 0\.04 s from the working-time signal timed on another device/);
    expect(lane?.resultTenths).toBe(1200);
  });

  it("a clock measured after an offline period re-corrects the events recorded during it (interpolation)", async () => {
    const ines = await demoUser("ines@example.com");
    const tobi = await demoUser("tobi@example.com");
    actAs(ines);
    const signal = recorder(deviceId());
    const s = session(ines.id);
    const r = run(s.id, [{ lane: 0, pilotName: "Tobi", pilotUserId: tobi.id }]);
    await push({ deviceId: signal.id, sessions: [s], runs: [r], events: [signal.at(r.id, T0, { kind: "window-start" })] });

    // The timing phone measured θ = 0 an hour before the window, then went offline; its clock
    // runs fast by 2 ms per second (far beyond 15 ppm, to make the effect plain), so when it
    // measures again an hour after the window the offset is −14.4 s.
    const before = { thetaMs: 0, deltaMs: 20, measuredAtWallMs: T0 - 3_600_000 };
    const rate = -0.002;
    const phone = recorder(deviceId(), { estimate: before });
    const at = (trueMs: number, kind: "launch" | "landing") => {
      const e = phone.at(r.id, trueMs, { kind, lane: 0 });
      // device wall = true − θ(true); θ grows linearly from the measurement
      e.stamp.wallMs = trueMs - rate * (trueMs - before.measuredAtWallMs);
      // The page was reloaded between launch and landing: inside one page lifetime the steady
      // clock would time the flight (lib/results/place.ts); across pages the corrected wall clock does.
      e.stamp.pageId = `${e.stamp.pageId}-${kind}`;
      return e;
    };
    const evs = [at(T0 + 10_000, "launch"), at(T0 + 100_000, "landing")];
    await push({ deviceId: phone.id, sessions: [], runs: [], events: evs });
    const [held] = await lanesOf(r.id);
    // holding the old offset: the device's stamps are ~7.2 s late and the flight stretched by 0.2 % (90.18 s)
    expect(held?.resultTenths).toBe(901);

    const after = { thetaMs: rate * 7_200_000, deltaMs: 20, measuredAtWallMs: T0 + 3_600_000 - rate * 7_200_000 };
    const reply = await push({ deviceId: phone.id, sessions: [], runs: [], events: [], clockEstimates: [before, after] });
    expect(reply.status).toBe(200);
    const [fixed] = await lanesOf(r.id);
    expect(fixed?.resultTenths).toBe(900);
    const [launch] = await db.select().from(events).where(eq(events.id, evs[0]!.id));
    expect(launch?.correctedMs).toBeCloseTo(T0 + 10_000, 0);
  });
});
