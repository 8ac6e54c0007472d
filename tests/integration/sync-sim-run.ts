import fc from "fast-check";
import type { Database } from "@/db";
import { createSimUsers, SimWorld, type Op, type Scenario } from "./sync-sim";
import { checkWorld } from "./sync-sim-check";
import { pushFaults } from "./sync-sim-server";
import type { Serve } from "./sync-sim-network";

const ops: Op[] = ["create", "record", "record", "record", "sync", "sync", "kill", "measure", "deliver"];

/** 3–5 devices (some sharing a user, clocks up to ±10 min off), 8–20 steps, a fault rate. */
export const scenarioArb: fc.Arbitrary<Scenario> = fc.record({
  devices: fc.array(fc.record({ user: fc.nat({ max: 2 }), skewMs: fc.integer({ min: -600_000, max: 600_000 }) }), { minLength: 3, maxLength: 5 }),
  steps: fc.array(fc.record({ device: fc.nat({ max: 4 }), op: fc.constantFrom(...ops), n: fc.integer({ min: 1, max: 5 }) }), { minLength: 8, maxLength: 20 }),
  seed: fc.integer(),
  faultRate: fc.constantFrom(0.2, 0.35, 0.5),
});

/**
 * One seeded run: new users and devices, every device starts with a run, the steps play
 * over the faulty network, then a clean settle and the invariant check.
 */
export async function runScenario(
  db: Database,
  serve: Serve,
  scenario: Scenario,
): Promise<{ problems: string[]; events: number; faults: number; restarts: number; lateCommits: number }> {
  const world = new SimWorld(await createSimUsers(db), serve, scenario, pushFaults(db));
  try {
    await world.start();
    for (const [i] of world.devices.entries()) await world.step({ device: i, op: "create", n: 1 });
    for (const step of scenario.steps) await world.step(step);
    await world.settle();
    const problems = await checkWorld(db, world);
    let events = 0;
    for (const d of world.devices) events += (await d.db.events.toArray()).filter((e) => e.deviceId === d.deviceId).length;
    const faults = Object.entries(world.net.counts).filter(([k]) => k !== "ok").reduce((a, [, v]) => a + v, 0);
    return { problems, events, faults, restarts: world.net.counts.restart, lateCommits: world.net.counts["late-commit"] };
  } finally {
    await world.net.lateCommits(); // a failed run must not leave a transaction behind
    world.close();
  }
}
