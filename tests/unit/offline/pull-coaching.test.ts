import { v7 as uuidv7 } from "uuid";
import { describe, expect, it } from "vitest";
import { getMeta } from "@/lib/offline/db";
import { pullAll } from "@/lib/offline/pull";
import type { PulledNote, PulledPlan } from "@/lib/validations/coaching-sync";
import { freshDbsPerTest } from "./helpers";

const open = freshDbsPerTest();

const note = (pilotId: string, body: string): PulledNote => ({
  id: uuidv7(), pilotId, coachId: uuidv7(), authorId: uuidv7(), authorName: "Coach", sessionId: uuidv7(), runId: uuidv7(), replyTo: null, body, createdAtMs: 1,
});
const plan = (): PulledPlan => ({
  id: uuidv7(), pilotId: uuidv7(), pilotName: "Pilot", coachName: "Coach", title: "Relaunches", createdAtMs: 1, updatedAtMs: null, closedAtMs: null, pilotSyncedAtMs: null,
  items: [{ letter: "H", variant: 600, goal: "three windows", windows: 3, measure: { kind: "median-turnaround-below", seconds: 3 } }],
  progress: { items: [{ flown: 1, windows: 3, value: 2.5, met: false }], done: false },
});

/** A server whose every pull is one last page carrying `lists()`. */
function serverOf(lists: () => { notes: PulledNote[]; plans: PulledPlan[] }) {
  return async () => new Response(JSON.stringify({ items: [], nextCursor: "0", hasMore: false, scope: "", models: [], ...lists() }), {
    status: 200, headers: { "content-type": "application/json" },
  });
}

describe("pull: coach notes and assigned plans", () => {
  it("keeps the last page's whole lists, so notes the user may no longer read drop off the phone", async () => {
    const db = open();
    const lena = uuidv7();
    const ada = uuidv7();
    let lists = { notes: [note(lena, "Relaunch faster"), note(ada, "Nice ladder")], plans: [plan()] };
    const fetch = serverOf(() => lists);
    expect((await pullAll({ db, fetch })).kind).toBe("ok");
    expect((await getMeta(db, "notes"))?.map((n) => n.body)).toEqual(["Relaunch faster", "Nice ladder"]);
    expect((await getMeta(db, "assignedPlans"))?.[0]?.progress.items[0]?.value).toBe(2.5);
    // Lena revoked the grant: the server no longer sends her notes, and the phone forgets them
    lists = { notes: lists.notes.filter((n) => n.pilotId !== lena), plans: [] };
    expect((await pullAll({ db, fetch })).kind).toBe("ok");
    expect((await getMeta(db, "notes"))?.map((n) => n.pilotId)).toEqual([ada]);
    expect(await getMeta(db, "assignedPlans")).toEqual([]);
  });

  it("sends back the fingerprint it keeps with both lists, keeps its lists when the reply leaves them out, and takes a new set with its fingerprint", async () => {
    const db = open();
    const asked: string[] = [];
    let reply: Record<string, unknown> = { notes: [note(uuidv7(), "Relaunch faster")], plans: [plan()], coaching: "a".repeat(64) };
    const fetch = async (url: string) => {
      asked.push(new URL(url, "http://phone").searchParams.get("coaching") ?? "");
      return new Response(JSON.stringify({ items: [], nextCursor: "0", hasMore: false, scope: "", ...reply }), { status: 200, headers: { "content-type": "application/json" } });
    };
    expect((await pullAll({ db, fetch })).kind).toBe("ok");
    expect(asked).toEqual([""]); // nothing held yet: no fingerprint
    expect(await getMeta(db, "pullCoaching")).toBe("a".repeat(64));
    reply = { coaching: "a".repeat(64) }; // unchanged: the server leaves the lists out
    expect((await pullAll({ db, fetch })).kind).toBe("ok");
    expect(asked.at(-1)).toBe("a".repeat(64));
    expect((await getMeta(db, "notes"))?.map((n) => n.body)).toEqual(["Relaunch faster"]);
    expect(await getMeta(db, "assignedPlans")).toHaveLength(1);
    reply = { notes: [], plans: [], coaching: "b".repeat(64) }; // changed (a revoke): the new, empty set replaces the old
    expect((await pullAll({ db, fetch })).kind).toBe("ok");
    expect(await getMeta(db, "notes")).toEqual([]);
    expect(await getMeta(db, "pullCoaching")).toBe("b".repeat(64));
    // a phone missing either list sends no fingerprint, so it gets both whole
    await db.meta.delete("assignedPlans");
    expect((await pullAll({ db, fetch })).kind).toBe("ok");
    expect(asked.at(-1)).toBe("");
  });
});
