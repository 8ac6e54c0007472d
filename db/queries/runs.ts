import "server-only";
import { inArray, sql, type SQL } from "drizzle-orm";
import { storedOffset, type ClockEstimate } from "@/lib/clock";
import type { EventBody } from "@/lib/events/schema";
import { buildFold, FOLD_VERSION, lanesOfFold, resumeFold, type RunFold } from "@/lib/results/fold-state";
import { deriveRun, type DerivationEvent, type LaneDerivation } from "@/lib/sync/derive";
import { uncertaintyOf } from "@/lib/sync/correct-events";
import { parseTaskDefinition } from "@/lib/tasks";
import { deviceClockEstimates, events, runs } from "../schema";
import { holdDaysThenLockRuns, holdOpenDays } from "./club-day-locks";
import { currentServerSeq, type Tx } from "./sync-db";
import { loadForPush, loadRunEvents, type LoadedRun } from "./sync-push-load";

type EventRow = typeof events.$inferSelect;

/** A stored event row as the derivation reads it (raw stamp, corrected time, bound). */
export function toDerivationEvent(row: EventRow): DerivationEvent {
  const offset = storedOffset(row.offsetThetaMs, row.offsetDeltaMs, row.offsetMeasuredAtMs);
  return {
    id: row.id,
    deviceId: row.deviceId,
    seq: row.seq,
    recordedBy: row.recordedBy,
    stamp: { wallMs: row.wallMs, monoMs: row.monoMs, pageId: row.pageId, offset },
    body: row.body as EventBody,
    correctedMs: row.correctedMs,
    uncertaintyMs: uncertaintyOf(row.uncertaintyMs),
  };
}

/** Every clock estimate of the given devices, by device. */
export async function listDeviceEstimates(tx: Tx, deviceIds: readonly string[]): Promise<Map<string, ClockEstimate[]>> {
  const out = new Map<string, ClockEstimate[]>();
  if (deviceIds.length === 0) return out;
  const rows = await tx.select().from(deviceClockEstimates).where(inArray(deviceClockEstimates.deviceId, [...deviceIds]));
  for (const r of rows) {
    const list = out.get(r.deviceId) ?? [];
    list.push({ thetaMs: r.thetaMs, deltaMs: r.deltaMs, measuredAtWallMs: r.measuredAtWallMs });
    out.set(r.deviceId, list);
  }
  return out;
}

/**
 * Timekeepers a contest assigned to a run: the only official recorders (lib/sync/sources.ts).
 * Contests do not assign timekeepers yet (db/schema/contests.ts), so no record is official;
 * the contest work replaces this with a lookup per run.
 */
const NO_OFFICIALS: ReadonlySet<string> = new Set();

/**
 * Re-derive the results of these runs from their stored events (lib/sync/derive.ts) and store
 * them (storeDerivations). Holds the runs' open club days, then locks the runs' rows (holdDaysThenLockRuns) first, so a concurrent writer of the
 * same run waits and then derives from everything committed — nothing else is locked. A push
 * does not come here: it locks, loads and derives its runs itself (db/queries/sync-push.ts).
 */
export async function deriveAndStoreRuns(tx: Tx, runIds: Iterable<string>): Promise<void> {
  const ids = [...new Set(runIds)];
  if (ids.length === 0) return;
  await holdDaysThenLockRuns(tx, ids);
  const load = await loadForPush(tx, { runIds: ids, eventIds: [], deviceId: "", seqs: [], allEvents: true });
  await storeDerivations(tx, [...load.runs.values()], load.estimates);
}

/** How a store's derivations went: resumed from the folded state, or in full (with the fold's reason). */
export type DeriveStats = { resumed: number; full: number; reasons: string[] };

/**
 * Derive each of these runs once and store the results in run_lanes (result, derived
 * flights/breakdown/versions, review flag) with the run's folded state (run_folds), and give each
 * run a new server_seq and this transaction's xid so devices pull the new results — in ONE
 * statement for up to 500 lanes, which also holds FOR SHARE the open club days the runs may belong
 * to, so a concurrent close keeps them or leaves them out whole (club-day-locks.ts). The caller holds the runs' row locks (lockRuns) and read `runs`
 * after taking them.
 *
 * A run with a folded state and `added` (the events this push stored in it) is derived from the
 * state and those events only (lib/results/fold-state.ts resumeFold). Any other run — no state, or
 * a state that cannot take them (an undo, an earlier event arriving late, new clock estimates…) —
 * is derived in full from all its events (read here in one statement when the load did not) and
 * its state is folded again from them (not on a run's first push of few events: foldsLater); a state that does not
 * give exactly the full result is not stored. Events go to the full derivation in id order (UUIDv7: creation order, as a phone
 * holds them), so the same events give the same result however they were read. Returns the last
 * server sequence number as the statement saw it.
 */
export async function storeDerivations(
  tx: Tx,
  loaded: readonly LoadedRun[],
  estimates: ReadonlyMap<string, readonly ClockEstimate[]>,
  added: ReadonlyMap<string, readonly DerivationEvent[]> = new Map(),
  stats?: DeriveStats,
): Promise<number> {
  if (loaded.length === 0) return currentServerSeq(tx);
  let last = 0;
  for (const statement of await derivationStatements(tx, loaded, estimates, added, { stats, inline: false, stored: true })) {
    const r = await tx.execute<{ last_value: string; is_called: boolean }>(statement);
    last = seqOf(r.rows[0]);
  }
  return last;
}

/** The server sequence number a store statement's row (`last_value`, `is_called` of sync_seq) names. */
export const seqOf = (row: { last_value: string; is_called: boolean } | undefined) => (row && row.is_called ? Number(row.last_value) : 0);

/** Whether every run here is short enough for its derivation to travel as literal text (derivationStatements `inline`). */
export const inlineable = (loaded: readonly LoadedRun[]) => loaded.every((r) => r.eventCount < LONG_RUN_EVENTS);

/**
 * storeDerivations' derivations and the statements that store them (each answers `last_value`, `is_called`
 * of sync_seq; the first also holds the club days). `inline`: the JSON goes as text (for a pipelined message,
 * db/queries/sync-pipeline.ts: short runs only, inlineable), not as binary parameters. `stored` false: the
 * push's events (`added`) are not in the table yet (they go in the same message as these statements), so
 * a run read here for a full derivation gets them added.
 */
export async function derivationStatements(
  tx: Tx,
  loaded: readonly LoadedRun[],
  estimates: ReadonlyMap<string, readonly ClockEstimate[]>,
  added: ReadonlyMap<string, readonly DerivationEvent[]>,
  opts: { stats?: DeriveStats; inline: boolean; stored: boolean },
): Promise<SQL[]> {
  const { stats } = opts;
  const done: { run: LoadedRun; lanes: LaneDerivation[]; fold: RunFold | null }[] = [];
  const full: LoadedRun[] = [];
  for (const run of loaded) {
    const more = added.get(run.id) ?? [];
    if (run.fold) {
      if (run.eventCount >= LONG_RUN_EVENTS) await yieldToOthers();
      // the state was read for this derivation alone: folded in place, not copied (owned)
      const r = resumeFold(run.fold, { ...factsOf(run), estimatesByDevice: estimates }, more, run.eventCount + more.length, true);
      if (r.ok) {
        done.push({ run, lanes: r.lanes, fold: r.fold });
        if (stats) stats.resumed++;
        continue;
      }
      stats?.reasons.push(r.reason);
    }
    full.push(run);
  }
  const missing = full.filter((r) => r.events === null).map((r) => r.id);
  const read = missing.length > 0 ? await loadRunEvents(tx, missing) : new Map<string, DerivationEvent[]>();
  for (const run of full) {
    const input = {
      ...factsOf(run),
      // read here after the push's insert, the run's events include the added ones (not when they are still to be stored)
      events: (run.events || !opts.stored ? [...(run.events ?? read.get(run.id) ?? []), ...(added.get(run.id) ?? [])] : (read.get(run.id) ?? [])).sort((a, b) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0)),
      estimatesByDevice: estimates,
    };
    const lanes = deriveRun(input);
    // a run's first events, when they are few, get no folded state yet (foldsLater)
    let fold = foldsLater(run, added, input.events.length) ? null : buildFold(input);
    if (fold && JSON.stringify(lanesOfFold(fold, input)) !== JSON.stringify(lanes)) fold = null;
    done.push({ run, lanes, fold });
    if (stats) stats.full++;
  }

  const updates = [];
  for (const { run, lanes } of done) {
    for (const d of lanes) {
      updates.push(
        sql`(${run.id}::uuid, ${d.lane}::smallint, ${d.resultTenths}::integer, ${opts.inline ? JSON.stringify(d.derived) : await jsonParam(d.derived, "jsonb", run)}::jsonb, ${d.needsReview}::boolean, ${d.reviewReason}::text)`,
      );
    }
  }
  const idList = sql.join(loaded.map((r) => sql`${r.id}::uuid`), sql`, `);
  const kept = done.filter((d) => d.fold !== null);
  const dropped = done.filter((d) => d.fold === null).map((d) => sql`${d.run.id}::uuid`);
  // the lanes' results, the runs' folded states and new stamps and the sequence's position in one statement
  const restamp = sql`restamp as (update runs set server_seq = nextval('sync_seq'), xid = pg_current_xact_id() where id in (${idList}) returning 1)`;
  // each state a parameter of its own: in an array parameter the driver escapes every quote of
  // the JSON (a long run's state is ~440 kB) and the database unescapes it again; json, not jsonb:
  // the column keeps the text as sent (db/schema/run-folds.ts)
  const foldRows = [];
  for (const d of kept) foldRows.push(sql`(${d.run.id}::uuid, ${FOLD_VERSION}::int, ${opts.inline ? JSON.stringify(d.fold) : await jsonParam(d.fold, "json", d.run)}::json)`);
  const folds = sql`${kept.length === 0 ? sql`` : sql`, folds as (insert into run_folds (run_id, version, state)
      values ${sql.join(foldRows, sql`, `)}
      on conflict (run_id) do update set version = excluded.version, state = excluded.state returning 1)`}${dropped.length === 0 ? sql`` : sql`, unfold as (delete from run_folds where run_id in (${sql.join(dropped, sql`, `)}) returning 1)`}`;
  const seq = sql`select last_value, is_called from sync_seq`;
  const statements: SQL[] = [];
  for (let i = 0; i === 0 || i < updates.length; i += 500) {
    const chunk = updates.slice(i, i + 500);
    const lanes = chunk.length === 0 ? sql`` : sql`, lanes as (
      update run_lanes set result_tenths = v.result, derived = v.derived, needs_review = v.review, review_reason = v.reason
      from (values ${sql.join(chunk, sql`, `)}) as v(run_id, lane, result, derived, review, reason)
      where run_lanes.run_id = v.run_id and run_lanes.lane = v.lane returning 1)`;
    // the first statement also holds the club days these runs may belong to against a concurrent close (club-day-locks.ts)
    const first = sql`with ${restamp}${folds}${lanes}, held_days as (${holdOpenDays(idList)})
      select last_value, is_called, (select count(*) from held_days) as held_days from sync_seq`;
    statements.push(i === 0 ? first : sql`with ${sql.raw("x as (select 1)")}${lanes} ${seq}`);
  }
  return statements;
}

/**
 * Events a run may hold when its first push stores no folded state: up to this many, the state is folded on the run's
 * next push instead (which reads them back in its one load: no statement more). Most runs are pushed whole, once — a
 * phone back from the field sends each run in one push — so folding (and checking) a state for them did work nothing
 * read; a run that grows folds on its second push and resumes from its third.
 */
export const FOLD_LATER_EVENTS = 500;

/** Whether this full derivation stores no folded state: the push stored the run's first events, and they are few. */
const foldsLater = (run: LoadedRun, added: ReadonlyMap<string, readonly DerivationEvent[]>, events: number) =>
  run.eventCount === 0 && (added.get(run.id)?.length ?? 0) > 0 && events <= FOLD_LATER_EVENTS;

/**
 * A run of this many stored events or more is long: its push yields the event loop between its heavy
 * synchronous stages (resuming the fold, each lane's JSON, the state's JSON), so the other pushes and pulls
 * served by this process run in between instead of waiting for the whole stretch (DEVELOPERS.md, Sync).
 */
const LONG_RUN_EVENTS = 1_000;

/** Lets every callback already waiting in this process run first (a macrotask, not a microtask). */
const yieldToOthers = () => new Promise<void>((resolve) => setImmediate(resolve));

/**
 * A value's JSON as a statement's parameter in PostgreSQL's binary input of `type` (jsonb_recv: a version
 * byte, 1, then the text; json_recv: the text), UTF-8 in a Buffer, which node-postgres copies into the bind
 * as it is. Passed as a string, a long run's ~1.2 MB of JSON took node-postgres ~15–30 ms of one
 * synchronous stretch to write into the bind, against well under a millisecond for the Buffer (DEVELOPERS.md,
 * Sync). For a long run the event loop is yielded after the text and after its bytes: V8's `JSON.stringify` of a
 * large value returns a rope, and making its UTF-8 flattens it (~6 ms per MB).
 */
async function jsonParam(value: unknown, type: "json" | "jsonb", run: LoadedRun): Promise<Buffer> {
  const text = JSON.stringify(value);
  const long = run.eventCount >= LONG_RUN_EVENTS;
  if (long) await yieldToOthers();
  const head = type === "jsonb" ? 1 : 0;
  const bytes = Buffer.allocUnsafe(head + Buffer.byteLength(text));
  if (head) bytes[0] = 1;
  bytes.write(text, head);
  if (long) await yieldToOthers();
  return bytes;
}

const factsOf = (run: LoadedRun) => ({ task: parseTaskDefinition(run.task), createdBy: run.createdBy, lanes: run.lanes, officials: NO_OFFICIALS });

/**
 * These runs' lanes derived from all their stored events as storeDerivations derives them in full (the
 * same facts, events and estimates), with records chosen by hand in place of the conflict rules' pick:
 * `standing` is run → lane → device (lib/results DerivationInput.standing). Reads only; stores nothing:
 * a club day's decisions are the day's (db/queries/club-day-board.ts), not the run's stored result.
 */
export async function deriveWithStanding(tx: Tx, standing: ReadonlyMap<string, ReadonlyMap<number, string>>): Promise<Map<string, LaneDerivation[]>> {
  const out = new Map<string, LaneDerivation[]>();
  if (standing.size === 0) return out;
  const load = await loadForPush(tx, { runIds: [...standing.keys()], eventIds: [], deviceId: "", seqs: [], allEvents: true });
  for (const run of load.runs.values()) {
    const events = [...(run.events ?? [])].sort((a, b) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
    out.set(run.id, deriveRun({ ...factsOf(run), events, estimatesByDevice: load.estimates, standing: standing.get(run.id) }));
  }
  return out;
}

/** Derive every run in the database (the demo seed stores events without results). */
export async function deriveAllRuns(tx: Tx, chunk = 200): Promise<number> {
  const all = await tx.select({ id: runs.id }).from(runs).orderBy(runs.serverSeq);
  for (let i = 0; i < all.length; i += chunk) await deriveAndStoreRuns(tx, all.slice(i, i + chunk).map((r) => r.id));
  return all.length;
}
