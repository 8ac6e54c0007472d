import "./support/session";
import "fake-indexeddb/auto";
import { and, eq } from "drizzle-orm";
import { v7 as uuidv7 } from "uuid";
import { afterAll, describe, expect, it } from "vitest";
import { GET as pullRoute } from "@/app/api/sync/pull/route";
import { POST as notePost } from "@/app/api/notes/route";
import { POST as planPost } from "@/app/api/coach/plans/route";
import { revokeGrant } from "@/db/queries/coach/grants";
import { coachGrants } from "@/db/schema";
import { createWindowcallDb, getMeta } from "@/lib/offline/db";
import { pullAll } from "@/lib/offline/pull";
import type { PullReply } from "@/lib/validations/sync";
import { actAs } from "./support/session";
import { db, getPool } from "./support/db";
import { freshClub, grant } from "./consent-fixtures";
import { deviceId, push, recorder, run, session, T0 } from "./sync-fixtures";

afterAll(async () => {
  await getPool().end();
});

type U = { id: string; email: string; name: string; role: "member" | "admin" };
const json = (url: string, body: unknown) => new Request(`http://test${url}`, { method: "POST", body: JSON.stringify(body), headers: { "content-type": "application/json" } });

/** One phone of `user`: its own device database, pulling through the real route; `last` is the last page of its last pull as the server sent it. */
function phoneOf(user: U) {
  const local = createWindowcallDb(`coaching-${uuidv7()}`);
  const phone = {
    db: local,
    last: undefined as Record<string, unknown> | undefined,
    async sync() {
      const outcome = await pullAll({
        db: local, account: user.id,
        fetch: async (url: string) => {
          actAs(user);
          const res = await pullRoute(new Request(`http://test${url}`));
          const body = (await res.clone().json()) as Record<string, unknown>;
          if (body.hasMore === false) phone.last = body;
          return res;
        },
      });
      expect(outcome.kind).toBe("ok");
      return phone.last!;
    },
    notes: async () => ((await getMeta(local, "notes")) ?? []).map((n) => n.body).sort(),
    plans: async () => ((await getMeta(local, "assignedPlans")) ?? []).map((p) => p.title).sort(),
  };
  return phone;
}

/** `user` pushes a run of their own (task H) with flights of `secs`, optionally toward a plan item; returns its id. */
async function ownRun(user: U, secs: number[], plan?: { id: string; item: number }): Promise<string> {
  actAs(user);
  const phone = recorder(deviceId());
  const s = session(user.id);
  const r = { ...run(s.id, [{ lane: 0, pilotName: user.name, pilotUserId: user.id }]), ...(plan ? { plan } : {}) };
  const res = await push({ deviceId: phone.id, sessions: [s], runs: [r], events: [phone.at(r.id, T0, { kind: "window-start" }), ...phone.flights(r.id, 0, secs, T0 + 1000)] });
  expect(res.body.acks.every((a) => a.status === "applied")).toBe(true);
  return r.id;
}

async function writeNote(coach: U, pilot: U, runId: string, body: string) {
  actAs(coach);
  expect((await notePost(json("/api/notes", { pilotId: pilot.id, runId, body }))).status).toBe(201);
}

/** The route's last page for a phone that sends `coaching` (or none: an older phone). */
async function routePull(user: U, coaching?: string): Promise<PullReply> {
  actAs(user);
  const res = await pullRoute(new Request(`http://test/api/sync/pull?cursor=0&limit=1000${coaching === undefined ? "" : `&coaching=${coaching}`}`));
  expect(res.status).toBe(200);
  return (await res.json()) as PullReply;
}

const item = { letter: "H", variant: 600, goal: "quick relaunches", windows: 2, measure: { kind: "median-turnaround-below", seconds: 1.5 } };

describe("coach notes and practice plans travel in the pull only when they changed", () => {
  it("an unchanged set is not resent; a new note, a plan flown further and a revoke are; an older phone gets the whole set", async () => {
    const [pilot, coach] = (await freshClub(["Pilot", "Coach"])) as U[];
    await grant(pilot!, coach!);
    const runId = await ownRun(pilot!, [60, 120]);
    await writeNote(coach!, pilot!, runId, "Relaunch faster.");
    actAs(coach!);
    const made = await planPost(json("/api/coach/plans", { pilotId: pilot!.id, title: "Quick relaunches", items: [item] }));
    expect(made.status).toBe(201);
    const planId = ((await made.json()) as { plan: { id: string } }).plan.id;

    const pilotPhone = phoneOf(pilot!);
    const coachPhone = phoneOf(coach!);
    // first pulls: the whole set, with its fingerprint
    const first = await pilotPhone.sync();
    expect((first.notes as unknown[]).length).toBe(1);
    expect((first.plans as unknown[]).length).toBe(1);
    expect(first.coaching).toMatch(/^[0-9a-f]{64}$/);
    expect((await coachPhone.sync()).notes).toHaveLength(1);
    expect(await pilotPhone.notes()).toEqual(["Relaunch faster."]);
    expect(await pilotPhone.plans()).toEqual(["Quick relaunches"]);

    // nothing changed: the last page carries neither notes nor plans, and the phones keep theirs
    for (const phone of [pilotPhone, coachPhone]) {
      const again = await phone.sync();
      expect(again).not.toHaveProperty("notes");
      expect(again).not.toHaveProperty("plans");
    }
    expect(await pilotPhone.notes()).toEqual(["Relaunch faster."]);
    expect(await pilotPhone.plans()).toEqual(["Quick relaunches"]);
    expect(await coachPhone.notes()).toEqual(["Relaunch faster."]);
    // a push of an unrelated run moves the pilot's last sync (shown on the Coach desk only), not the set
    await ownRun(pilot!, [30]);
    expect(await pilotPhone.sync()).not.toHaveProperty("plans");

    // a new note: the next pull of each phone carries it
    await writeNote(coach!, pilot!, runId, "And land on the spot.");
    for (const phone of [pilotPhone, coachPhone]) {
      const next = await phone.sync();
      expect((next.notes as { body: string }[]).map((n) => n.body).sort()).toEqual(["And land on the spot.", "Relaunch faster."]);
      expect(await phone.notes()).toEqual(["And land on the spot.", "Relaunch faster."]);
      expect(await phone.sync()).not.toHaveProperty("notes");
    }

    // the pilot flies a window of the plan: its progress changed, so the plans come again
    await ownRun(pilot!, [60, 60], { id: planId, item: 0 });
    const flown = await pilotPhone.sync();
    expect((flown.plans as { progress: { items: { flown: number }[] } }[])[0]!.progress.items[0]!.flown).toBe(1);
    expect((await getMeta(pilotPhone.db, "assignedPlans"))![0]!.progress.items[0]!.flown).toBe(1);

    // an older phone (no fingerprint) and a phone with a stale one get the whole set
    const old = await routePull(pilot!);
    expect(old.notes).toHaveLength(2);
    expect(old.plans).toHaveLength(1);
    const stale = await routePull(pilot!, "0".repeat(64));
    expect(stale.notes).toHaveLength(2);
    expect(stale.plans).toHaveLength(1);
    expect((await routePull(pilot!, old.coaching)).notes).toBeUndefined();
    // a fingerprint that is not one: 422, like any bad query
    actAs(pilot!);
    expect((await pullRoute(new Request("http://test/api/sync/pull?cursor=0&coaching=nope"))).status).toBe(422);

    // the pilot revokes: the coach's next pull sends the (now empty) set and the phone drops her notes
    const [row] = await db.select({ id: coachGrants.id }).from(coachGrants).where(and(eq(coachGrants.pilotId, pilot!.id), eq(coachGrants.coachId, coach!.id)));
    expect(await revokeGrant(db, pilot!.id, row!.id)).toBe(true);
    const afterRevoke = await coachPhone.sync();
    expect(afterRevoke.notes).toEqual([]);
    expect(await coachPhone.notes()).toEqual([]);
    // plans travel to their pilot's phone only: the coach's phone holds none of hers, before or after
    expect(await coachPhone.plans()).toEqual([]);
    // the pilot keeps her notes and plan, unchanged and not resent
    expect(await pilotPhone.sync()).not.toHaveProperty("notes");
    expect(await pilotPhone.notes()).toEqual(["And land on the spot.", "Relaunch faster."]);
    expect(await pilotPhone.plans()).toEqual(["Quick relaunches"]);
  });
});
