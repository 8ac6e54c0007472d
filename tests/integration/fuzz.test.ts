import "./support/session";
import fc from "fast-check";
import { readdirSync } from "node:fs";
import { join, relative, sep } from "node:path";
import { eq } from "drizzle-orm";
import { v7 as uuidv7 } from "uuid";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { clubs, contestDisputes, contestEntries, contestRounds, contests, groupSlots, memberships, models, users } from "@/db/schema";
import { BODY_LIMIT } from "@/lib/api";
import { getCatalogueTask } from "@/lib/tasks";
import { actAs } from "./support/session";
import { webhookRequest } from "./support/payments";
import { db, getPool } from "./support/db";
import { replaced } from "./support/json-paths";
import { rowCounter } from "./support/row-counts";

/**
 * Issue #9: arbitrary and oversized input to EVERY route handler under app/api — random JSON,
 * huge strings, NUL characters, huge, negative and fractional numbers, deep nesting, wrong
 * content types, and valid bodies with one field replaced by such a value. Never a 5xx, and a
 * 4xx writes nothing (exact row counts of every table, and the sync sequence, before and after).
 *
 * The routes come from the file system: a route (or a method) this file does not know how to
 * drive fails the test, so a new route must be added to ROUTES below.
 */

afterAll(async () => {
  await getPool().end();
});

type Input = "json" | "query" | "none" | { skip: string };
const ROUTES: Record<string, Partial<Record<"GET" | "POST" | "PUT" | "PATCH" | "DELETE", Input>>> = {
  "/api/account": { DELETE: "json" },
  "/api/account/export": { GET: "none" },
  "/api/account/password": { POST: "json" },
  "/api/account/sign-out-everywhere": { POST: "json" },
  "/api/account/sign-up": { POST: "json" },
  "/api/account/email": { GET: "none", POST: "json" },
  "/api/account/email/confirm": { POST: "json" },
  "/api/account/forgot-password": { POST: "json" },
  "/api/account/reset-password": { POST: "json" },
  "/api/account/verification": { POST: "json" },
  "/api/account/verify-email": { POST: "json" },
  "/api/admin/mail/[mailId]/retry": { POST: "json" },
  "/api/admin/users": { GET: "query" },
  "/api/admin/users/[userId]": { PATCH: "json" },
  "/api/auth/[...nextauth]": {
    GET: { skip: "next-auth reads cookies() from a request scope: driven over HTTP in tests/e2e/signed-out-requests.spec.ts" },
    POST: { skip: "next-auth reads cookies() from a request scope: driven over HTTP in tests/e2e/signed-out-requests.spec.ts" },
  },
  "/api/club-mates": { GET: "none" },
  "/api/club-fields": { GET: "none" },
  "/api/clubs": { POST: "json" },
  "/api/clubs/[slug]/invitations": { POST: "json" },
  "/api/clubs/[slug]/invitations/[invitationId]": { DELETE: "none" },
  "/api/clubs/[slug]/members/[userId]": { PATCH: "json", DELETE: "none" },
  "/api/clubs/[slug]/fields": { POST: "json" },
  "/api/clubs/[slug]/days": { POST: "json" },
  "/api/clubs/[slug]/days/[date]": { GET: "none" },
  "/api/clubs/[slug]/days/[date]/close": { POST: "none" },
  "/api/clubs/[slug]/days/[date]/decisions": { PUT: "json" },
  "/api/clubs/[slug]/time-zone": { PUT: "json" },
  "/api/clubs/[slug]/day-summaries": { PUT: "json" },
  "/api/runs/[runId]/club-days": { GET: "none", PUT: "json" },
  "/api/runs/[runId]/day-decisions": { GET: "none" },
  "/api/clubs/[slug]/fields/[fieldId]": { DELETE: "none" },
  "/api/clubs/[slug]/contests": { POST: "json" },
  "/api/contests/[contestId]/entries": { POST: "json" },
  "/api/contests/[contestId]/entries/[entryId]": { DELETE: "none", PATCH: "json" },
  "/api/contests/[contestId]/entries/[entryId]/checkout": { POST: "none" },
  "/api/contests/[contestId]/entries/[entryId]/cash": { POST: "none" },
  "/api/payments/webhook": { POST: "json" },
  "/api/contests/[contestId]/paper-entries": { POST: "json" },
  "/api/contests/[contestId]/draw": { POST: "json" },
  "/api/contests/[contestId]/draw/lock": { POST: "none" },
  "/api/contests/[contestId]/draw/fly-off": { POST: "json" },
  "/api/contests/[contestId]/draw/swap": { POST: "json" },
  "/api/contests/[contestId]/draw/redraw": { POST: "json" },
  "/api/contests/[contestId]/results": { GET: "query" },
  "/api/contests/[contestId]/rounds/[roundNumber]/cards": { PUT: "json" },
  "/api/contests/[contestId]/rounds/[roundNumber]/runs": { PUT: "json" },
  "/api/contests/[contestId]/rounds/[roundNumber]/timekeepers": { PUT: "json" },
  "/api/contests/[contestId]/rounds/[roundNumber]/reflights": { POST: "json", PUT: "json" },
  "/api/contests/[contestId]/rounds/[roundNumber]/reflights/timekeeper": { PUT: "json" },
  "/api/contests/[contestId]/rounds/[roundNumber]/reflights/records": { PUT: "json" },
  "/api/contests/[contestId]/rounds/[roundNumber]/reflight-requests": { PUT: "json" },
  "/api/contests/[contestId]/rounds/[roundNumber]/records": { PUT: "json" },
  "/api/contests/[contestId]/rounds/[roundNumber]/disputes": { POST: "json", PUT: "json" },
  "/api/contests/[contestId]/rounds/[roundNumber]/penalties": { POST: "json", DELETE: "json" },
  "/api/contests/[contestId]/rounds/[roundNumber]/penalties/phone-set-aside": { POST: "json" },
  "/api/contests/[contestId]/public-link": { POST: "none", DELETE: "none" },
  "/api/public-results/[token]": { GET: "query" },
  "/api/invitations/accept": { POST: "json" },
  "/api/runs/[runId]/lanes/[lane]/consent": { POST: "json" },
  "/api/health": { GET: "none" },
  "/api/sync/pull": { GET: "query" },
  "/api/sync/push": { POST: "json" },
  "/api/time": { POST: "json" },
  "/api/models": { GET: "none", POST: "json" },
  "/api/models/[modelId]": { GET: "none", PATCH: "json" },
  "/api/models/[modelId]/repairs": { POST: "json" },
  "/api/models/[modelId]/transfer": { POST: "json", DELETE: "none" },
  "/api/model-offers/[offerId]": { POST: "json" },
  "/api/runs/[runId]/logs": { GET: "none", POST: "json" },
  "/api/logs/[logId]/complete": { POST: "json" },
  "/api/logs/[logId]/download": { GET: "none" },
  "/api/logger-mappings": { GET: "none" },
  "/api/pilots/[pilotId]/season": { GET: "query" },
  "/api/pilots/[pilotId]/season/runs": { GET: "query" },
  "/api/pilots/[pilotId]/season/flights": { GET: "query" },
  "/api/pilots/[pilotId]/season/export": { GET: "query" },
  "/api/coach-grants": { GET: "none", POST: "json" },
  "/api/coach-grants/[grantId]": { DELETE: "none" },
  "/api/coach/claim": { POST: "json" },
  "/api/coach/pilots": { GET: "none" },
  "/api/coach/plans": { GET: "none", POST: "json" },
  "/api/coach/plans/[planId]": { PATCH: "json" },
  "/api/notes": { POST: "json" },
  "/api/notes/[noteId]/replies": { POST: "json" },
};
const METHODS = ["GET", "POST", "PUT", "PATCH", "DELETE"] as const;
type Method = (typeof METHODS)[number];
type Handler = (request: Request, context?: unknown) => Promise<Response>;

/** Every app/api/**\/route.ts with the methods it exports. */
async function discoverRoutes(): Promise<{ path: string; handlers: Partial<Record<Method, Handler>> }[]> {
  const root = join(process.cwd(), "app");
  const files = (readdirSync(join(root, "api"), { recursive: true }) as string[]).filter((f) => f.endsWith(`${sep}route.ts`) || f === "route.ts");
  const out = [];
  for (const file of files) {
    const abs = join(root, "api", file);
    const path = "/" + relative(root, abs).split(sep).slice(0, -1).join("/");
    const mod = (await import(abs)) as Partial<Record<Method, Handler>>;
    const handlers: Partial<Record<Method, Handler>> = {};
    for (const m of METHODS) if (typeof mod[m] === "function") handlers[m] = mod[m];
    out.push({ path, handlers });
  }
  return out.sort((a, b) => a.path.localeCompare(b.path));
}

/** Row counts of every table (support/row-counts.ts): a 4xx must leave them as they were. */
let countAll: () => Promise<string>;
beforeAll(async () => {
  countAll = await rowCounter();
});

const EVIL: unknown[] = [
  "\u0000", "a\u0000b", "\ud800", "x".repeat(5000), "", " ", "<script>", "../../etc", "💥".repeat(50),
  2 ** 31, 2 ** 53, -1, -(2 ** 31) - 1, 0.5, 1e308, -1e308, Number.MAX_VALUE, 253_402_300_799_999, 253_402_300_800_000, 8.64e15, -8.7e15,
  null, true, [], {}, [[[[[[[[[[]]]]]]]]]], { __proto__: { admin: true } }, { constructor: "x" },
];
const evilValue = fc.oneof(
  { weight: 4, arbitrary: fc.constantFrom(...EVIL) },
  { weight: 1, arbitrary: fc.jsonValue({ maxDepth: 3 }) },
  { weight: 1, arbitrary: fc.string({ unit: "binary", maxLength: 40 }) },
);

/**
 * Real rows of the fuzz user's own (its club's contest, its model): with them a valid body gets past the
 * "no such contest / entry / model" 404 and reaches the writes, so a NUL or an oversized value in a string
 * meets the database (a NUL in a re-flight's reason once answered 500 there).
 */
type Real = { contestId: string; entries: string[]; disputeId: string; modelId: string };

/** A valid body for each JSON route, for `userId`: fresh ids nobody has, or with `real` the fuzz user's own rows. */
function template(path: string, userId: string, real: Real | null = null): Record<string, unknown> {
  const entry = (i: number) => real?.entries[i] ?? uuidv7();
  if (path === "/api/time") return { t1: Date.now() };
  if (path === "/api/clubs/[slug]/contests") {
    return { name: "Fuzz Cup", startsOn: "2027-02-06", fieldName: "Fuzz Meadow", rounds: ["A", "B", "D", "F", "G"].map((letter) => ({ letter })), maxGroupSize: 10, prepMinutes: 5, noFlySeconds: 60, dropRule: "f3k", practice: false, entryFeeCents: 1500, currency: "eur", entriesCloseAt: "2027-02-04T18:00:00Z" };
  }
  // a payment event for an entry nobody has (signed when the run is "signed in": see below); 200 and recorded, or 400
  if (path === "/api/payments/webhook") {
    return { id: `evt_fuzz_${uuidv7().replace(/-/g, "")}`, object: "event", type: "checkout.session.completed",
      data: { object: { client_reference_id: uuidv7(), payment_status: "paid", payment_intent: "pi_fuzz", amount_total: 1500, currency: "eur", metadata: { entryId: uuidv7() } } } };
  }
  if (path.endsWith("/paper-entries")) return { pilotName: "Fuzz Paper", models: ["Fuzz glider"], keepApart: "family" };
  if (path.endsWith("/entries")) return { modelIds: [] };
  if (path.endsWith("/draw")) return { seed: 3, replaceResults: false };
  if (path.endsWith("/draw/swap")) return { round: 1, a: entry(0), b: entry(1) };
  if (path.endsWith("/draw/redraw")) return { fromRound: 2, seed: 3 };
  if (path.endsWith("/runs")) return { entryId: entry(0), runId: uuidv7(), lane: 0 };
  // a slot's records or a re-flight grant's (…/reflights/records): the same body
  if (path.endsWith("/records")) return { entryId: entry(0), recordId: uuidv7() };
  // one body for both methods (each schema reads its own fields): grant a re-flight, or record its card
  if (path.endsWith("/reflight-requests")) return { requestId: uuidv7(), decision: "grant", placement: "later-group", groupNumber: 2, entitled: true, reason: "Rain" };
  if (path.endsWith("/reflights/timekeeper")) return { entryId: entry(2), timekeeperUserId: userId };
  if (path.endsWith("/reflights")) return { entryId: entry(2), cause: "rain", placement: "later-group", entitled: true, groupNumber: 2, reason: "Shower", flights: [900], runId: null, lane: null, signed: true };
  if (path.endsWith("/phone-set-aside")) return { eventId: uuidv7(), reason: "Launched inside the window" };
  // one body for both methods: give a penalty, or remove one
  if (path.endsWith("/penalties")) return { entryId: entry(3), cause: "outside-time", points: 100, note: "Launched early", penaltyId: uuidv7(), reason: "Wrong pilot" };
  // one body for both methods: record a dispute, or resolve one (upheld by a re-flight)
  if (path.endsWith("/disputes")) return { entryId: entry(1), subject: "Flight not counted", lodgedBy: "Team manager", lodgedAt: new Date().toISOString(), disputeId: real?.disputeId ?? uuidv7(), status: "upheld", outcome: "Re-flight granted", action: "reflight" };
  if (path.endsWith("/timekeepers")) return { groupNumber: 1, timekeepers: [{ entryId: entry(0), timekeeperUserId: userId }] };
  if (path.endsWith("/entries/[entryId]")) return { team: "Fuzz Team", pilotClass: "junior" };
  if (path.endsWith("/draw/fly-off")) return { replaceResults: false };
  if (path.endsWith("/cards")) return { groupNumber: 1, cards: [{ entryId: entry(3), flights: [834, 1200], penaltyPoints: 100, signed: true }] };
  const logMapping = { hasHeader: true, timeColumn: 1, timeKind: "seconds", utcOffsetMin: 0, valueColumn: 2, valueKind: "m" };
  if (path === "/api/models" || path === "/api/models/[modelId]") return { name: "Fuzz glider", spanMm: 1490, massG: 250, marking: "red", notes: "", status: "flying" };
  if (path.endsWith("/repairs")) return { repairedOn: "2026-06-14", work: "new skin", massAfterG: 255 };
  if (path.endsWith("/transfer")) return { email: "tobi@example.com", withHistory: true };
  if (path === "/api/model-offers/[offerId]") return { answer: "accept" };
  if (path.endsWith("/logs")) return { lane: 0, fileName: "log.csv", sizeBytes: 900, contentType: "text/csv", loggerName: "Fuzz", mapping: logMapping, startAtMs: 1_767_000_000_000 };
  if (path.endsWith("/complete")) return { loggerName: "Fuzz", mapping: logMapping, startAtMs: 1_767_000_000_000 };
  if (path.endsWith("/consent")) return { decision: "disputed", reason: "The second flight was longer" };
  // the fuzz user has no password, so a well-formed change or deletion is refused (403) and writes nothing
  if (path === "/api/account") return { password: "thermal-hunter-42" };
  if (path === "/api/account/password") return { currentPassword: "thermal-hunter-42", newPassword: "launch-window-77" };
  if (path === "/api/account/sign-out-everywhere") return {};
  // a well-formed token nobody issued: 404, nothing written; the fuzz user has no password, so a change of address is refused
  const token = uuidv7().replace(/-/g, "").repeat(2).slice(0, 43);
  if (path === "/api/account/verify-email" || path === "/api/account/email/confirm") return { token };
  if (path === "/api/account/reset-password") return { token, password: "launch-window-77" };
  if (path === "/api/account/forgot-password") return { email: `fuzz-${uuidv7()}@example.com` };
  if (path === "/api/account/email") return { newEmail: `fuzz-${uuidv7()}@example.com`, currentPassword: "thermal-hunter-42" };
  if (path === "/api/account/verification") return {};
  // admin routes run as an admin: setting a member's role to member changes nothing; retrying a message nobody queued is a 404
  if (path === "/api/admin/users/[userId]") return { action: "set-role", role: "member" };
  if (path === "/api/admin/mail/[mailId]/retry") return {};
  if (path === "/api/clubs") return { name: "Fuzz Club" };
  if (path.endsWith("/invitations")) return { email: `fuzz-${uuidv7()}@example.com`, role: "coach" };
  if (path.endsWith("/members/[userId]")) return { role: "member" };
  if (path.endsWith("/fields")) return { name: `Fuzz Field ${uuidv7()}`, latitude: "51.5", longitude: 2, launchDirection: "West", safetyAreas: "Car park", localRules: "" };
  if (path.endsWith("/days")) return { fieldId: uuidv7(), day: "2026-06-14" };
  if (path.endsWith("/decisions")) return { runId: uuidv7(), lane: 0, deviceId: "phone-1", note: "A note" };
  if (path.endsWith("/time-zone")) return { timeZone: "Europe/Berlin" };
  if (path.endsWith("/day-summaries")) return { on: true };
  // a day nobody opened (the run is nobody's): a well-formed choice is a 404 and writes nothing
  if (path.endsWith("/club-days")) return { dayId: uuidv7(), chosen: true };
  if (path === "/api/invitations/accept") return { token };
  // an offer of the fuzz user's season to an address; a code nobody issued (404, nothing written)
  if (path === "/api/coach-grants") return { kind: "email", email: `fuzz-coach-${uuidv7()}@example.com` };
  if (path === "/api/coach/claim") return { code: "ZZZZ-ZZZZ" };
  // the fuzz user coaches nobody and has no notes: a well-formed note, answer or plan is a 404 and writes nothing
  if (path === "/api/notes") return { pilotId: uuidv7(), runId: uuidv7(), body: "Keep the second launch lower." };
  if (path === "/api/notes/[noteId]/replies") return { body: "Thanks, will do." };
  // a plan nobody gave the fuzz user: a well-formed change is a 404 and writes nothing
  if (path === "/api/coach/plans/[planId]") return { title: "Turnarounds", items: [{ letter: "H", variant: 600, goal: "two windows", windows: 2, measure: null }], closed: true };
  if (path === "/api/coach/plans") {
    return { pilotId: uuidv7(), title: "Turnarounds", items: [{ letter: "H", variant: 600, goal: "three 1-2-3-4 windows", windows: 3, measure: { kind: "median-turnaround-below", seconds: 3 } }] };
  }
  if (path === "/api/account/sign-up") return { name: "Fuzz Pilot", email: `fuzz-${uuidv7()}@example.com`, password: "thermal-hunter-42" };
  const sessionId = uuidv7();
  const runId = uuidv7();
  const deviceId = `fuzz-${uuidv7()}`;
  const offset = { thetaMs: 12, deltaMs: 30, measuredAtWallMs: 1_767_000_000_000 };
  return {
    deviceId,
    account: userId,
    sessions: [{ id: sessionId, ownerId: userId, fieldName: "Fuzz Field", conditions: { windMs: 3, notes: "calm" }, startedAtWallMs: 1_767_000_000_000 }],
    runs: [{ id: runId, sessionId, task: getCatalogueTask("A"), lanes: [{ lane: 0, pilotName: "Fuzz", pilotUserId: userId }], createdAtWallMs: 1_767_000_000_000 }],
    events: [
      { id: uuidv7(), runId, deviceId, seq: 1, stamp: { wallMs: 1_767_000_001_000, monoMs: 5, pageId: "p1", offset }, body: { kind: "window-start" } },
      { id: uuidv7(), runId, deviceId, seq: 2, stamp: { wallMs: 1_767_000_002_000, monoMs: 6, pageId: "p1", offset: null }, body: { kind: "penalty", lane: 0, points: 100, reason: "line" } },
    ],
    clockEstimates: [offset],
  };
}

const signWebhook = (body: string) => webhookRequest(body).headers.get("stripe-signature")!;

/** Every path to a value inside `v` (objects and arrays), the root included; `leaves` keeps only primitives. */
function paths(v: unknown, leaves: boolean, at: (string | number)[] = []): (string | number)[][] {
  const out: (string | number)[][] = [];
  const container = v !== null && typeof v === "object";
  if (!leaves || !container) out.push(at);
  if (Array.isArray(v)) v.forEach((x, i) => out.push(...paths(x, leaves, [...at, i])));
  else if (container) for (const [k, x] of Object.entries(v as object)) out.push(...paths(x, leaves, [...at, k]));
  return out;
}

/** What goes in a body: a valid body with one value replaced, or raw junk of any size. */
const bodyArb = fc.oneof(
  { weight: 5, arbitrary: fc.record({ kind: fc.constant("mutate" as const), pick: fc.nat(), leaf: fc.integer({ min: 0, max: 4 }).map((n) => n > 0), value: evilValue, drop: fc.integer({ min: 0, max: 5 }).map((n) => n === 0) }) },
  { weight: 2, arbitrary: fc.record({ kind: fc.constant("json" as const), value: fc.jsonValue() }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant("text" as const), value: fc.string({ unit: "binary", maxLength: 200 }) }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant("huge" as const), bytes: fc.constantFrom(70_000, 1_100_000), nul: fc.boolean() }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant("deep" as const), depth: fc.constantFrom(100, 10_000, 200_000) }) },
);
const contentTypeArb = fc.constantFrom("application/json", "application/json", "text/plain", "application/x-www-form-urlencoded", "multipart/form-data; boundary=x", null);

type Body = typeof bodyArb extends fc.Arbitrary<infer T> ? T : never;

function bodyText(b: Body, base: Record<string, unknown>): string {
  switch (b.kind) {
    case "mutate": {
      const all = paths(base, b.leaf);
      const at = all.length ? all[b.pick % all.length]! : []; // an empty template ({}) has no leaves: replace the root
      const value = b.drop && at.length > 0 ? undefined : b.value;
      return JSON.stringify(replaced(base, at, value)) ?? "null";
    }
    case "json":
      return JSON.stringify(b.value);
    case "text":
      return b.value;
    case "huge":
      return JSON.stringify({ ...base, pad: (b.nul ? "\u0000" : "x").repeat(b.bytes) });
    case "deep":
      return "[".repeat(b.depth) + "]".repeat(b.depth);
  }
}

const queryArb = fc.array(
  fc.tuple(
    fc.constantFrom("cursor", "account", "limit", "x", "cursor", "q", "page", "from", "to", "task", "field", "kind", "size", "sort", "dir", "what", "model"),
    fc.oneof(
      fc.constantFrom("0", "-1", "1.5", "1e400", "9007199254740993", "%00", "\u0000", "abc", "", uuidv7()),
      // the season's filters and paging (lib/validations/season.ts)
      fc.constantFrom("2026-06-01", "2026-02-30", "99999-01-01", "0000-01-01", "9999-12-31", "A", "custom", "contest", "practice", "25", "100000", "duration", "asc", "runs", "flights"),
      fc.string({ maxLength: 30 }),
    ),
  ),
  { maxLength: 4 },
);

describe("fuzz: every route under app/api", () => {
  type FuzzUser = { id: string; email: string; name: string; role: "member" | "admin" };
  let user: FuzzUser;
  /** Routes under /api/admin are driven by an admin (a member stops at 403 before reading the input), on a target of their own. */
  let admin: FuzzUser;
  let target: string;
  let clubSlug = "";
  let real: Real;
  const account = async (role: "member" | "admin", name: string): Promise<FuzzUser> => {
    const email = `fuzz-${uuidv7()}@example.com`;
    const [row] = await db.insert(users).values({ email, name, role }).returning();
    return { id: row!.id, email, name, role };
  };
  beforeAll(async () => {
    user = await account("member", "Fuzz Pilot");
    admin = await account("admin", "Fuzz Admin");
    target = (await account("member", "Fuzz Target")).id;
    // the fuzz user is the only officer of a club of its own, so club routes read their bodies
    clubSlug = `fuzz-${uuidv7()}`;
    const [club] = await db.insert(clubs).values({ name: "Fuzz Club", slug: clubSlug }).returning();
    await db.insert(memberships).values({ clubId: club!.id, userId: user.id, role: "officer" });
    // its contest: five rounds, six paper entries drawn into group 1 of round 1, an open dispute; and a model of its own
    const [contest] = await db.insert(contests).values({ clubId: club!.id, name: "Fuzz Cup", startsOn: "2027-02-06", fieldName: "Fuzz Meadow", drawSeed: 1 }).returning();
    const rounds = await db.insert(contestRounds).values(["A", "B", "D", "F", "G"].map((l, i) => ({ contestId: contest!.id, number: i + 1, task: getCatalogueTask(l as "A") }))).returning();
    const entries = await db.insert(contestEntries).values([1, 2, 3, 4, 5, 6].map((n) => ({ contestId: contest!.id, pilotName: `Fuzz Entrant ${n}`, paper: true }))).returning();
    await db.insert(groupSlots).values(entries.map((e) => ({ roundId: rounds[0]!.id, groupNumber: 1, entryId: e.id })));
    const [dispute] = await db.insert(contestDisputes).values({ roundId: rounds[0]!.id, entryId: entries[1]!.id, subject: "Landing not counted", lodgedBy: "Fuzz Entrant 2" }).returning();
    const [model] = await db.insert(models).values({ ownerId: user.id, name: "Fuzz glider", spanMm: 1490, massG: 250 }).returning();
    real = { contestId: contest!.id, entries: entries.map((e) => e.id), disputeId: dispute!.id, modelId: model!.id };
  });

  it("knows how to drive every route handler and method", async () => {
    const found = await discoverRoutes();
    expect(found.length).toBeGreaterThan(5);
    for (const { path, handlers } of found) {
      const known = ROUTES[path];
      expect(known, `${path} is not covered by the fuzz test: add it to ROUTES`).toBeDefined();
      for (const m of Object.keys(handlers)) expect(known?.[m as Method], `${m} ${path} is not covered by the fuzz test`).toBeDefined();
    }
  });

  it("never answers 5xx, and a 4xx changes nothing", { timeout: 600_000 }, async () => {
    const found = await discoverRoutes();
    const runs = Number(process.env.FUZZ_RUNS ?? 60);
    const only = process.env.FUZZ_ROUTE; // e.g. FUZZ_ROUTE=/reflights: only the routes whose path contains it
    for (const { path, handlers } of found) {
      if (only && !path.includes(only)) continue;
      for (const [method, handler] of Object.entries(handlers) as [Method, Handler][]) {
        const input = ROUTES[path]?.[method];
        if (!input || typeof input === "object") continue;
        const signedInArb = fc.integer({ min: 0, max: 4 }).map((n) => n > 0);
        // a route on a contest or a model gets, half the time, the fuzz user's own one (see Real)
        const realArb = /\[(contestId|modelId)\]/.test(path) ? fc.boolean() : fc.constant(false);
        const arb = input === "json" ? fc.tuple(bodyArb, contentTypeArb, signedInArb, realArb) : fc.tuple(queryArb, fc.constant(null), signedInArb, realArb);
        await fc.assert(
          fc.asyncProperty(arb, async ([shape, contentType, signedIn, ownRows]) => {
            // the session follows the account's generation: "sign out everywhere" must not sign the fuzz out of later routes
            const caller = path.startsWith("/api/admin/") ? admin : user;
            const [row] = signedIn ? await db.select({ v: users.sessionVersion }).from(users).where(eq(users.id, caller.id)) : [];
            actAs(signedIn ? { ...caller, sessionVersion: row?.v ?? 0 } : null);
            let request: Request;
            let bytes = 0;
            if (input === "json") {
              const body = bodyText(shape as Body, template(path, user.id, ownRows ? real : null));
              bytes = new TextEncoder().encode(body).length;
              const headers: Record<string, string> = contentType ? { "content-type": contentType } : {};
              // the payments webhook has no session: its credential is the signature, given on the runs that are "signed in"
              if (path === "/api/payments/webhook" && signedIn) headers["stripe-signature"] = signWebhook(body);
              request = new Request(`http://test${path}`, { method, body, headers });
            } else {
              const qs = new URLSearchParams(shape as [string, string][]).toString();
              request = new Request(`http://test${path}${qs ? `?${qs}` : ""}`, { method });
            }
            const before = await countAll();
            // a dynamic route gets ids nobody gave the fuzz user (a run, a model, a log, a queued message: a valid body is a 404);
            // the admin's change of an account acts on its own target; club routes get the fuzz user's own club,
            // itself as the member and a field nobody has; a pilot's routes get the fuzz user's own id (their season: a 200)
            const params = path.includes("[slug]")
              ? { slug: clubSlug, userId: user.id, fieldId: uuidv7(), date: "2026-06-14", invitationId: uuidv7() }
              : path.includes("[pilotId]")
                ? { pilotId: user.id }
                : path.includes("[") ? { contestId: uuidv7(), entryId: uuidv7(), roundNumber: "1", token: uuidv7().replace(/-/g, "").repeat(2).slice(0, 43), runId: uuidv7(), lane: "0", modelId: uuidv7(), logId: uuidv7(), mailId: uuidv7(), grantId: uuidv7(), offerId: uuidv7(), noteId: uuidv7(), planId: uuidv7(), userId: target } : {};
            if (ownRows) Object.assign(params, { contestId: real.contestId, entryId: real.entries[4], modelId: real.modelId });
            const res = await handler(request, { params: Promise.resolve(params) });
            expect(res.status, `${method} ${path} answered ${res.status}`).toBeLessThan(500);
            if (signedIn && bytes > (path === "/api/sync/push" ? BODY_LIMIT.push : BODY_LIMIT.default)) expect(res.status).toBe(413);
            if (res.status >= 400) {
              expect(await countAll(), `${method} ${path} answered ${res.status} but wrote`).toBe(before);
              const reply = (await res.json()) as { error?: { code?: unknown; message?: unknown } };
              expect(typeof reply.error?.message).toBe("string");
            }
          }),
          { numRuns: input === "json" ? runs : Math.ceil(runs / 2), seed: Number(process.env.FUZZ_SEED ?? 909), endOnFailure: true },
        );
      }
    }
  });
});
