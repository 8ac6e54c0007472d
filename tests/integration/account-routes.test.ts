import "./support/session";
import { createHash } from "node:crypto";
import { afterAll, describe, expect, it } from "vitest";
import { eq, inArray } from "drizzle-orm";
import { clubDayRuns, clubDays, clubFields, clubs, coachGrants, coachInvites, events, fieldSessions, memberships, runLanes, runs, users } from "@/db/schema";
import { DELETE as deleteAccountRoute } from "@/app/api/account/route";
import { GET as exportRoute } from "@/app/api/account/export/route";
import { POST as passwordRoute } from "@/app/api/account/password/route";
import { POST as signOutEverywhereRoute } from "@/app/api/account/sign-out-everywhere/route";
import { GET as clubMatesRoute } from "@/app/api/club-mates/route";
import { POST as signUpRoute } from "@/app/api/account/sign-up/route";
import { hashPassword, verifyPassword } from "@/lib/auth/password";
import { actAs } from "./support/session";
import { db, demoUser, freshUser, getPool } from "./support/db";
import { insertRun, insertSession } from "./support/records";
import { decide } from "./consent-fixtures";

afterAll(async () => {
  await getPool().end();
});

const PASSWORD = "ridge-lift-2026";
const json = (method: string, body: unknown) => ({ method, body: JSON.stringify(body), headers: { "content-type": "application/json" } });
const changePassword = (body: unknown) => passwordRoute(new Request("http://test/api/account/password", json("POST", body)));
const deleteAccount = (body: unknown) => deleteAccountRoute(new Request("http://test/api/account", json("DELETE", body)));
const signOutEverywhere = () => signOutEverywhereRoute(new Request("http://test/api/account/sign-out-everywhere", json("POST", {})));
const hashOf = async (id: string) => (await db.select().from(users).where(eq(users.id, id)))[0]?.passwordHash;

describe("POST /api/account/password", () => {
  it("is 401 signed out, 422 for a weak new password, 403 for a wrong current one — changing nothing", async () => {
    const pilot = await freshUser("pw-refused", { passwordHash: await hashPassword(PASSWORD) });
    const before = await hashOf(pilot.id);
    actAs(null);
    expect((await changePassword({ currentPassword: PASSWORD, newPassword: "launch-window-77" })).status).toBe(401);
    actAs(pilot);
    const weak = await changePassword({ currentPassword: PASSWORD, newPassword: "short" });
    expect(weak.status).toBe(422);
    expect((await weak.json()).error.issues[0].path).toBe("newPassword");
    const wrong = await changePassword({ currentPassword: "not-my-password", newPassword: "launch-window-77" });
    expect(wrong.status).toBe(403);
    expect((await wrong.json()).error.code).toBe("wrong_password");
    expect(await hashOf(pilot.id)).toBe(before);
    expect((await clubMatesRoute()).status).toBe(200);
  });

  it("stores the new password's hash and signs out every session of the account", async () => {
    const pilot = await freshUser("pw-change", { passwordHash: await hashPassword(PASSWORD) });
    actAs(pilot);
    const res = await changePassword({ currentPassword: PASSWORD, newPassword: "launch-window-77" });
    expect(res.status).toBe(200);
    const hash = await hashOf(pilot.id);
    expect(await verifyPassword("launch-window-77", hash)).toBe(true);
    expect(await verifyPassword(PASSWORD, hash)).toBe(false);
    expect((await clubMatesRoute()).status).toBe(401);
  });
});

describe("password confirmations are counted like sign-in attempts (lib/auth/attempts.ts)", () => {
  it("after three wrong current passwords, even the right one waits (429) and nothing changes", async () => {
    const pilot = await freshUser("pw-guess", { passwordHash: await hashPassword(PASSWORD) });
    const before = await hashOf(pilot.id);
    actAs(pilot);
    const statuses = [];
    for (const guess of ["guess-one-aaa", "guess-two-bbb", "guess-three-ccc"]) {
      statuses.push((await changePassword({ currentPassword: guess, newPassword: "launch-window-77" })).status);
    }
    // two free attempts, the third opens the pair's gate (README: "What is protected and how")
    expect(statuses.slice(0, 2)).toEqual([403, 403]);
    const right = await changePassword({ currentPassword: PASSWORD, newPassword: "launch-window-77" });
    expect(right.status).toBe(429);
    expect((await right.json()).error.code).toBe("rate_limited");
    const del = await deleteAccount({ password: PASSWORD });
    expect(del.status).toBe(429);
    expect(await hashOf(pilot.id)).toBe(before);
    expect((await db.select().from(users).where(eq(users.id, pilot.id)))[0]?.deletedAt).toBeNull();
  });
});

describe("POST /api/account/sign-out-everywhere", () => {
  it("is 401 signed out; signed in, every token of the account is refused afterwards", async () => {
    actAs(null);
    expect((await signOutEverywhere()).status).toBe(401);
    const pilot = await freshUser("everywhere");
    actAs(pilot);
    expect((await signOutEverywhere()).status).toBe(200);
    expect((await clubMatesRoute()).status).toBe(401);
    const [row] = await db.select().from(users).where(eq(users.id, pilot.id));
    expect(row?.sessionVersion).toBe(pilot.sessionVersion + 1);
  });
});

describe("GET /api/account/export", () => {
  it("is 401 signed out", async () => {
    actAs(null);
    expect((await exportRoute()).status).toBe(401);
  });

  it("downloads the account, memberships, grants, sessions, runs with lanes and the user's events — no password hash", async () => {
    const ada = await demoUser("ada@example.com");
    actAs(ada);
    const res = await exportRoute();
    expect(res.status).toBe(200);
    expect(res.headers.get("content-disposition")).toMatch(/^attachment; filename="windowcall-export-\d{4}-\d{2}-\d{2}\.json"$/);
    const text = await res.text();
    expect(text).not.toMatch(/password/i);
    const data = JSON.parse(text);
    expect(data.account).toMatchObject({ id: ada.id, email: "ada@example.com", name: "Ada Fenwick" });
    expect(data.memberships.map((m: { club: string }) => m.club)).toContain("Heronmoor Hand-Launch Club");
    expect(data.coachGrants.given.map((g: { coach: string }) => g.coach)).toContain("Mara Lindqvist");
    expect(data.sessions).toHaveLength(await db.$count(fieldSessions, eq(fieldSessions.ownerId, ada.id)));
    // a seeded run of hers (other tests add runs of their own to the shared database)
    const seededSession = data.sessions.find((x: { fieldName: string }) => x.fieldName === "Five Acre Meadow");
    const seededRun = data.runs.find((r: { sessionId: string }) => r.sessionId === seededSession.id);
    expect(seededRun.lanes).toEqual([expect.objectContaining({ pilotUserId: ada.id, pilotName: "Ada Fenwick", lane: 0 })]);
    // each lane as stored, once: not the season's generated copies of its derived flights and breakdown
    expect(Object.keys(seededRun.lanes[0]).sort()).toEqual(
      ["derived", "guestPilotId", "lane", "needsReview", "pilotName", "pilotUserId", "resultTenths", "reviewReason", "runId"],
    );
    // the seeded coach desk: Mara's note on her run with Ada's answer, and the plan Mara assigned her
    // (other tests add notes of their own to the shared database)
    type Note = { id: string; author: string; replyTo: string | null; body: string };
    const seededNote = data.coachNotes.find((n: Note) => n.author === "Mara Lindqvist" && n.body.startsWith("Good window."));
    expect(seededNote?.replyTo).toBeNull();
    expect(data.coachNotes.filter((n: Note) => n.replyTo === seededNote.id).map((n: Note) => n.author)).toEqual(["Ada Fenwick"]);
    expect(data.practicePlans.map((p: { title: string }) => p.title)).toContain("Quicker relaunches before the spring contest");
    const stored = await db.select({ id: events.id }).from(events).where(eq(events.runId, seededRun.id));
    const exported = data.events.filter((e: { runId: string }) => e.runId === seededRun.id).map((e: { id: string }) => e.id);
    expect(exported.sort()).toEqual(stored.map((e) => e.id).sort());
  });

  it("includes the day-summary choice of each club and the runs the user put in club field days", async () => {
    const pilot = await freshUser("export-days");
    const [club] = await db.insert(clubs).values({ name: "Export Day Club", slug: `export-days-${pilot.id.slice(0, 8)}` }).returning();
    await db.insert(memberships).values({ clubId: club!.id, userId: pilot.id, role: "member", daySummaries: true });
    const [field] = await db.insert(clubFields).values({ clubId: club!.id, name: "Export Meadow" }).returning();
    const [day] = await db.insert(clubDays).values({ clubId: club!.id, fieldId: field!.id, day: "2026-06-14" }).returning();
    const runId = await insertRun(await insertSession(pilot.id), pilot.id, [{ pilotUserId: pilot.id, pilotName: pilot.name }]);
    await db.insert(clubDayRuns).values({ dayId: day!.id, runId, chosenBy: pilot.id });
    actAs(pilot);
    const data = await (await exportRoute()).json();
    expect(data.memberships).toEqual([expect.objectContaining({ club: "Export Day Club", daySummaries: true })]);
    expect(data.clubDayChoices).toEqual([expect.objectContaining({ runId, dayId: day!.id, club: "Export Day Club", field: "Export Meadow", day: "2026-06-14" })]);
    expect(data.clubDayDecisions).toEqual([]);
  });

  it("includes a run someone else timed with the user in a lane, and only the user's lane's events", async () => {
    const pilot = await freshUser("export-lane");
    const timer = await freshUser("export-timer");
    const runId = await insertRun(await insertSession(timer.id), timer.id, [
      { pilotUserId: timer.id, pilotName: timer.name },
      { pilotUserId: pilot.id, pilotName: pilot.name },
    ]);
    actAs(pilot);
    const data = JSON.parse(await (await exportRoute()).text());
    expect(data.runs.map((r: { id: string }) => r.id)).toEqual([runId]);
    expect(data.runs[0].lanes).toHaveLength(2);
    const kinds = data.events.map((e: { body: { kind: string; lane?: number } }) => `${e.body.kind}${e.body.lane ?? ""}`);
    expect(kinds.sort()).toEqual(["launch1", "window-start"]);
    expect(data.consentDecisions).toEqual([]); // pending: no decision yet
  });

  it("includes the user's consent decisions on lanes others recorded, with when and why", async () => {
    const pilot = await freshUser("export-consent");
    const timer = await freshUser("export-consent-timer");
    const lanes = [{ pilotUserId: timer.id, pilotName: timer.name }, { pilotUserId: pilot.id, pilotName: pilot.name }];
    const accepted = await insertRun(await insertSession(timer.id), timer.id, lanes);
    const disputed = await insertRun(await insertSession(timer.id), timer.id, lanes);
    actAs(pilot);
    expect((await decide(accepted, 1, { decision: "accepted" })).status).toBe(200);
    expect((await decide(disputed, 1, { decision: "disputed", reason: "I landed out, not on the spot" })).status).toBe(200);
    const data = JSON.parse(await (await exportRoute()).text());
    expect(data.consentDecisions).toEqual([
      { runId: accepted, lane: 1, decision: "accepted", reason: null, decidedAt: expect.stringMatching(/^\d{4}-\d{2}-\d{2}T/) },
      { runId: disputed, lane: 1, decision: "disputed", reason: "I landed out, not on the spot", decidedAt: expect.stringMatching(/^\d{4}-/) },
    ]);
    // the timer decided nothing
    actAs(timer);
    expect(JSON.parse(await (await exportRoute()).text()).consentDecisions).toEqual([]);
  });
});

describe("GET /api/account/export: the coach desk", () => {
  it("has the pilot's offers (address or code, never the code's hash) and the coach's notes and assigned plans", async () => {
    const mara = await demoUser("mara@example.com");
    const pilot = await freshUser("export-offers");
    const hash = createHash("sha256").update(pilot.id).digest("hex");
    await db.insert(coachInvites).values([
      { pilotId: pilot.id, email: "coach-offer@example.com", expiresAt: new Date(Date.now() + 3600_000) },
      { pilotId: pilot.id, codeHash: hash, expiresAt: new Date(Date.now() + 3600_000) },
    ]);
    actAs(pilot);
    const text = await (await exportRoute()).text();
    expect(text).not.toContain(hash);
    const mine = JSON.parse(text);
    expect(mine.coachOffers.map((o: { email: string | null; byCode: boolean }) => [o.email, o.byCode])).toEqual([["coach-offer@example.com", false], [null, true]]);
    actAs(mara);
    const coach = JSON.parse(await (await exportRoute()).text());
    expect(coach.coachNotes.some((n: { authorId: string }) => n.authorId === mara.id)).toBe(true);
    expect(coach.practicePlansAssigned.map((p: { title: string }) => p.title)).toContain("Quicker relaunches before the spring contest");
  });
});

describe("DELETE /api/account", () => {
  it("is 401 signed out, 422 without a password and 403 with a wrong one, deleting nothing", async () => {
    const pilot = await freshUser("del-refused", { passwordHash: await hashPassword(PASSWORD) });
    actAs(null);
    expect((await deleteAccount({ password: PASSWORD })).status).toBe(401);
    actAs(pilot);
    expect((await deleteAccount({})).status).toBe(422);
    const wrong = await deleteAccount({ password: "not-my-password" });
    expect(wrong.status).toBe(403);
    const [row] = await db.select().from(users).where(eq(users.id, pilot.id));
    expect(row).toMatchObject({ email: pilot.email, deletedAt: null, disabledAt: null });
  });

  it("removes the user's own records, keeps others' results under a neutral name, frees the e-mail and signs out", async () => {
    const pilot = await freshUser("del", { passwordHash: await hashPassword(PASSWORD) });
    const mate = await freshUser("del-mate");
    const coach = await freshUser("del-coach");
    await db.insert(coachGrants).values({ pilotId: pilot.id, coachId: coach.id });
    const own = await insertSession(pilot.id);
    const solo = await insertRun(own, pilot.id, [{ pilotUserId: pilot.id, pilotName: pilot.name }]);
    const withGuest = await insertRun(own, pilot.id, [{ pilotUserId: pilot.id, pilotName: pilot.name }, { pilotUserId: null, pilotName: "Guest" }]);
    const shared = await insertRun(own, pilot.id, [{ pilotUserId: pilot.id, pilotName: pilot.name }, { pilotUserId: mate.id, pilotName: mate.name }]);
    const matesRun = await insertRun(await insertSession(mate.id), mate.id, [
      { pilotUserId: mate.id, pilotName: mate.name },
      { pilotUserId: pilot.id, pilotName: pilot.name },
    ]);
    const [seqBefore] = await db.select({ s: runs.serverSeq }).from(runs).where(eq(runs.id, matesRun));
    actAs(pilot);
    expect((await deleteAccount({ password: PASSWORD })).status).toBe(200);

    expect((await clubMatesRoute()).status).toBe(401);
    const [row] = await db.select().from(users).where(eq(users.id, pilot.id));
    expect(row).toMatchObject({ name: "Deleted pilot", passwordHash: null, email: `deleted-${pilot.id}@deleted.invalid` });
    expect(row?.disabledAt).not.toBeNull();
    expect(row?.deletedAt).not.toBeNull();
    // gone: runs nobody else flies in (with their events); kept: the run the mate flies in, and the mate's own run
    const left = await db.select({ id: runs.id }).from(runs).where(inArray(runs.id, [solo, withGuest, shared, matesRun]));
    expect(left.map((r) => r.id).sort()).toEqual([shared, matesRun].sort());
    expect(await db.select().from(events).where(inArray(events.runId, [solo, withGuest]))).toEqual([]);
    expect(await db.select().from(fieldSessions).where(eq(fieldSessions.id, own))).toHaveLength(1);
    const lanes = await db.select().from(runLanes).where(inArray(runLanes.runId, [shared, matesRun]));
    const formerlyMine = lanes.filter((l) => l.pilotName === "Deleted pilot");
    expect(formerlyMine).toHaveLength(2);
    expect(formerlyMine.every((l) => l.pilotUserId === null && l.resultTenths !== null)).toBe(true);
    expect(lanes.filter((l) => l.pilotUserId === mate.id)).toHaveLength(2);
    expect(await db.select().from(coachGrants).where(eq(coachGrants.pilotId, pilot.id))).toEqual([]);
    expect(await db.select().from(memberships).where(eq(memberships.userId, pilot.id))).toEqual([]);
    // the mate's phone pulls the neutral name: the run changed
    const [seqAfter] = await db.select({ s: runs.serverSeq }).from(runs).where(eq(runs.id, matesRun));
    expect(seqAfter!.s).toBeGreaterThan(seqBefore!.s);
    // the address is free again
    const again = await signUpRoute(new Request("http://test/api/account/sign-up", json("POST", { name: "New Me", email: pilot.email, password: PASSWORD })));
    expect(again.status).toBe(201);
    const [fresh] = await db.select().from(users).where(eq(users.email, pilot.email));
    expect(fresh?.id).not.toBe(pilot.id);
  });
});
