import type { RunEvent } from "@/lib/events/schema";
import { z } from "zod";
import { lazySchema } from "@/lib/events/lazy-schema";
import { cursorAfter, laneResultSchema, pulledModelSchema, pullItemSchema, pullReplySchema, type PullItem } from "@/lib/validations/sync";
import { pulledNoteSchema, pulledPlanSchema } from "@/lib/validations/coaching-sync";
import { pulledDutySchema } from "@/lib/validations/contest-sync";
import { eventBodySchema, runEventSchema, stampSchema } from "@/lib/events/schema";
import { runEntitySchema, sessionEntitySchema } from "@/lib/events/entities";
import { laneConsentSchema } from "@/lib/validations/consent";
import { getMeta, setMeta, type StoredRun, type WindowcallDb } from "./db";
import type { SessionEntity } from "@/lib/events/entities";
import { forgetLanes, forgetRuns } from "./forget";
import { requestJson, type FetchLike, type HttpResult } from "./http";
import { buildInSlices, parseInSlices, yieldToMain } from "./slices";

/** How far a pull has come: pages stored, about how many in all (null: unknown), items stored. */
export type PullProgress = { page: number; pages: number | null; items: number };

export type PullDeps = {
  db: WindowcallDb;
  fetch: FetchLike;
  baseUrl?: string;
  account?: string | null;
  /** Items per page to ask for. */
  limit?: number;
  /** Called after each stored page. */
  onProgress?: (p: PullProgress) => void;
  /** Records per write transaction (PULL_WRITE_SLICE). */
  writeSlice?: number;
  /** Called after each of a page's record transactions (tests stop a pull there, as a killed tab would). */
  afterSlice?: () => void;
};

/** How a pull ended: ok with the number of items stored, or the failure to report. */
export type PullOutcome = { kind: "ok"; items: number } | Exclude<HttpResult<unknown>, { kind: "ok" }>;

/** Items per page the device asks for. */
export const PULL_PAGE_LIMIT = 500;

/**
 * Records a page stores per transaction (issue #10): a page's 500 in one transaction was one task of
 * 0.09–0.28 s at 4× CPU (cpu-probe of /field, DEVELOPERS.md "Page load"); a fifth of a page per task.
 */
export const PULL_WRITE_SLICE = 100;

/** A page as it arrives: its items are checked a slice at a time (parseInSlices), not in one go. */
const pageSchema = lazySchema(() => pullReplySchema.extend({ items: z.array(z.unknown()) }));

/** The schemas a pull reply and its items are checked with, inner ones first: built one per task before the first page. */
const pullParts = () => [
  pulledNoteSchema, pulledPlanSchema, pulledDutySchema, pulledModelSchema, pullReplySchema, pageSchema,
  stampSchema, eventBodySchema, runEventSchema, sessionEntitySchema, runEntitySchema, laneResultSchema, laneConsentSchema, pullItemSchema,
];

/** Once per page load: later pulls find the schemas built and need not yield fourteen times for nothing. */
let partsBuilt: Promise<void> | null = null;

/** Safety stop for a server that keeps saying "more" (pages of a normal catch-up are far fewer). */
const MAX_PAGES = 1000;

/**
 * Fetch everything changed since the stored cursor, page by page, until `hasMore` is false. The
 * first request asks how many items are ready (`total=1`), so progress can say "page 3 of ~12".
 * Each page is stored in small transactions with a yield between (writeSlices): what it says to
 * forget, its records (bulkPut, so a page seen twice changes nothing), and last the advanced cursor
 * with the lists it carries. A failure or a killed tab leaves the cursor at the last page stored
 * whole; the next pull asks for the rest again.
 */
export async function pullAll(deps: PullDeps): Promise<PullOutcome> {
  const { db } = deps;
  const limit = deps.limit ?? PULL_PAGE_LIMIT;
  let cursor = String((await getMeta(db, "pullCursor")) ?? "0");
  const knownScope = (await getMeta(db, "pullScope")) ?? "";
  const coaching = await heldCoaching(db);
  let stored = 0;
  let pages: number | null = null;
  let restarted = false;
  for (let page = 0; page < MAX_PAGES; page++) {
    const account = deps.account ? `&account=${encodeURIComponent(deps.account)}` : "";
    const total = pages === null ? "&total=1" : "";
    const held = coaching ? `&coaching=${coaching}` : "";
    const url = `${deps.baseUrl ?? ""}/api/sync/pull?cursor=${cursor}&limit=${limit}${total}${account}${held}`;
    if (page === 0) await (partsBuilt ??= buildInSlices(pullParts()));
    const r = await requestJson(deps.fetch, url, { method: "GET" }, pageSchema);
    if (r.kind !== "ok") return r;
    const checked = await parseInSlices(r.value.items, pullItemSchema);
    if (!checked.ok) return { kind: "bad-reply", message: checked.message };
    const items = checked.value;
    const { nextCursor, hasMore, scope } = r.value;
    if (!restarted && page === 0 && cursor !== "0" && scope !== undefined && scope !== knownScope) {
      cursor = "0"; // what the user may see changed: older rows may be newly visible, so start over
      restarted = true;
      page = -1;
      continue;
    }
    if (cursorAfter(cursor, nextCursor) || (hasMore && !cursorAfter(nextCursor, cursor))) {
      return { kind: "bad-reply", message: `pull cursor did not advance (${cursor} → ${nextCursor})` };
    }
    if (r.value.total !== undefined) pages = Math.max(1, Math.ceil(r.value.total / limit));
    const { events, sessions, runs } = split(items);
    const tables = [db.events, db.sessions, db.runs, db.meta, db.outbox];
    // the page's records in small transactions, a yield between them (PULL_WRITE_SLICE): what to forget first, as before; then sessions, runs, events. A tab
    // killed between two of them has stored part of a page and not moved the cursor, so its next pull
    // asks for the same page again and bulkPut stores it whole (a record seen twice changes nothing)
    const writes = writeSlices(db, sessions, runs, events, deps.writeSlice ?? PULL_WRITE_SLICE);
    if (r.value.forget || r.value.forgetLanes) {
      await db.transaction("rw", tables, async () => {
        if (r.value.forget) await forgetRuns(db, r.value.forget, deps.account ?? null);
        if (r.value.forgetLanes) await forgetLanes(db, r.value.forgetLanes);
      });
    }
    for (const write of writes) {
      await yieldToMain();
      await db.transaction("rw", tables, write);
      deps.afterSlice?.();
    }
    await yieldToMain();
    // last, on its own: the cursor (and the whole lists the last page carries) once the page is stored
    await db.transaction("rw", tables, async () => {
      await setMeta(db, "pullCursor", nextCursor);
      if (scope !== undefined) await setMeta(db, "pullScope", scope);
      if (r.value.models) await setMeta(db, "models", r.value.models);
      // whole lists: what the user may no longer read (a revoked grant) drops off here. Notes and plans
      // come only when they differ from the set whose fingerprint this phone sent; it keeps the new one
      if (r.value.notes) await setMeta(db, "notes", r.value.notes);
      if (r.value.plans) await setMeta(db, "assignedPlans", r.value.plans);
      if (r.value.notes && r.value.plans && r.value.coaching) await setMeta(db, "pullCoaching", r.value.coaching);
      if (r.value.contestDuties) await setMeta(db, "contestDuties", r.value.contestDuties);
    });
    stored += items.length;
    cursor = nextCursor;
    deps.onProgress?.({ page: page + 1, pages: pages === null ? null : Math.max(pages, page + 1), items: stored });
    if (!hasMore) return { kind: "ok", items: stored };
  }
  return { kind: "bad-reply", message: `pull still had more after ${MAX_PAGES} pages` };
}

/**
 * The fingerprint of the notes and plans this phone holds (pullReplySchema.coaching), to send back:
 * only when it holds both lists, so a phone missing either gets them whole.
 */
async function heldCoaching(db: WindowcallDb): Promise<string | undefined> {
  const [fingerprint, notes, plans] = await Promise.all([getMeta(db, "pullCoaching"), getMeta(db, "notes"), getMeta(db, "assignedPlans")]);
  return fingerprint && notes && plans ? fingerprint : undefined;
}

/**
 * A page's records as write transactions of at most `size` records each, in the order one transaction
 * stored them before: sessions, then runs, then events (bulkPut per table within a transaction).
 */
function writeSlices(db: WindowcallDb, sessions: SessionEntity[], runs: StoredRun[], events: RunEvent[], size: number): (() => Promise<void>)[] {
  const records = [
    ...sessions.map((r) => ({ table: db.sessions, r })),
    ...runs.map((r) => ({ table: db.runs, r })),
    ...events.map((r) => ({ table: db.events, r })),
  ] as { table: { bulkPut: (rows: unknown[]) => Promise<unknown> }; r: unknown }[];
  const out: (() => Promise<void>)[] = [];
  for (let i = 0; i < records.length; i += Math.max(1, size)) {
    const slice = records.slice(i, i + Math.max(1, size));
    out.push(async () => {
      for (let j = 0; j < slice.length; ) {
        const table = slice[j]!.table;
        let k = j;
        while (k < slice.length && slice[k]!.table === table) k++;
        await table.bulkPut(slice.slice(j, k).map((x) => x.r));
        j = k;
      }
    });
  }
  return out;
}

function split(items: readonly PullItem[]) {
  const events: RunEvent[] = [];
  const sessions: SessionEntity[] = [];
  const runs: StoredRun[] = [];
  for (const item of items) {
    if (item.type === "event") events.push(item.data);
    else if (item.type === "session") sessions.push(item.data);
    else {
      // a run in someone else's session comes with that session; results are the server's
      if (item.session) sessions.push(item.session);
      runs.push(storedRunOf(item));
    }
  }
  return { events, sessions, runs };
}

/** A pulled run as the device keeps it: the entity with the server's results, recorder and consents. */
export function storedRunOf(item: Extract<PullItem, { type: "run" }>): StoredRun {
  const run: StoredRun = { ...item.data };
  if (item.results) run.results = item.results;
  if (item.recordedBy) run.recordedBy = item.recordedBy;
  if (item.consents) run.consents = item.consents;
  return run;
}
