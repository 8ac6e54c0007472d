import "fake-indexeddb/auto";
import "./support/session";
import fc from "fast-check";
import { afterAll, describe, expect, it } from "vitest";
import { POST as timeRoute } from "@/app/api/time/route";
import { GET as pullRoute } from "@/app/api/sync/pull/route";
import { POST as pushRoute } from "@/app/api/sync/push/route";
import { actAs } from "./support/session";
import { db, getPool } from "./support/db";
import type { Serve } from "./sync-sim-network";
import { runScenario, scenarioArb } from "./sync-sim-run";

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

const RUNS = Number(process.env.SYNC_PROPERTY_RUNS ?? 100);
const SEED = Number(process.env.SYNC_PROPERTY_SEED ?? 20260307);

describe("sync property (SYNC.md §5): devices, a faulty network and the real server", () => {
  it(`loses and duplicates nothing and converges, over ${RUNS} seeded runs (seed ${SEED}; replay with SYNC_PROPERTY_SEED)`, async () => {
    let faults = 0;
    let events = 0;
    const serverFaults = { restart: 0, late: 0 };
    await fc.assert(
      fc.asyncProperty(scenarioArb, async (scenario) => {
        const outcome = await runScenario(db, serve, scenario);
        faults += outcome.faults;
        events += outcome.events;
        serverFaults.restart += outcome.restarts;
        serverFaults.late += outcome.lateCommits;
        expect(outcome.problems).toEqual([]);
      }),
      { numRuns: RUNS, seed: SEED, endOnFailure: true },
    );
    expect(faults).toBeGreaterThan(RUNS); // the network really misbehaved
    expect(events).toBeGreaterThan(RUNS * 5); // and the devices really recorded
    expect(serverFaults.restart).toBeGreaterThan(0); // the server restarted mid-push …
    expect(serverFaults.late).toBeGreaterThan(0); // … and committed pushes out of order
  }, 600_000);
});
