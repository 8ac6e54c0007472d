import "./support/session";
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import { coachInvites, coachNotes, fieldSessions, mailQueue, practicePlans, runs } from "@/db/schema";
import { actAs, type MockSessionUser } from "./support/session";
import { db, freshUser, getPool } from "./support/db";
import { insertRun, insertSession } from "./support/records";
import { phonePenaltyContestOfOwnersClub, phonePenaltySetAside, setAsideBody } from "./support/phone-penalty";
import { accountRow, ACTORS, freshCast, MATRIX_PASSWORD, seededCast, type Actor, type Cast } from "./support/authz-actors";
import * as club from "./support/authz-clubs";
import * as contest from "./support/authz-contests";
import { discoverRouteHandlers, discoverServerActionFiles, type RouteHandler } from "./support/route-files";
import { insertLog, insertModel, insertOwnRun, LOG_MAPPING } from "./support/hangar-records";
import { offerModel } from "@/db/queries/model-offers";

/**
 * The authorisation matrix: every route handler on disk (app/api/**\/route.ts × exported method)
 * must have a row here, and each row is called in-process as each actor: signed out, the owner of
 * the records (Ada), another pilot (Tobi), a coach with the owner's grant (Mara), a coach without
 * one, an officer of another club, and a site admin. A new route without a row fails the first
 * test. Adding a row is one line: pick a shape below (signedIn, adminOnly, ownerOnly, ownAccount,
 * publicByDesign) and give it the request's body or query if it needs one.
 */

type Status = number | readonly number[];
type Ctx = { actor: Exclude<Actor, "signedOut">; user: MockSessionUser; cast: Cast };
type Protected = {
  expect: Record<Actor, Status>;
  /** "fresh": the row changes or deletes the caller's own account, so each actor is a fresh twin. */
  cast?: "seeded" | "fresh";
  query?: string;
  body?: (ctx: Ctx | null) => unknown;
  /** The route's path parameters, or a function making the records they name for this cast. */
  params?: Record<string, string | string[]> | ((cast: Cast) => Promise<Record<string, string>>);
  /** Checks on a 2xx reply beyond its status (what the actor got to see). */
  check?: (ctx: Ctx, res: Response) => Promise<void>;
};
type Row = Protected | { publicByDesign: string };

const NOT_ALLOWED = [403, 404] as const;
const everyone = (status: Status) => Object.fromEntries(ACTORS.map((a) => [a, status])) as Record<Actor, Status>;
const signedIn = (row: Omit<Protected, "expect"> = {}): Protected => ({ ...row, expect: { ...everyone(200), signedOut: 401 } });
const adminOnly = (row: Omit<Protected, "expect"> = {}): Protected => ({ ...row, expect: { ...everyone(NOT_ALLOWED), signedOut: 401, admin: 200 } });
const ownerOnly = (row: Omit<Protected, "expect"> = {}): Protected => ({ ...row, expect: { ...everyone(NOT_ALLOWED), signedOut: 401, owner: 200 } });
/** Routes that act on the caller's own account only (no id in the request): every signed-in actor gets 200 for itself. */
const ownAccount = (row: Omit<Protected, "expect" | "cast"> = {}): Protected => ({ ...signedIn(row), cast: "fresh" });
const publicByDesign = (reason: string): Row => ({ publicByDesign: reason });

/** Which actors find runs or events of the owner's seeded sessions in their first pull page (seeded first, so on it). */
const seesOwnersRuns = (who: Partial<Record<Actor, true>>) => async (ctx: Ctx, res: Response) => {
  const own = await db.select({ id: runs.id }).from(runs).innerJoin(fieldSessions, eq(fieldSessions.id, runs.sessionId))
    .where(and(eq(fieldSessions.ownerId, ctx.cast.owner.id), eq(fieldSessions.fieldName, "Five Acre Meadow")));
  const ids = new Set(own.map((r) => r.id));
  const body = (await res.json()) as { items: { type: string; data: { id: string; runId?: string } }[] };
  const sees = body.items.some((i) => (i.type === "run" && ids.has(i.data.id)) || (i.type === "event" && ids.has(i.data.runId ?? "")));
  expect({ actor: ctx.actor, seesOwnersRuns: sees }).toEqual({ actor: ctx.actor, seesOwnersRuns: !!who[ctx.actor] });
};

const exportsOwnAccountOnly = async (ctx: Ctx, res: Response) => {
  const data = (await res.json()) as { account: { id: string } };
  expect(data.account.id).toBe(ctx.user.id);
};

/** A run the other pilot recorded, flying lane 0 with the owner in lane 1; the owner's lane's path. */
async function recordedForOwner(cast: Cast): Promise<Record<string, string>> {
  const { owner, otherPilot } = cast;
  const lanes = [{ pilotUserId: otherPilot.id, pilotName: otherPilot.name }, { pilotUserId: owner.id, pilotName: owner.name }];
  return { runId: await insertRun(await insertSession(otherPilot.id), otherPilot.id, lanes), lane: "1" };
}

const decided = (status: string) => async (_ctx: Ctx, res: Response) => {
  expect(((await res.json()) as { consent: { status: string } }).consent).toMatchObject({ lane: 1, status });
};

const showsOwnAddress = async (ctx: Ctx, res: Response) => {
  const data = (await res.json()) as { email: string };
  expect(data.email).toBe(ctx.user.email);
};

// The hangar and altimeter logs: only the owner reaches a model, a run's logs or a log (404 for everyone else, admin included)
const ownersModel = async (cast: Cast) => ({ modelId: await insertModel(cast.owner.id) });
const ownersRun = async (cast: Cast) => ({ runId: await insertOwnRun(cast.owner.id) });
const ownerCreated = (body: () => unknown): Protected => ({ ...ownerOnly({ body }), expect: { ...everyone(NOT_ALLOWED), signedOut: 401, owner: 201 } });
const modelBody = () => ({ name: "Matrix glider", spanMm: 1490, massG: 255, marking: "white" });
const logRequest = () => ({ lane: 0, fileName: "log.csv", sizeBytes: 400, contentType: "text/csv", loggerName: "Matrix logger", mapping: LOG_MAPPING, startAtMs: 1_767_000_000_000 });
const hangarRows: Record<string, Row> = {
  "GET /api/models": signedIn(),
  "POST /api/models": { ...signedIn({ body: modelBody }), expect: { ...everyone(201), signedOut: 401 } },
  "GET /api/models/[modelId]": ownerOnly({ params: ownersModel }),
  "PATCH /api/models/[modelId]": ownerOnly({ params: ownersModel, body: () => ({ status: "being-repaired" }) }),
  "POST /api/models/[modelId]/repairs": { ...ownerCreated(() => ({ repairedOn: "2026-06-14", work: "new tail boom", massAfterG: 262 })), params: ownersModel },
  "POST /api/models/[modelId]/transfer": {
    ...ownerOnly({ params: ownersModel, body: () => ({ email: "tobi@example.com", withHistory: false }) }), expect: { ...everyone(NOT_ALLOWED), signedOut: 401, owner: 202 },
  },
  "DELETE /api/models/[modelId]/transfer": ownerOnly({
    params: async (cast) => {
      const modelId = await insertModel(cast.owner.id);
      await offerModel(db, { sellerId: cast.owner.id, modelId, email: "tobi@example.com", withHistory: false });
      return { modelId };
    },
  }),
  // an offer made to the owner's address by someone else: only the owner may answer it
  "POST /api/model-offers/[offerId]": ownerOnly({
    params: async (cast) => {
      const seller = await freshUser("matrix-seller");
      const offer = await offerModel(db, { sellerId: seller.id, modelId: await insertModel(seller.id), email: cast.owner.email.toLowerCase(), withHistory: false });
      return { offerId: offer!.id };
    },
    body: () => ({ answer: "decline" }),
  }),
  "GET /api/runs/[runId]/logs": ownerOnly({ params: ownersRun }),
  "POST /api/runs/[runId]/logs": { ...ownerCreated(logRequest), params: ownersRun },
  "POST /api/logs/[logId]/complete": ownerOnly({
    params: async (cast) => ({ logId: await insertLog(cast.owner.id, "pending") }),
    body: () => ({ loggerName: "Matrix logger", mapping: LOG_MAPPING, startAtMs: 1_767_000_000_000 }),
  }),
  "GET /api/logs/[logId]/download": ownerOnly({ params: async (cast) => ({ logId: await insertLog(cast.owner.id, "parsed") }) }),
  "GET /api/logger-mappings": signedIn(),
};
/** A season route of the owner's (path pilotId = the owner): the owner and the coach they grant read it, anyone else finds nothing (404). */
const ownSeason = (query: string): Protected => ({
  ...ownerOnly({ query, params: async (cast) => ({ pilotId: cast.owner.id }) }),
  expect: { ...everyone(404), signedOut: 401, owner: 200, coachWithGrant: 200 },
});

/** The coach's roster names the owner for the coach the owner grants, and for nobody else. */
const rosterNamesOwner = async (ctx: Ctx, res: Response) => {
  const { pilots } = (await res.json()) as { pilots: { pilotId: string }[] };
  const named = pilots.some((p) => p.pilotId === ctx.cast.owner.id);
  expect({ actor: ctx.actor, named }).toEqual({ actor: ctx.actor, named: ctx.actor === "coachWithGrant" });
};
/** An open offer of the owner's, by code, for the revoke row. */
const ownersOffer = async (cast: Cast) => {
  const [row] = await db.insert(coachInvites).values({ pilotId: cast.owner.id, codeHash: randomUUID(), expiresAt: new Date(Date.now() + 3600_000) }).returning();
  return { grantId: row!.id };
};

/** A run of the seeded owner's own (filled in beforeAll): coach notes name it. */
let ownersRunId = "";
let ownersSessionId = "";
const noteBody = (ctx: Ctx | null) => ({ pilotId: (ctx?.cast ?? seeded).owner.id, runId: ownersRunId, body: "Matrix note: watch the second launch." });
/** A thread the granted coach started on the owner's run: the owner and that coach may answer, nobody else. */
const coachesNote = async (cast: Cast) => {
  const [row] = await db.insert(coachNotes).values({
    sessionId: ownersSessionId, runId: ownersRunId, pilotId: cast.owner.id, coachId: cast.coachWithGrant.id, authorId: cast.coachWithGrant.id, body: "Matrix thread",
  }).returning({ id: coachNotes.id });
  return { noteId: row!.id };
};
/** The coach's plans name the owner only for the coach the owner grants (the seed assigns Ada a plan from Mara). */
const plansNameOwner = async (ctx: Ctx, res: Response) => {
  const { plans } = (await res.json()) as { plans: { pilotId: string }[] };
  const named = plans.some((p) => p.pilotId === ctx.cast.owner.id);
  expect({ actor: ctx.actor, named }).toEqual({ actor: ctx.actor, named: ctx.actor === "coachWithGrant" });
};
const planBody = (ctx: Ctx | null) => ({
  pilotId: (ctx?.cast ?? seeded).owner.id, title: "Matrix plan",
  items: [{ letter: "H", variant: 600, goal: "three 1-2-3-4 windows", windows: 3, measure: { kind: "median-turnaround-below", seconds: 3 } }],
});
/** A plan the granted coach assigned the owner: only that coach may change it (PATCH), nobody else, the owner included. */
const coachesPlan = async (cast: Cast) => {
  const [row] = await db.insert(practicePlans).values({ pilotId: cast.owner.id, coachId: cast.coachWithGrant.id, title: "Matrix plan", items: planBody(null).items }).returning({ id: practicePlans.id });
  return { planId: row!.id };
};
const coachOnly = (status: number): Record<Actor, Status> => ({ ...everyone(404), signedOut: 401, coachWithGrant: status });

const listsUsers = async (_ctx: Ctx, res: Response) => {
  const data = (await res.json()) as { users: { email: string }[]; total: number };
  expect(data.users.length).toBeGreaterThan(0);
  expect(data.users.every((u) => u.email.includes("example"))).toBe(true);
};

async function freshTarget(): Promise<Record<string, string>> {
  return { userId: (await freshUser("matrix-target")).id };
}

const disablesTarget = async (_ctx: Ctx, res: Response) => {
  const data = (await res.json()) as { user: { id: string; disabledAt: string | null }; changed: boolean };
  expect(data.changed).toBe(true);
  expect((await accountRow(data.user.id))?.disabledAt).not.toBeNull();
};

/** A message the drain gave up on (no next try), addressed to nobody real. */
async function failedMail(): Promise<Record<string, string>> {
  const [row] = await db
    .insert(mailQueue)
    .values({ to: `matrix-${randomUUID()}@example.com`, subject: "Matrix", text: "t", html: "<p>t</p>", kind: "test", attempts: 14, nextAttemptAt: null, lastError: "refused" })
    .returning({ id: mailQueue.id });
  return { mailId: row!.id };
}

const ROWS: Record<string, Row> = {
  ...hangarRows,
  "GET /api/health": publicByDesign("a liveness probe for the process manager: says only whether the app reaches its database"),
  "POST /api/account/sign-up": publicByDesign("creating an account needs no account; the answer is the same for a taken address"),
  "GET /api/auth/[...nextauth]": publicByDesign("next-auth's own endpoints (csrf, providers, session — {} when signed out)"),
  "POST /api/auth/[...nextauth]": publicByDesign("next-auth's own sign-in and sign-out, guarded by its CSRF token"),
  "GET /api/admin/users": adminOnly({ query: "?q=example&page=1", check: listsUsers }),
  // a fresh account per row: only the admin (last in ACTORS) disables it; everyone before changes nothing
  "PATCH /api/admin/users/[userId]": adminOnly({ params: freshTarget, body: () => ({ action: "disable" }), check: disablesTarget }),
  "POST /api/admin/mail/[mailId]/retry": {
    ...adminOnly({ params: failedMail, body: () => ({}) }),
    expect: { ...everyone(NOT_ALLOWED), signedOut: 401, admin: 202 },
  },
  "GET /api/club-mates": signedIn(),
  "POST /api/time": signedIn({ body: () => ({ t1: 1 }) }),
  "GET /api/sync/pull": signedIn({ query: "?cursor=0", check: seesOwnersRuns({ owner: true, coachWithGrant: true }) }),
  "POST /api/sync/push": ownerOnly({ body: () => ({ deviceId: "demo-phone-ada", sessions: [], runs: [], events: [] }) }),
  "GET /api/account/export": signedIn({ check: exportsOwnAccountOnly }),
  // a run the other pilot recorded with the owner in lane 1: only the owner may decide on it (404 for
  // everyone else, admin included: the decision is the pilot's alone); fresh cast, the demo records stay
  "POST /api/runs/[runId]/lanes/[lane]/consent": {
    ...ownerOnly({ params: recordedForOwner, body: () => ({ decision: "accepted" }), check: decided("accepted") }),
    cast: "fresh",
    expect: { ...everyone(404), signedOut: 401, owner: 200 },
  },
  // a pilot's season: the pilot and a coach holding their unrevoked grant (db/queries/season/access.ts); everyone else, admin included, 404
  "GET /api/pilots/[pilotId]/season": ownSeason(""),
  "GET /api/pilots/[pilotId]/season/runs": ownSeason("?sort=result&dir=asc&size=10"),
  "GET /api/pilots/[pilotId]/season/flights": ownSeason("?task=H&size=10"),
  "GET /api/pilots/[pilotId]/season/export": ownSeason("?what=runs"),
  // the coach desk: grants are the signed-in pilot's own (no id but the grant's); a coach's roster lists only who grants them
  "GET /api/coach-grants": signedIn(),
  "POST /api/coach-grants": { ...signedIn({ body: () => ({ kind: "code" }) }), expect: { ...everyone(201), signedOut: 401 } },
  "DELETE /api/coach-grants/[grantId]": { ...ownerOnly({ params: ownersOffer }), cast: "fresh", expect: { ...everyone(404), signedOut: 401, owner: 204 } },
  "POST /api/coach/claim": { ...signedIn({ body: () => ({ code: "ZZZZ-ZZZZ" }) }), expect: { ...everyone(404), signedOut: 401 } },
  "GET /api/coach/pilots": signedIn({ check: rosterNamesOwner }),
  // notes: only a coach holding the pilot's grant writes one on the pilot's run; the thread's pilot and coach answer; everyone else 404
  "POST /api/notes": { body: noteBody, expect: coachOnly(201) },
  "POST /api/notes/[noteId]/replies": { params: coachesNote, body: () => ({ body: "Matrix answer" }), expect: { ...coachOnly(201), owner: 201 } },
  // practice plans: a coach lists only their own plans for pilots who still grant them, and assigns only to such a pilot
  "GET /api/coach/plans": signedIn({ check: plansNameOwner }),
  "POST /api/coach/plans": { body: planBody, expect: coachOnly(201) },
  "PATCH /api/coach/plans/[planId]": { params: coachesPlan, body: () => ({ closed: true }), expect: coachOnly(200) },
  "POST /api/account/password": ownAccount({ body: () => ({ currentPassword: MATRIX_PASSWORD, newPassword: "matrix-window-2027" }) }),
  "POST /api/account/sign-out-everywhere": ownAccount({ body: () => ({}) }),
  "DELETE /api/account": ownAccount({ body: () => ({ password: MATRIX_PASSWORD }) }),
  "POST /api/account/verify-email": publicByDesign("the one-time token in the mailed link is the credential; opened wherever the mail is read"),
  "POST /api/account/email/confirm": publicByDesign("the one-time token mailed to the new address is the credential"),
  "POST /api/account/forgot-password": publicByDesign("whoever forgot their password cannot sign in; the answer is the same for any address"),
  "POST /api/account/reset-password": publicByDesign("the one-time token mailed to the account's address is the credential"),
  "GET /api/account/email": signedIn({ check: showsOwnAddress }),
  "POST /api/account/verification": ownAccount({ body: () => ({}) }),
  "POST /api/account/email": {
    ...ownAccount({ body: () => ({ newEmail: `matrix-new-${randomUUID()}@example.com`, currentPassword: MATRIX_PASSWORD }) }),
    expect: { ...everyone(202), signedOut: 401 },
  },
  // Clubs (issue #14): a fresh cast, whose owner is the officer of a club made for the row (support/authz-clubs.ts)
  "POST /api/clubs": { ...signedIn({ body: () => ({ name: "Matrix Created Club" }) }), cast: "fresh", expect: { ...everyone(201), signedOut: 401 } },
  "POST /api/clubs/[slug]/invitations": {
    params: async (cast) => ({ slug: (await club.ownersClub(cast)).slug }),
    body: () => ({ email: `matrix-invitee-${randomUUID()}@example.com`, role: "coach" }),
    cast: "fresh",
    expect: club.OFFICERS_ONLY(202),
  },
  "DELETE /api/clubs/[slug]/invitations/[invitationId]": { params: club.invitationOfOwnersClub, check: club.invitationReturns, cast: "fresh", expect: club.OFFICERS_ONLY(200) },
  "PATCH /api/clubs/[slug]/members/[userId]": { params: club.memberOfOwnersClub, body: () => ({ role: "coach" }), cast: "fresh", expect: club.OFFICERS_ONLY(200) },
  "DELETE /api/clubs/[slug]/members/[userId]": { params: club.memberOfOwnersClub, check: club.rejoins, cast: "fresh", expect: club.OFFICERS_ONLY(200) },
  "POST /api/clubs/[slug]/fields": {
    params: async (cast) => ({ slug: (await club.ownersClub(cast)).slug }),
    body: () => ({ name: `Matrix Field ${randomUUID().slice(0, 8)}`, localRules: "Land west of the hedge" }),
    cast: "fresh",
    expect: club.OFFICERS_ONLY(201),
  },
  "POST /api/clubs/[slug]/days": { params: club.fieldForDays, body: club.nextDayBody, cast: "fresh", expect: club.OFFICERS_ONLY(201) },
  // the Day board: members of the club (and site admins) read it; officers close the day
  "GET /api/clubs/[slug]/days/[date]": { params: club.dayOfOwnersClub, cast: "fresh", expect: contest.MEMBERS(200) },
  "POST /api/clubs/[slug]/days/[date]/close": { params: club.dayOfOwnersClub, cast: "fresh", expect: club.OFFICERS_ONLY(200) },
  "PUT /api/clubs/[slug]/days/[date]/decisions": { params: club.dayWithDifference, body: club.decisionBody, cast: "fresh", expect: club.OFFICERS_ONLY(200) },
  "PUT /api/clubs/[slug]/time-zone": {
    params: async (cast) => ({ slug: (await club.ownersClub(cast)).slug }), body: () => ({ timeZone: "Europe/Berlin" }), cast: "fresh", expect: club.OFFICERS_ONLY(200),
  },
  // a member's own setting: a site admin outside the club has none (404)
  "PUT /api/clubs/[slug]/day-summaries": {
    params: async (cast) => ({ slug: (await club.ownersClub(cast)).slug }), body: () => ({ on: true }), cast: "fresh",
    expect: { ...contest.MEMBERS(200), admin: 404 },
  },
  // a pilot chooses a field day for their own run: others are offered nothing and cannot choose
  "GET /api/runs/[runId]/club-days": {
    ...signedIn({ params: (cast) => club.runAndDayOfOwner(cast, () => insertOwnRun(cast.owner.id)), check: (ctx, res) => club.offersDayToOwnerOnly(ctx.actor, res) }),
    cast: "fresh",
  },
  // club days' decisions on a run's lanes: any signed-in account may ask; the list holds only what it may see
  // (tests/integration/run-day-decisions.test.ts); here no decision exists, so every answer is empty
  "GET /api/runs/[runId]/day-decisions": {
    ...signedIn({ params: async (cast) => ({ runId: await insertOwnRun(cast.owner.id) }), check: club.noDayDecisions }), cast: "fresh",
  },
  "PUT /api/runs/[runId]/club-days": {
    ...ownerOnly({ params: (cast) => club.runAndDayOfOwner(cast, () => insertOwnRun(cast.owner.id)), body: club.choiceBody }), cast: "fresh",
  },
  "DELETE /api/clubs/[slug]/fields/[fieldId]": { params: club.fieldOfOwnersClub, check: club.fieldReturns, cast: "fresh", expect: club.OFFICERS_ONLY(200) },
  // the one-time token is the credential: every signed-in account with its own link joins (and each link joins once)
  "POST /api/invitations/accept": {
    ...signedIn({ params: club.invitationsForEveryone, body: (ctx) => club.tokenFor(ctx?.actor), check: (ctx) => club.joinedOnce(ctx.actor, ctx.user.id) }),
    cast: "fresh",
  },
  // Contests (issue 15): a contest of the owner's club; officer routes check the club role on the server
  "POST /api/clubs/[slug]/contests": {
    params: async (cast) => ({ slug: (await club.ownersClub(cast)).slug }),
    body: () => ({ name: "Matrix Cup", startsOn: "2027-02-06", fieldName: "Matrix Meadow", rounds: ["A", "B", "D", "F", "G"].map((letter) => ({ letter })), maxGroupSize: 10, prepMinutes: 5, noFlySeconds: 60, dropRule: "f3k", practice: false }),
    cast: "fresh",
    expect: club.OFFICERS_ONLY(201),
  },
  "POST /api/contests/[contestId]/entries": { params: (cast) => contest.contestOfOwnersClub(cast), body: () => ({ modelIds: [] }), cast: "fresh", expect: contest.MEMBERS(201) },
  "POST /api/contests/[contestId]/paper-entries": { params: (cast) => contest.contestOfOwnersClub(cast), body: () => ({ pilotName: "Matrix Paper" }), cast: "fresh", expect: club.OFFICERS_ONLY(201) },
  "PATCH /api/contests/[contestId]/entries/[entryId]": {
    params: (cast) => contest.contestOfOwnersClub(cast), body: () => ({ team: "Updraft", pilotClass: "junior" }), check: contest.entryChanged, cast: "fresh", expect: club.OFFICERS_ONLY(200),
  },
  "DELETE /api/contests/[contestId]/entries/[entryId]": { params: (cast) => contest.contestOfOwnersClub(cast), check: contest.entryReturns, cast: "fresh", expect: club.OFFICERS_ONLY(200) },
  "POST /api/contests/[contestId]/draw": { params: (cast) => contest.contestOfOwnersClub(cast), body: () => ({ seed: 7 }), cast: "fresh", expect: club.OFFICERS_ONLY(201) },
  "POST /api/contests/[contestId]/draw/swap": { params: contest.drawnContestOfOwnersClub, body: contest.swapBody, cast: "fresh", expect: club.OFFICERS_ONLY(200) },
  "POST /api/contests/[contestId]/draw/redraw": { params: contest.drawnContestOfOwnersClub, body: () => ({ fromRound: 2, seed: 5 }), cast: "fresh", expect: club.OFFICERS_ONLY(201) },
  "POST /api/contests/[contestId]/draw/fly-off": { params: contest.flyOffContestOfOwnersClub, body: () => ({}), check: contest.flyOffDrawn, cast: "fresh", expect: club.OFFICERS_ONLY(201) },
  "POST /api/contests/[contestId]/draw/lock": { params: (cast) => contest.contestOfOwnersClub(cast, true), cast: "fresh", expect: club.OFFICERS_ONLY(200) },
  "GET /api/contests/[contestId]/results": { params: (cast) => contest.contestOfOwnersClub(cast, true), check: contest.showsStandings, expect: contest.MEMBERS(200) },
  "PUT /api/contests/[contestId]/rounds/[roundNumber]/cards": {
    params: async (cast) => ({ ...(await contest.contestOfOwnersClub(cast, true)), roundNumber: "1" }), body: contest.cardsBody, check: contest.cardsSaved, cast: "fresh", expect: club.OFFICERS_ONLY(200),
  },
  "PUT /api/contests/[contestId]/rounds/[roundNumber]/runs": {
    params: async (cast) => ({ ...(await contest.contestOfOwnersClub(cast, true)), roundNumber: "1" }), body: contest.unlinkBody, cast: "fresh", expect: club.OFFICERS_ONLY(200),
  },
  "PUT /api/contests/[contestId]/rounds/[roundNumber]/timekeepers": {
    params: async (cast) => ({ ...(await contest.contestOfOwnersClub(cast, true)), roundNumber: "1" }), body: contest.timekeepersBody, check: contest.timekeeperSaved, cast: "fresh", expect: club.OFFICERS_ONLY(200),
  },
  "POST /api/contests/[contestId]/rounds/[roundNumber]/reflights": {
    params: async (cast) => ({ ...(await contest.contestOfOwnersClub(cast, true)), roundNumber: "1" }), body: contest.grantReflightBody, check: contest.reflightGranted, cast: "fresh", expect: club.OFFICERS_ONLY(201),
  },
  "PUT /api/contests/[contestId]/rounds/[roundNumber]/reflights": {
    params: contest.reflightContestOfOwnersClub, body: contest.recordReflightBody, check: contest.reflightRecorded, cast: "fresh", expect: club.OFFICERS_ONLY(200),
  },
  "PUT /api/contests/[contestId]/rounds/[roundNumber]/reflights/timekeeper": {
    params: contest.reflightContestOfOwnersClub, body: contest.reflightTimekeeperBody, check: contest.reflightTimekeeperSaved, cast: "fresh", expect: club.OFFICERS_ONLY(200),
  },
  "PUT /api/contests/[contestId]/rounds/[roundNumber]/reflight-requests": {
    params: contest.reflightRequestOfOwnersClub, body: contest.dismissRequestBody, check: contest.requestDismissed, cast: "fresh", expect: club.OFFICERS_ONLY(200),
  },
  "POST /api/contests/[contestId]/rounds/[roundNumber]/disputes": {
    params: async (cast) => ({ ...(await contest.contestOfOwnersClub(cast, true)), roundNumber: "1" }), body: contest.lodgeDisputeBody, check: contest.disputeLodged, cast: "fresh", expect: club.OFFICERS_ONLY(201),
  },
  "PUT /api/contests/[contestId]/rounds/[roundNumber]/disputes": {
    params: contest.disputeContestOfOwnersClub, body: contest.resolveDisputeBody, check: contest.disputeResolved, cast: "fresh", expect: club.OFFICERS_ONLY(200),
  },
  "POST /api/contests/[contestId]/rounds/[roundNumber]/penalties": {
    params: async (cast) => ({ ...(await contest.contestOfOwnersClub(cast, true)), roundNumber: "1" }), body: contest.givePenaltyBody, check: contest.penaltyGiven, cast: "fresh", expect: club.OFFICERS_ONLY(201),
  },
  "DELETE /api/contests/[contestId]/rounds/[roundNumber]/penalties": {
    params: contest.penaltyContestOfOwnersClub, body: contest.removePenaltyBody, check: contest.penaltyRemoved, cast: "fresh", expect: club.OFFICERS_ONLY(200),
  },
  "POST /api/contests/[contestId]/rounds/[roundNumber]/penalties/phone-set-aside": {
    params: phonePenaltyContestOfOwnersClub, body: setAsideBody, check: phonePenaltySetAside, cast: "fresh", expect: club.OFFICERS_ONLY(201),
  },
  "PUT /api/contests/[contestId]/rounds/[roundNumber]/records": {
    params: contest.recordsContestOfOwnersClub, body: contest.keepRecordBody, check: contest.recordDecided, cast: "fresh", expect: club.OFFICERS_ONLY(200),
  },
  "PUT /api/contests/[contestId]/rounds/[roundNumber]/reflights/records": {
    params: contest.reflightRecordsContestOfOwnersClub, body: contest.keepRecordBody, check: contest.reflightRecordDecided, cast: "fresh", expect: club.OFFICERS_ONLY(200),
  },
  "POST /api/contests/[contestId]/public-link": { params: (cast) => contest.contestOfOwnersClub(cast), check: contest.linkMade, cast: "fresh", expect: club.OFFICERS_ONLY(201) },
  "DELETE /api/contests/[contestId]/public-link": { params: (cast) => contest.contestOfOwnersClub(cast, true, true), check: contest.linkRevoked, cast: "fresh", expect: club.OFFICERS_ONLY(200) },
  "GET /api/public-results/[token]": publicByDesign("the officer's unguessable results link (32 random bytes) publishes the standings without an account; revoked → 404 (tests/integration/contest-results.test.ts)"),
  // Entry fees (issue 15): the entry's own pilot pays (a Checkout session at the local fake); the officer marks cash
  "POST /api/contests/[contestId]/entries/[entryId]/checkout": { params: (cast) => contest.feeContestOfOwnersClub(cast), cast: "fresh", expect: contest.OWN_ENTRY(201) },
  "POST /api/contests/[contestId]/entries/[entryId]/cash": { params: (cast) => contest.feeContestOfOwnersClub(cast), check: contest.cashReturns, cast: "fresh", expect: club.OFFICERS_ONLY(200) },
  "POST /api/payments/webhook": publicByDesign("the payments service's events: the signature (STRIPE_WEBHOOK_SECRET) is the credential; a missing or bad one is a 400 (payments-webhook.test.ts)"),
  "GET /api/club-fields": signedIn({ check: (ctx, res) => club.onlyOwnClubsFields(ctx.user.id, res) }),
};

/** Files declaring server actions, each with the test that checks its authorisation (none exist yet). */
const SERVER_ACTIONS: Record<string, string> = {};

let handlers: RouteHandler[] = [];
let seeded: Cast;

beforeAll(async () => {
  handlers = await discoverRouteHandlers();
  seeded = await seededCast();
  const [own] = await db.select({ id: runs.id, sessionId: runs.sessionId }).from(runs).where(eq(runs.createdBy, seeded.owner.id)).limit(1);
  ownersRunId = own!.id;
  ownersSessionId = own!.sessionId;
});

afterAll(async () => {
  actAs(null);
  await getPool().end();
});

function request(handler: RouteHandler, row: Protected, ctx: Ctx | null): Request {
  const init: RequestInit = { method: handler.method, headers: { "content-type": "application/json" } };
  if (row.body) init.body = JSON.stringify(row.body(ctx));
  return new Request(`http://test${handler.path}${row.query ?? ""}`, init);
}

const matches = (status: number, expected: Status) => (typeof expected === "number" ? status === expected : expected.includes(status));

describe("authorisation matrix", () => {
  it("has a row for every route handler on disk and none for a handler that is gone", () => {
    const keys = handlers.map((h) => h.key);
    expect(keys.filter((k) => !(k in ROWS)), "route handlers without a row").toEqual([]);
    expect(Object.keys(ROWS).filter((k) => !keys.includes(k)), "rows without a route handler").toEqual([]);
  });

  it("has a row for every file of server actions", () => {
    expect(discoverServerActionFiles().filter((f) => !(f in SERVER_ACTIONS))).toEqual([]);
  });

  const protectedRows = Object.entries(ROWS).filter((e): e is [string, Protected] => !("publicByDesign" in e[1]));
  it.each(protectedRows)("%s answers each actor as designed", async (key, row) => {
    const handler = handlers.find((h) => h.key === key);
    expect(handler, `no handler for ${key}`).toBeDefined();
    const cast = row.cast === "fresh" ? await freshCast() : seeded;
    const params = typeof row.params === "function" ? await row.params(cast) : (row.params ?? {});
    const context = { params: Promise.resolve(params) };
    const actual: Partial<Record<Actor, number>> = {};
    const expected: Partial<Record<Actor, Status>> = {};
    for (const actor of ACTORS) {
      const user = actor === "signedOut" ? null : cast[actor];
      const ctx = actor === "signedOut" || !user ? null : { actor, user, cast };
      actAs(user);
      const res = await handler!.handler(request(handler!, row, ctx), context);
      actual[actor] = res.status;
      expected[actor] = matches(res.status, row.expect[actor]) ? res.status : row.expect[actor];
      if (ctx && row.check && res.status < 300) await row.check(ctx, res);
    }
    expect(actual).toEqual(expected);
  });
});
