import { sql } from "drizzle-orm";
import { v7 as uuidv7 } from "uuid";
import type { Database } from "@/db";
import { clubs, memberships, users } from "@/db/schema";
import { createWindowcallDb, type WindowcallDb } from "@/lib/offline/db";
import { getDeviceId, stampFromInput } from "@/lib/offline/device";
import { createRunLocal, createSessionLocal, recordEvent } from "@/lib/offline/record";
import { SyncClient } from "@/lib/offline/sync-client";
import type { EventBody } from "@/lib/events/schema";
import { getCatalogueTask, type TaskLetter } from "@/lib/tasks";
import { FaultyNetwork, type PushFaults, type Serve, type SimUser } from "./sync-sim-network";

/**
 * A world of 3–5 simulated devices (each its own fake-indexeddb Dexie database and sync
 * client) talking to the real route handlers through a faulty network. Each world gets its
 * own users and club, so runs never see each other's data (no database reset between runs).
 */

export type Op = "create" | "record" | "sync" | "kill" | "measure" | "deliver";
export type Step = { device: number; op: Op; n: number };
export type Scenario = { devices: { user: number; skewMs: number }[]; steps: Step[]; seed: number; faultRate: number };

import { mulberry32 } from "@/lib/random";
export { mulberry32 };

const noTimers = { set: () => 0, clear: () => undefined };
const TASKS: TaskLetter[] = ["H", "B", "J", "F"];

export type SimDevice = {
  user: SimUser;
  db: WindowcallDb;
  client: SyncClient;
  page: string;
  now: () => number;
  deviceId: string;
};

/** Three users in one new club (so any of them may name another as a lane's pilot). */
export async function createSimUsers(db: Database, count = 3): Promise<SimUser[]> {
  const tag = uuidv7();
  const [club] = await db.insert(clubs).values({ name: `Sim club ${tag}`, slug: `sim-${tag}` }).returning();
  const out: SimUser[] = [];
  for (let i = 0; i < count; i++) {
    const [u] = await db.insert(users).values({ email: `sim-${tag}-${i}@example.com`, name: `Sim pilot ${i}` }).returning();
    await db.insert(memberships).values({ clubId: club!.id, userId: u!.id });
    out.push({ id: u!.id, email: u!.email, name: u!.name, role: "member" });
  }
  return out;
}

export class SimWorld {
  readonly devices: SimDevice[] = [];
  readonly net: FaultyNetwork;
  /** Who created each run (the harness knows; devices only know what they pulled). */
  readonly creatorOf = new Map<string, string>();
  private readonly random: () => number;

  constructor(
    readonly users: SimUser[],
    serve: Serve,
    readonly scenario: Scenario,
    pushFaults: PushFaults | null = null,
  ) {
    this.random = mulberry32(scenario.seed);
    this.net = new FaultyNetwork(serve, this.random, scenario.faultRate, pushFaults);
  }

  async start(): Promise<void> {
    for (const d of this.scenario.devices) {
      const user = this.users[d.user % this.users.length]!;
      const db = createWindowcallDb(`sim-${uuidv7()}`);
      const now = () => Date.now() - d.skewMs; // server = device + skew
      const device: SimDevice = { user, db, now, page: uuidv7(), client: null!, deviceId: await getDeviceId(db) };
      device.client = this.newClient(device);
      this.devices.push(device);
    }
  }

  private newClient(d: SimDevice): SyncClient {
    return new SyncClient({ db: d.db, fetch: this.net.fetchFor(d.user), clock: { now: d.now }, timers: noTimers, random: this.random });
  }

  async step(s: Step): Promise<void> {
    const d = this.devices[s.device % this.devices.length]!;
    switch (s.op) {
      case "create":
        return this.create(d);
      case "record":
        return this.record(d, s.n);
      case "sync":
        return d.client.sync();
      case "kill":
        // the tab dies: a new page (new monotonic clock) and a new client over the same database
        d.client.stop();
        d.page = uuidv7();
        d.client = this.newClient(d);
        return;
      case "measure":
        await d.client.measureClock();
        return;
      case "deliver":
        return this.net.deliverHeld(s.n);
    }
  }

  private async create(d: SimDevice): Promise<void> {
    const session = await createSessionLocal(d.db, { ownerId: d.user.id, fieldName: "Sim field", conditions: { windMs: 2 }, startedAtWallMs: d.now() });
    const mate = this.users[Math.floor(this.random() * this.users.length)]!;
    const lanes = [{ lane: 0, pilotName: d.user.name, pilotUserId: d.user.id }];
    if (mate.id !== d.user.id) lanes.push({ lane: 1, pilotName: mate.name, pilotUserId: mate.id });
    const task = getCatalogueTask(TASKS[Math.floor(this.random() * TASKS.length)]!);
    const run = await createRunLocal(d.db, { sessionId: session.id, task, lanes, createdAtWallMs: d.now() });
    this.creatorOf.set(run.id, d.user.id);
  }

  /** Record `n` taps on a run this device's user may write to (as creator or lane pilot). */
  private async record(d: SimDevice, n: number): Promise<void> {
    const runs = (await d.db.runs.toArray()).filter(
      (r) => this.creatorOf.get(r.id) === d.user.id || r.lanes.some((l) => l.pilotUserId === d.user.id),
    );
    if (runs.length === 0) return;
    const run = runs[Math.floor(this.random() * runs.length)]!;
    const lanes = this.creatorOf.get(run.id) === d.user.id ? run.lanes : run.lanes.filter((l) => l.pilotUserId === d.user.id);
    for (let i = 0; i < n; i++) {
      const mine = await d.db.events.where("runId").equals(run.id).filter((e) => e.deviceId === d.deviceId).toArray();
      const roll = this.random();
      const lane = lanes[Math.floor(this.random() * lanes.length)]!.lane;
      let body: EventBody;
      if (mine.length === 0 || roll < 0.1) body = { kind: "window-start" };
      else if (roll < 0.2) body = { kind: "void", targetId: mine[Math.floor(this.random() * mine.length)]!.id };
      else body = { kind: this.random() < 0.5 ? "launch" : "landing", lane };
      const stamp = stampFromInput(performance.now(), d.client.currentEstimate(), { monoNow: () => performance.now(), wallNow: d.now }, d.page);
      await recordEvent(d.db, { runId: run.id, body, stamp: { ...stamp, wallMs: Math.round(stamp.wallMs) } });
    }
  }

  /** Deliver every held request, then sync every device with a clean network until nothing is left to send, then pull. */
  async settle(): Promise<void> {
    await this.net.deliverHeld();
    await this.net.lateCommits();
    this.net.faultRate = 0;
    for (const d of this.devices) {
      d.client.stop();
      d.client = this.newClient(d);
      for (let i = 0; i < 5 && (await d.client.refreshStatus()).unsent > 0; i++) await d.client.flush();
    }
    for (const d of this.devices) await d.client.pull();
  }

  close(): void {
    for (const d of this.devices) {
      d.client.stop();
      d.db.close();
    }
  }
}

/** Server rows of these devices' events: id, device, seq, run. */
export async function serverEvents(db: Database, deviceIds: readonly string[]) {
  if (deviceIds.length === 0) return [];
  const r = await db.execute<{ id: string; device_id: string; seq: number; run_id: string }>(
    sql`select id::text, device_id, seq, run_id::text from events where device_id in (${sql.join(deviceIds.map((d) => sql`${d}`), sql`, `)})`,
  );
  return r.rows;
}
