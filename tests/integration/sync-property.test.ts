import "fake-indexeddb/auto";
import "./support/session";
import fc from "fast-check";
import { afterAll, describe, expect, it } from "vitest";
import { POST as timeRoute } from "@/app/api/time/route";
import { GET as pullRoute } from "@/app/api/sync/pull/route";
import { POST as pushRoute } from "@/app/api/sync/push/route";
import { actAs } from "./support/session";
import { db, getPool } from "./support/db";
import { createSimUsers, SimWorld, type Op, type Scenario } from "./sync-sim";
import { checkWorld } from "./sync-sim-check";
import type { Serve } from "./sync-sim-network";

afterAll(async () => {
  await getPool().end();
});

/** The real route handlers, called in process as the device's user (one call at a time). */
const serve: Serve = async (user, url, init) => {
  actAs(user);
  const request = new Request(`http://test${url}`, init);
  if (url.startsWith("/api/sync/push")) return pushRoute(request);
  if (url.startsWith("/api/sync/pull")) return pullRoute(request);
  if (url.startsWith("/api/time")) return timeRoute(request);
  return new Response("not found", { status: 404 });
};

const ops: Op[] = ["create", "record", "record", "record", "sync", "sync", "kill", "measure", "deliver"];

/** 3–5 devices (some sharing a user, clocks up to ±10 min off) and 10–30 steps. */
export const scenarioArb: fc.Arbitrary<Scenario> = fc.record({
  devices: fc.array(fc.record({ user: fc.nat({ max: 2 }), skewMs: fc.integer({ min: -600_000, max: 600_000 }) }), { minLength: 3, maxLength: 5 }),
  steps: fc.array(fc.record({ device: fc.nat({ max: 4 }), op: fc.constantFrom(...ops), n: fc.integer({ min: 1, max: 6 }) }), { minLength: 10, maxLength: 30 }),
  seed: fc.integer(),
  faultRate: fc.constantFrom(0.2, 0.35, 0.5),
});

const RUNS = Number(process.env.SYNC_PROPERTY_RUNS ?? 100);

describe("sync property (SYNC.md §5): devices, a faulty network and the real server", () => {
  it(`loses and duplicates nothing and converges, over ${RUNS} seeded runs`, async () => {
    let faults = 0;
    await fc.assert(
      fc.asyncProperty(scenarioArb, async (scenario) => {
        const world = new SimWorld(await createSimUsers(db), serve, scenario);
        try {
          await world.start();
          // every device starts with a run, so most steps have something to record on
          for (const [i] of world.devices.entries()) await world.step({ device: i, op: "create", n: 1 });
          for (const step of scenario.steps) await world.step(step);
          await world.settle();
          faults += Object.entries(world.net.counts).filter(([k]) => k !== "ok").reduce((a, [, v]) => a + v, 0);
          expect(await checkWorld(db, world)).toEqual([]);
        } finally {
          world.close();
        }
      }),
      { numRuns: RUNS, seed: Number(process.env.SYNC_PROPERTY_SEED ?? 20260307), endOnFailure: true },
    );
    expect(faults).toBeGreaterThan(RUNS); // the network really misbehaved
  }, 600_000);
});
