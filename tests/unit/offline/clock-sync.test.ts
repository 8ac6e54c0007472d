import { describe, expect, it } from "vitest";
import { listClockEstimates } from "@/lib/offline/clock-sync";
import { getMeta } from "@/lib/offline/db";
import { SyncClient } from "@/lib/offline/sync-client";
import { freshDbsPerTest, ManualTimers } from "./helpers";

const open = freshDbsPerTest();

const SKEW = 250; // server clock = device clock + 250 ms

/**
 * A device clock and a /api/time server with a known skew; each exchange takes the given
 * legs (out, back) in ms, so δ = out + back + 0 and θ = SKEW + (out − back)/2.
 */
function clockWorld(legs: [number, number][], tweak?: (i: number, reply: { t1: number; t2: number; t3: number }) => unknown) {
  let device = 1_700_000_000_000;
  let i = 0;
  const bodies: number[] = [];
  const fetch = async (url: string, init?: RequestInit) => {
    if (url !== "/api/time") return new Response("", { status: 404 });
    const { t1 } = JSON.parse(String(init?.body)) as { t1: number };
    bodies.push(t1);
    const [out, back] = legs[i] ?? [10, 10];
    device += out;
    const t2 = device + SKEW;
    const t3 = t2;
    device += back;
    const reply = { t1, t2, t3 };
    const k = i++;
    const replaced = tweak?.(k, reply);
    if (replaced instanceof Error) throw replaced;
    return Response.json(replaced ?? reply);
  };
  const db = open();
  const client = new SyncClient({ db, fetch, clock: { now: () => device }, timers: new ManualTimers() });
  return { client, db, bodies };
}

describe("measureClock", () => {
  it("runs 4 exchanges and keeps the one with the least delay", async () => {
    // δ: 60, 14, 40, 30 → the second: θ = 250 + (10 − 4)/2 = 253
    const { client, db } = clockWorld([[30, 30], [10, 4], [25, 15], [5, 25]]);
    const est = await client.measureClock();
    expect(est).toMatchObject({ thetaMs: 253, deltaMs: 14 });
    expect(client.currentEstimate()).toEqual(est);
    // bound now: δ/2 + 15 ppm × the 70 ms the two later exchanges took = 7 + 0.00105
    expect(client.status().offset?.thetaMs).toBe(253);
    expect(client.status().offset?.boundMs).toBeCloseTo(7.00105, 9);
    expect(await getMeta(db, "clockEstimate")).toEqual(est);
    expect(await db.clockSamples.count()).toBe(4);
  });

  it("never uses a retried or replayed reply as a sample, and never retries a failed exchange", async () => {
    // exchange 1 has the least delay but its reply echoes another request's T1 (a replay);
    // exchange 2 fails outright
    const { client, db, bodies } = clockWorld([[20, 20], [1, 1], [5, 5], [15, 15]], (i, reply) => {
      if (i === 1) return { ...reply, t1: reply.t1 - 5000 };
      if (i === 2) return new TypeError("Failed to fetch");
    });
    const est = await client.measureClock();
    expect(bodies).toHaveLength(4); // one request per exchange, nothing resent
    expect(new Set(bodies).size).toBe(4);
    expect(est).toMatchObject({ thetaMs: 250, deltaMs: 30 }); // exchange 3 (15/15), not the replayed one
    expect(await db.clockSamples.count()).toBe(2);
  });

  it("returns null and keeps the old estimate when every exchange fails", async () => {
    const { client } = clockWorld([], () => new TypeError("offline"));
    expect(await client.measureClock()).toBeNull();
    expect(client.status().offset).toBeNull();
  });

  it("keeps one estimate per burst for interpolating across offline periods", async () => {
    const { client, db } = clockWorld([[10, 10], [10, 10], [10, 10], [10, 10], [3, 3], [8, 2], [9, 9], [9, 9]]);
    await client.measureClock();
    await client.measureClock();
    const history = await listClockEstimates(db);
    expect(history.map((e) => [e.thetaMs, e.deltaMs])).toEqual([[250, 20], [250, 6]]);
    expect(history[0]!.measuredAtWallMs).toBeLessThan(history[1]!.measuredAtWallMs);
  });
});

describe("close (sign-out)", () => {
  it("sends no request after close: the burst in progress stops at its next exchange, and `online` starts nothing", async () => {
    let client: SyncClient | null = null;
    const world = clockWorld([[10, 10], [10, 10], [10, 10], [10, 10]], (i) => {
      if (i === 0) client?.close(); // the sign-out begins while the first reply is on its way
    });
    client = world.client;
    await client.measureClock();
    expect(world.bodies).toHaveLength(1);
    client.onOnline();
    client.onVisible();
    await client.sync();
    await new Promise((r) => setTimeout(r, 0));
    expect(world.bodies).toHaveLength(1);
  });
});
