import "./support/session";
import { and, eq, sql } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { coachGrants, coachNotes, practicePlans, runs } from "@/db/schema";
import { listChanges } from "@/db/queries/sync-pull";
import { POST as notePost } from "@/app/api/notes/route";
import { POST as replyPost } from "@/app/api/notes/[noteId]/replies/route";
import { GET as plansGet, POST as planPost } from "@/app/api/coach/plans/route";
import { PATCH as planPatch } from "@/app/api/coach/plans/[planId]/route";
import { devices } from "@/db/schema";
import { NOTE_BODY_MAX } from "@/lib/validations/coach";
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
const write = async (body: unknown) => {
  const res = await notePost(json("/api/notes", body));
  return { status: res.status, body: await res.json() };
};
const answer = async (noteId: string, body: unknown) => {
  const res = await replyPost(json(`/api/notes/${noteId}/replies`, body), { params: Promise.resolve({ noteId }) });
  return { status: res.status, body: await res.json() };
};

/** `user` pushes a run of their own (task H) with flights of `secs` and, optionally, a plan item link; returns its id. */
async function ownRun(user: U, secs: number[], plan?: { id: string; item: number }): Promise<{ runId: string; sessionId: string }> {
  actAs(user);
  const phone = recorder(deviceId());
  const s = session(user.id);
  const r = { ...run(s.id, [{ lane: 0, pilotName: user.name, pilotUserId: user.id }]), ...(plan ? { plan } : {}) };
  const res = await push({ deviceId: phone.id, sessions: [s], runs: [r], events: [phone.at(r.id, T0, { kind: "window-start" }), ...phone.flights(r.id, 0, secs, T0 + 1000)] });
  expect(res.body.acks.every((a) => a.status === "applied")).toBe(true);
  return { runId: r.id, sessionId: s.id };
}

/** The last page of a pull from the start (where notes and plans travel). */
async function lastPage(userId: string): Promise<PullReply> {
  let cursor = "0";
  for (;;) {
    const page = await listChanges(db, { userId, cursor });
    if (!page.hasMore) return page;
    cursor = page.nextCursor;
  }
}

describe("coach notes", () => {
  it("a granted coach writes on the pilot's run, the pilot answers, both pull the thread, and a revoke takes it off the coach's phone", async () => {
    const [pilot, coach, other, stranger] = (await freshClub(["Pilot", "Coach", "Other", "Stranger"])) as U[];
    await grant(pilot!, coach!);
    const { runId, sessionId } = await ownRun(pilot!, [60, 120]);
    const othersRun = await ownRun(other!, [30]);

    actAs(coach!);
    // bounded, validated before any I/O
    expect((await write({ pilotId: pilot!.id, runId, body: "x".repeat(NOTE_BODY_MAX + 1) })).status).toBe(422);
    expect((await write({ pilotId: pilot!.id, runId, sessionId, body: "both" })).status).toBe(422);
    expect((await write({ pilotId: pilot!.id, runId, body: "   " })).status).toBe(422);
    // a run that is not in the pilot's record, or a pilot who does not grant: 404, nothing written
    expect((await write({ pilotId: pilot!.id, runId: othersRun.runId, body: "not hers" })).status).toBe(404);
    expect((await write({ pilotId: other!.id, runId: othersRun.runId, body: "no grant" })).status).toBe(404);
    expect(await db.$count(coachNotes, eq(coachNotes.pilotId, other!.id))).toBe(0);

    const made = await write({ pilotId: pilot!.id, runId, body: "Relaunch faster after the 2-minute flight." });
    expect(made.status).toBe(201);
    const noteId = made.body.note.id as string;
    expect(made.body.note).toMatchObject({ pilotId: pilot!.id, coachId: coach!.id, authorId: coach!.id, runId, sessionId, replyTo: null });
    const onSession = await write({ pilotId: pilot!.id, sessionId, body: "Windy day, good choices." });
    expect(onSession.status).toBe(201);
    expect(onSession.body.note.runId).toBeNull();

    // only the pilot writes notes on their own runs through a grant: the pilot herself is no coach of herself
    actAs(pilot!);
    expect((await write({ pilotId: pilot!.id, runId, body: "to myself" })).status).toBe(404);
    // answers: the pilot and the thread's coach; nobody else learns the note exists
    const ans = await answer(noteId, { body: "Will try, thanks." });
    expect(ans.status).toBe(201);
    expect(ans.body.note).toMatchObject({ replyTo: noteId, authorId: pilot!.id, authorName: "Pilot" });
    for (const u of [other!, stranger!]) {
      actAs(u);
      expect((await answer(noteId, { body: "me too" })).status).toBe(404);
    }
    actAs(coach!);
    // answering an answer answers the thread
    const back = await answer(ans.body.note.id, { body: "Good." });
    expect(back.status).toBe(201);
    expect(back.body.note.replyTo).toBe(noteId);

    // the pull's last page carries the notes to both phones, and to nobody else
    const bodies = (r: PullReply) => (r.notes ?? []).map((n) => n.body).sort();
    const all = ["Good.", "Relaunch faster after the 2-minute flight.", "Will try, thanks.", "Windy day, good choices."];
    expect(bodies(await lastPage(pilot!.id))).toEqual(all);
    expect(bodies(await lastPage(coach!.id))).toEqual(all);
    expect(bodies(await lastPage(other!.id))).toEqual([]);

    // the pilot revokes: the coach can no longer write or answer (404), and the next pull carries none of her notes
    await db.update(coachGrants).set({ revokedAt: sql`now()` }).where(and(eq(coachGrants.pilotId, pilot!.id), eq(coachGrants.coachId, coach!.id)));
    expect((await write({ pilotId: pilot!.id, runId, body: "still there?" })).status).toBe(404);
    expect((await answer(noteId, { body: "hello?" })).status).toBe(404);
    const coachPull = await lastPage(coach!.id);
    expect(coachPull.notes).toEqual([]);
    expect(coachPull.forget).toContain(runId);
    // the pilot keeps every note of her own
    expect(bodies(await lastPage(pilot!.id))).toEqual(all);
  });
});

describe("practice plans", () => {
  const item = (o: object = {}) => ({ letter: "H", variant: 600, goal: "1-2-3-4 windows, quick relaunches", windows: 2, measure: { kind: "median-turnaround-below", seconds: 1.5 }, ...o });

  it("a granted coach assigns a plan; runs set up from its items count toward it; the pilot's pull carries it with progress", async () => {
    const [pilot, coach, other] = (await freshClub(["Pilot", "Coach", "Other"])) as U[];
    await grant(pilot!, coach!);
    actAs(coach!);
    const bad = await planPost(json("/api/coach/plans", { pilotId: pilot!.id, title: "T", items: [item({ variant: 123 })] }));
    expect(bad.status).toBe(422);
    const refused = await planPost(json("/api/coach/plans", { pilotId: other!.id, title: "T", items: [item()] }));
    expect(refused.status).toBe(404);
    expect(await db.$count(practicePlans, eq(practicePlans.pilotId, other!.id))).toBe(0);
    const res = await planPost(json("/api/coach/plans", { pilotId: pilot!.id, title: "Quick relaunches", items: [item(), item({ letter: "A", measure: null, windows: 1 })] }));
    expect(res.status).toBe(201);
    const planId = ((await res.json()) as { plan: { id: string } }).plan.id;

    // two windows from item 0: flights of 60 s and 120 s, 1 s on the ground between each (the fixture) → median turnaround 1 s < 1.5 s
    const a = await ownRun(pilot!, [60, 120], { id: planId, item: 0 });
    const b = await ownRun(pilot!, [60, 60, 60], { id: planId, item: 0 });
    // a link to an item the plan does not have, or to someone else's plan, is not kept
    const wrongItem = await ownRun(pilot!, [60], { id: planId, item: 5 });
    const notHers = await ownRun(other!, [60], { id: planId, item: 0 });
    const stored = async (id: string) => (await db.select({ planId: runs.planId, planItem: runs.planItem }).from(runs).where(eq(runs.id, id)))[0];
    expect(await stored(a.runId)).toEqual({ planId, planItem: 0 });
    expect(await stored(wrongItem.runId)).toEqual({ planId: null, planItem: null });
    expect(await stored(notHers.runId)).toEqual({ planId: null, planItem: null });

    const plans = (await lastPage(pilot!.id)).plans ?? [];
    expect(plans).toHaveLength(1);
    expect(plans[0]).toMatchObject({ id: planId, title: "Quick relaunches", coachName: "Coach", pilotId: pilot!.id });
    expect(plans[0]!.progress).toEqual({
      items: [{ flown: 2, windows: 2, value: 1, met: true }, { flown: 0, windows: 1, value: null, met: false }],
      done: false,
    });
    // the pilot's own pull brings the run back with its link
    const page = await listChanges(db, { userId: pilot!.id, cursor: "0", limit: 1000 });
    const pulled = page.items.find((i) => i.type === "run" && i.data.id === b.runId);
    expect(pulled?.type === "run" ? pulled.data.plan : undefined).toEqual({ id: planId, item: 0 });

    // the coach lists it with the same progress; once revoked, no longer
    actAs(coach!);
    const listed = (await (await plansGet()).json()) as { plans: { id: string; progress: unknown }[] };
    expect(listed.plans.find((p) => p.id === planId)?.progress).toEqual(plans[0]!.progress);
    await db.update(coachGrants).set({ revokedAt: sql`now()` }).where(and(eq(coachGrants.pilotId, pilot!.id), eq(coachGrants.coachId, coach!.id)));
    const after = (await (await plansGet()).json()) as { plans: { id: string }[] };
    expect(after.plans.map((p) => p.id)).not.toContain(planId);
  });

  it("the coach who assigned a plan edits and closes it (anyone else: 404, nothing changed); the pull carries the change and the pilot's last sync", async () => {
    const [pilot, coach, other] = (await freshClub(["Pilot", "Coach", "Other"])) as U[];
    await grant(pilot!, coach!);
    await grant(pilot!, other!);
    actAs(coach!);
    const res = await planPost(json("/api/coach/plans", { pilotId: pilot!.id, title: "Relaunches", items: [item()] }));
    const planId = ((await res.json()) as { plan: { id: string } }).plan.id;
    const patch = (body: unknown) => planPatch(new Request(`http://test/api/coach/plans/${planId}`, { method: "PATCH", body: JSON.stringify(body), headers: { "content-type": "application/json" } }),
      { params: Promise.resolve({ planId }) });
    const row = async () => (await db.select().from(practicePlans).where(eq(practicePlans.id, planId)))[0]!;

    // another coach of the same pilot, and the pilot herself, cannot change it
    for (const who of [other!, pilot!]) {
      actAs(who);
      expect((await patch({ closed: true })).status).toBe(404);
    }
    expect((await row()).closedAt).toBeNull();
    actAs(coach!);
    expect((await patch({})).status).toBe(422);
    expect((await patch({ title: "", items: [item()] })).status).toBe(422);
    expect((await row()).title).toBe("Relaunches");

    const edited = await patch({ title: "Relaunches, week two", items: [item(), item({ letter: "A", measure: null, windows: 1, goal: "one long flight" })] });
    expect(edited.status).toBe(200);
    expect((await row()).updatedAt).not.toBeNull();
    const closed = await patch({ closed: true });
    expect(closed.status).toBe(200);
    expect(((await closed.json()) as { plan: { closedAtMs: number | null } }).plan.closedAtMs).toEqual(expect.any(Number));

    // a run she pushes names the plan; her device's last push is the "as of" the coach reads
    await ownRun(pilot!, [60, 60], { id: planId, item: 1 });
    const pulled = (await lastPage(pilot!.id)).plans?.find((p) => p.id === planId);
    expect(pulled).toMatchObject({ title: "Relaunches, week two", closedAtMs: expect.any(Number) });
    expect(pulled!.items.map((i) => i.letter)).toEqual(["H", "A"]);
    const [seen] = await db.select({ at: sql<Date>`max(${devices.lastSeenAt})` }).from(devices).where(eq(devices.userId, pilot!.id));
    expect(pulled!.pilotSyncedAtMs).toBe(new Date(seen!.at).getTime());
    expect(pulled!.progress.items[1]).toMatchObject({ flown: 1, windows: 1, met: true });

    // reopened; then, once the pilot revokes, a 404
    actAs(coach!);
    expect(((await (await patch({ closed: false })).json()) as { plan: { closedAtMs: number | null } }).plan.closedAtMs).toBeNull();
    await db.update(coachGrants).set({ revokedAt: sql`now()` }).where(and(eq(coachGrants.pilotId, pilot!.id), eq(coachGrants.coachId, coach!.id)));
    expect((await patch({ closed: true })).status).toBe(404);
    expect((await row()).closedAt).toBeNull();
  });

  it("a run's plan link is a foreign key: a plan that does not exist cannot be named", async () => {
    const [pilot] = (await freshClub(["Pilot"])) as U[];
    const { runId } = await ownRun(pilot!, [60]);
    await expect(db.update(runs).set({ planId: "0190aaaa-0000-7000-8000-000000000000", planItem: 0 }).where(eq(runs.id, runId))).rejects.toThrow();
  });
});
