import "./support/session";
import { join } from "node:path";
import { v7 as uuidv7 } from "uuid";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { clubs, coachGrants, contestPenalties, contestReflightRequests, coachNotes, contestDisputes, contestEntries, contestReflights, contestRounds, contests, groupSlots, memberships, models, users } from "@/db/schema";
import { getCatalogueTask } from "@/lib/tasks";
import type { PushReply } from "@/lib/validations/sync";
import { actAs } from "./support/session";
import { db, getPool } from "./support/db";
import { insertSession } from "./support/records";
import { insertPhonePenalty } from "./support/phone-penalty";
import { replaced } from "./support/json-paths";
import { rowCounter } from "./support/row-counts";
import { recorder, run, session, T0 } from "./sync-fixtures";

/**
 * The random fuzz (fuzz.test.ts) rarely puts a NUL exactly where a valid body would otherwise be written: most of
 * its bodies stop at a 404 or a 409 first. This sweep makes sure the bad strings meet the database. For each JSON
 * route that writes the caller's own rows, on a fresh fixture each time:
 * - the valid body is a 2xx (so the sweep is known to reach the writes: if it stops being one, this test says so);
 * - every string in it, replaced by a NUL, a lone surrogate or 5,000 characters, is a 2xx or a 4xx with a
 *   message, never a 5xx; a 4xx writes nothing (row counts of every table before and after).
 * A NUL in a re-flight's reason once answered 500 here (PostgreSQL's text cannot hold U+0000). The phone's push
 * answers 200 with a verdict per item: there, the item holding the bad string must be the one refused.
 */

afterAll(async () => {
  await getPool().end();
});

type Handler = (request: Request, context: { params: Promise<Record<string, string>> }) => Promise<Response>;
type Method = "POST" | "PUT" | "PATCH" | "DELETE";

/** What one case writes on: a pilot the caller coaches; a club the caller is the only officer of, its drawn contest, the caller's model. */
type Fixture = {
  slug: string; contestId: string; entries: string[]; disputeId: string; granted: string; requestId: string; penaltyId: string; modelId: string; buyerEmail: string;
  /** a penalty the caller's phone gave Sweep Entrant 11 in round 1 (an event of a run linked to the slot) */
  phonePenaltyId: string;
  /** a pilot who lets the caller coach them, a session of theirs and the caller's note on it */
  pilotId: string; pilotEmail: string; sessionId: string; noteId: string;
};

/** `as: "pilot"` sends as the fixture's pilot (a fresh account each time, so the push limit of 120 a minute is never what answers). */
type Case = { method: Method; route: string; params: (f: Fixture) => Record<string, string>; body: (f: Fixture) => unknown; ok: number; as?: "pilot" };

const contest = (f: Fixture, more: Record<string, string> = {}) => ({ contestId: f.contestId, ...more });
const round1 = (f: Fixture) => contest(f, { roundNumber: "1" });

const CASES: Case[] = [
  { method: "POST", route: "/api/clubs", params: () => ({}), body: () => ({ name: "Sweep Club" }), ok: 201 },
  { method: "POST", route: "/api/clubs/[slug]/fields", params: (f) => ({ slug: f.slug }), ok: 201,
    body: () => ({ name: `Sweep Field ${uuidv7()}`, latitude: "51.5", longitude: 2, launchDirection: "West", safetyAreas: "Car park", localRules: "No launches over the path" }) },
  { method: "POST", route: "/api/clubs/[slug]/invitations", params: (f) => ({ slug: f.slug }), ok: 202, body: () => ({ email: `sweep-${uuidv7()}@example.com`, role: "coach" }) },
  { method: "PATCH", route: "/api/contests/[contestId]/entries/[entryId]", params: (f) => contest(f, { entryId: f.entries[0]! }), ok: 200, body: () => ({ team: "Sweep Team", pilotClass: "junior" }) },
  { method: "POST", route: "/api/contests/[contestId]/rounds/[roundNumber]/reflights", params: round1, ok: 201,
    body: (f) => ({ entryId: f.entries[2], cause: "rain", placement: "original-group", entitled: true, groupNumber: 1, reason: "Shower over the field" }) },
  { method: "PUT", route: "/api/contests/[contestId]/rounds/[roundNumber]/reflights", params: round1, ok: 200,
    body: (f) => ({ entryId: f.granted, flights: [900], runId: null, lane: null, signed: true }) },
  { method: "PUT", route: "/api/contests/[contestId]/rounds/[roundNumber]/reflight-requests", params: round1, ok: 200,
    body: (f) => ({ requestId: f.requestId, decision: "grant", placement: "original-group", groupNumber: 2, entitled: true, reason: "Collision at launch" }) },
  { method: "POST", route: "/api/contests/[contestId]/rounds/[roundNumber]/penalties", params: round1, ok: 201,
    body: (f) => ({ entryId: f.entries[9], cause: "object-in-safety-area", points: 100, note: "Touched the flag line" }) },
  { method: "DELETE", route: "/api/contests/[contestId]/rounds/[roundNumber]/penalties", params: round1, ok: 200,
    body: (f) => ({ penaltyId: f.penaltyId, reason: "Given to the wrong pilot" }) },
  { method: "POST", route: "/api/contests/[contestId]/rounds/[roundNumber]/penalties/phone-set-aside", params: round1, ok: 201,
    body: (f) => ({ eventId: f.phonePenaltyId, reason: "Launched inside the window" }) },
  { method: "POST", route: "/api/contests/[contestId]/rounds/[roundNumber]/disputes", params: round1, ok: 201,
    body: (f) => ({ entryId: f.entries[4], subject: "The third flight was not counted", lodgedBy: "Team manager" }) },
  { method: "PUT", route: "/api/contests/[contestId]/rounds/[roundNumber]/disputes", params: round1, ok: 200,
    body: (f) => ({ disputeId: f.disputeId, status: "rejected", outcome: "The card shows the landing after working time" }) },
  { method: "PUT", route: "/api/contests/[contestId]/rounds/[roundNumber]/cards", params: round1, ok: 200,
    body: (f) => ({ groupNumber: 1, cards: f.entries.slice(0, 6).map((entryId) => ({ entryId, flights: [834, 1200], penaltyPoints: 0, signed: true })) }) },
  { method: "POST", route: "/api/models", params: () => ({}), ok: 201, body: () => ({ name: "Sweep glider", spanMm: 1490, massG: 250, marking: "red tips", notes: "spare", status: "flying" }) },
  { method: "PATCH", route: "/api/models/[modelId]", params: (f) => ({ modelId: f.modelId }), ok: 200,
    body: () => ({ name: "Sweep glider", spanMm: 1490, massG: 250, marking: "red tips", notes: "new tail", status: "flying" }) },
  { method: "POST", route: "/api/models/[modelId]/repairs", params: (f) => ({ modelId: f.modelId }), ok: 201, body: () => ({ repairedOn: "2026-06-14", work: "new skin", massAfterG: 255 }) },
  { method: "POST", route: "/api/models/[modelId]/transfer", params: (f) => ({ modelId: f.modelId }), ok: 202, body: (f) => ({ email: f.buyerEmail, withHistory: true }) },
];

CASES.push(
  { method: "POST", route: "/api/account/sign-up", params: () => ({}), ok: 201, body: () => ({ name: "Sweep Pilot", email: `sweep-${uuidv7()}@example.com`, password: "thermal-hunter-42" }) },
  { method: "PUT", route: "/api/clubs/[slug]/time-zone", params: (f) => ({ slug: f.slug }), ok: 200, body: () => ({ timeZone: "Europe/Berlin" }) },
  { method: "POST", route: "/api/coach-grants", params: () => ({}), ok: 201, body: () => ({ kind: "email", email: `sweep-coach-${uuidv7()}@example.com` }) },
  { method: "POST", route: "/api/notes", params: () => ({}), ok: 201, body: (f) => ({ pilotId: f.pilotId, sessionId: f.sessionId, body: "Keep the second launch lower." }) },
  { method: "POST", route: "/api/notes/[noteId]/replies", params: (f) => ({ noteId: f.noteId }), ok: 201, body: () => ({ body: "And watch the turnaround." }) },
  { method: "POST", route: "/api/coach/plans", params: () => ({}), ok: 201,
    body: (f) => ({ pilotId: f.pilotId, title: "Turnarounds", items: [{ letter: "H", variant: 600, goal: "three 1-2-3-4 windows", windows: 3, measure: { kind: "median-turnaround-below", seconds: 3 } }] }) },
  // a phone's push: a bad string in an item is that item's "rejected" verdict (200), in the envelope a 422; never stored
  { method: "POST", route: "/api/sync/push", params: () => ({}), ok: 200, as: "pilot", body: pushBody },
);

type PushBody = ReturnType<typeof pushBody>;

/** A push answered 200 with a bad string inside an item: that item is refused, with a reason; the rest of the batch may apply (SYNC.md §3). */
async function expectItemRejected(res: Response, sent: PushBody, at: (string | number)[], where: string): Promise<void> {
  const [list, index] = at as [keyof PushBody, number];
  const item = (sent[list] as { id: string }[])[index]!;
  const { acks } = (await res.clone().json()) as PushReply;
  const ack = acks.find((a) => a.id === item.id);
  expect(ack?.status, `${where}: the item's verdict`).toBe("rejected");
  expect(ack?.reason, `${where}: a refused item says why`).toBeTruthy();
}

/** A phone's first push of a practice window: the session, the run (a catalogue task, the pilot on lane 0) and a flight with a penalty and a re-flight ruling. */
function pushBody(f: Fixture) {
  const phone = recorder(`sweep-phone-${uuidv7()}`);
  const s = session(f.pilotId, { conditions: { windMs: 3, notes: "Gusty from the west" } });
  const r = run(s.id, [{ lane: 0, pilotName: "Sweep Pilot", pilotUserId: f.pilotId }], getCatalogueTask("B"));
  const [launch, landing] = phone.flights(r.id, 0, [75], T0);
  const penalty = phone.at(r.id, T0 + 80_000, { kind: "penalty", lane: 0, points: 100, reason: "Landed over the flag line", cause: "object-in-safety-area", launchId: launch!.id });
  const ruling = phone.at(r.id, T0 + 90_000, { kind: "reflight", lane: 0, cause: "rain", placement: "later-group", reason: "Shower over the line" });
  return { deviceId: phone.id, sessions: [s], runs: [r], events: [launch, landing, penalty, ruling] };
}

const BAD_STRINGS: [string, string][] = [["a NUL", "a\u0000b"], ["a lone surrogate", "\ud800x"], ["5,000 characters", "x".repeat(5000)]];

/** The path to every string inside `v`. */
function stringPaths(v: unknown, at: (string | number)[] = []): (string | number)[][] {
  if (typeof v === "string") return [at];
  if (Array.isArray(v)) return v.flatMap((x, i) => stringPaths(x, [...at, i]));
  if (v !== null && typeof v === "object") return Object.entries(v).flatMap(([k, x]) => stringPaths(x, [...at, k]));
  return [];
}

describe("fuzz: bad strings reach the writes", () => {
  const me = { id: "", email: `sweep-${uuidv7()}@example.com`, name: "Sweep Officer", role: "member" as const };
  let countAll: () => Promise<string>;

  beforeAll(async () => {
    const [row] = await db.insert(users).values({ email: me.email, name: me.name }).returning();
    me.id = row!.id;
    countAll = await rowCounter();
  });

  /** A fresh club (the caller its only officer) with a contest drawn into two groups of six in every round, a re-flight granted, an open dispute and a phone's penalty in round 1; a model of the caller's and a buyer with an account. */
  async function fixture(): Promise<Fixture> {
    const slug = `sweep-${uuidv7()}`;
    const [club] = await db.insert(clubs).values({ name: "Sweep Club", slug }).returning();
    await db.insert(memberships).values({ clubId: club!.id, userId: me.id, role: "officer" });
    const [c] = await db.insert(contests).values({ clubId: club!.id, name: "Sweep Cup", startsOn: "2027-02-06", fieldName: "Sweep Meadow", drawSeed: 1 }).returning();
    const rounds = await db.insert(contestRounds).values(["A", "B", "D", "F", "G"].map((l, i) => ({ contestId: c!.id, number: i + 1, task: getCatalogueTask(l as "A") }))).returning();
    const entries = await db.insert(contestEntries).values(Array.from({ length: 12 }, (_, n) => ({ contestId: c!.id, pilotName: `Sweep Entrant ${n + 1}`, paper: true }))).returning();
    await db.insert(groupSlots).values(rounds.flatMap((r) => entries.map((e, i) => ({ roundId: r.id, entryId: e.id, groupNumber: i < 6 ? 1 : 2 }))));
    await db.insert(contestReflights).values({ roundId: rounds[0]!.id, entryId: entries[3]!.id, cause: "organiser", placement: "original-group", groupNumber: 1 });
    const [dispute] = await db.insert(contestDisputes).values({ roundId: rounds[0]!.id, entryId: entries[5]!.id, subject: "Landing not counted", lodgedBy: "Sweep Entrant 6" }).returning();
    const [request] = await db.insert(contestReflightRequests).values({
      roundId: rounds[0]!.id, entryId: entries[7]!.id, eventId: uuidv7(), runId: uuidv7(), lane: 0, cause: "launch-collision", placement: "original-group", askedAt: new Date(),
    }).returning();
    const [penalty] = await db.insert(contestPenalties).values({ roundId: rounds[0]!.id, entryId: entries[8]!.id, cause: "object-in-safety-area", points: 100, givenBy: me.id }).returning();
    const phone = await insertPhonePenalty(me.id, rounds[0]!.id, entries[10]!.id, "Sweep Entrant 11");
    const [model] = await db.insert(models).values({ ownerId: me.id, name: "Sweep glider", spanMm: 1490, massG: 250 }).returning();
    const buyerEmail = `sweep-buyer-${uuidv7()}@example.com`;
    await db.insert(users).values({ email: buyerEmail, name: "Sweep Buyer" });
    const pilotEmail = `sweep-pilot-${uuidv7()}@example.com`;
    const [pilot] = await db.insert(users).values({ email: pilotEmail, name: "Sweep Pilot" }).returning();
    await db.insert(coachGrants).values({ pilotId: pilot!.id, coachId: me.id });
    const sessionId = await insertSession(pilot!.id);
    const [note] = await db.insert(coachNotes).values({ sessionId, pilotId: pilot!.id, coachId: me.id, authorId: me.id, body: "First note" }).returning();
    return {
      slug, contestId: c!.id, entries: entries.map((e) => e.id), disputeId: dispute!.id, granted: entries[3]!.id, requestId: request!.id, penaltyId: penalty!.id, modelId: model!.id, buyerEmail, phonePenaltyId: phone.eventId,
      pilotId: pilot!.id, pilotEmail, sessionId, noteId: note!.id,
    };
  }

  async function send(c: Case, f: Fixture, body: unknown): Promise<Response> {
    const mod = (await import(join(process.cwd(), "app", c.route, "route.ts"))) as Partial<Record<Method, Handler>>;
    actAs(c.as === "pilot" ? { id: f.pilotId, email: f.pilotEmail, name: "Sweep Pilot", role: "member" } : me);
    const request = new Request(`http://test${c.route}`, { method: c.method, body: JSON.stringify(body), headers: { "content-type": "application/json" } });
    return mod[c.method]!(request, { params: Promise.resolve(c.params(f)) });
  }

  it.each(CASES.map((c) => [`${c.method} ${c.route}`, c] as const))("%s", { timeout: 120_000 }, async (_name, c) => {
    // the valid body is written: the sweep below starts from a body that reaches the database
    const f0 = await fixture();
    const valid = await send(c, f0, c.body(f0));
    expect(valid.status, `the valid body answered ${valid.status}: ${await valid.clone().text()}`).toBe(c.ok);
    const leaves = stringPaths(c.body(f0));
    expect(leaves.length).toBeGreaterThan(0);
    for (const at of leaves) {
      for (const [what, value] of BAD_STRINGS) {
        const f = await fixture();
        const before = await countAll();
        const sent = replaced(c.body(f), at, value);
        const res = await send(c, f, sent);
        const where = `${c.method} ${c.route} with ${what} at ${at.join(".")}`;
        expect(res.status, `${where} answered ${res.status}`).toBeLessThan(500);
        if (c.route === "/api/sync/push" && res.status === 200) await expectItemRejected(res, sent as PushBody, at, where);
        if (res.status >= 400) {
          expect(await countAll(), `${where} answered ${res.status} but wrote`).toBe(before);
          const reply = (await res.json()) as { error?: { message?: unknown } };
          expect(typeof reply.error?.message, `${where}: a 4xx says why`).toBe("string");
        }
      }
    }
  });
});
