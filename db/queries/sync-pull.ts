import "server-only";
import { sql } from "drizzle-orm";
import { PULL_DEFAULT_LIMIT, readPullCursor, type PulledModel, type PullReply } from "@/lib/validations/sync";
import { FORGET_MAX, forgottenLanes, forgottenRuns } from "./sync-forget";
import { loadItems, type ChangeRow } from "./sync-pull-items";
import { visibility } from "./sync-visibility";
import { notesFor } from "./coach/notes";
import { plansOfPilot } from "./coach/plans";
import { coachingFingerprint } from "@/lib/coach/fingerprint";
import { dutiesOf } from "./contest-timekeepers";
import type { Database } from "../index";
import type { Executor } from "./sync-db";

/** Items per pull page. */
export const PULL_PAGE_SIZE = PULL_DEFAULT_LIMIT;

/**
 * Everything the user may see that changed after `cursor`, one page at a time (SYNC.md §3):
 * sessions they own, the runs and events `visibility` allows. A run in someone else's session
 * carries that session with it; every run carries its derived results, its recorder and its
 * lanes' consent; a coach's copy of a shared run carries only the lanes, results and events of
 * pilots who granted access (sync-pull-items.ts).
 *
 * Gap-free without serialising writers: rows go in (xid, server_seq) order, xid being the id of
 * the transaction that wrote them, and only rows of transactions older than every transaction
 * still running (`pg_snapshot_xmin`) are served. Every transaction that commits later has an
 * xid at or above that horizon, so its rows sort after any cursor handed out now: a row that
 * commits late is never skipped, and a row served is never served again unless rewritten.
 * The horizon is the cluster's: a long write transaction anywhere holds every pull back until it
 * ends (safe, but a stall; keep write transactions short).
 *
 * Visibility is decided now, so rows that became visible through a new coach grant or a pilot's
 * acceptance may lie below the user's cursor: every reply carries `scope`, a fingerprint of the
 * active grants and of the coached pilots' accepted lanes, and a device that sees it change pulls
 * again from the start — where the first page also names the runs it must forget (sync-forget.ts).
 * Unstarted windows deleted by their recorder (run_deletions, db/queries/run-discard.ts) are rows
 * of the same order: each page names those after the cursor that the user could see in `forget`.
 * The last page carries the user's hangar and contest duties whole, and the coach notes and plans
 * they may read whole unless the device's `coaching` fingerprint shows it holds them already.
 */
export async function listChanges(db: Database, params: PullParams): Promise<PullReply> {
  // one connection and one snapshot for the whole page: a pull waits for the pool once, and its
  // queries agree with each other
  return db.transaction((tx) => changesPage(tx, params), { isolationLevel: "repeatable read", accessMode: "read only" });
}

/** `coaching`: the fingerprint of the notes and plans the device holds (pullQuerySchema.coaching). */
type PullParams = { userId: string; cursor: string | number; limit?: number; total?: boolean; coaching?: string };

async function changesPage(db: Executor, params: PullParams): Promise<PullReply> {
  const limit = params.limit ?? PULL_PAGE_SIZE;
  const { userId } = params;
  const at = readPullCursor(String(params.cursor));
  const after = (t: string) => sql`(${sql.raw(t)}.xid, ${sql.raw(t)}.server_seq) > (${at.xid}::xid8, ${at.seq}::bigint)
    and ${sql.raw(t)}.xid < (select xmin from horizon)`;
  // events run by run through (run_id, xid, server_seq): a page needs at most limit + 1 of each
  // run's, and reading every user's events after the cursor to keep the visible ones grew with the
  // whole server (the count, `total`, takes them all)
  const changes = (perRun: number | null) => sql`${visibility(userId)}, horizon as (select pg_snapshot_xmin(pg_current_snapshot()) as xmin), changes as (
      select 'session' as type, s.xid, s.server_seq as seq, s.id from field_sessions s
        where ${after("s")} and s.owner_id = ${userId}
      union all
      select 'run', r.xid, r.server_seq, r.id from visible_runs v join runs r on r.id = v.id
        where ${after("r")}
      union all
      select 'event', e.xid, e.server_seq, e.id from visible_runs v cross join lateral (
        select e.xid, e.server_seq, e.id from events e
        where e.run_id = v.id and ${after("e")}
        order by e.xid, e.server_seq ${perRun === null ? sql`` : sql`limit ${perRun}`}) e
      union all
      select 'deleted', d.xid, d.server_seq, d.run_id from run_deletions d
        where ${after("d")} and ${userId}::uuid = any(d.seen_by)
    )`;
  // the page's rows and the user's scope in one statement: one row with a null type when nothing changed
  const res = await db.execute<{ scope: string; type: ChangeRow["type"] | "deleted" | null; seq: string; id: string; xid: string }>(
    sql`${changes(limit + 1)}, page as (select type, xid, seq, id from changes order by changes.xid, seq limit ${limit + 1})
      select ${SCOPE} as scope, p.type, p.xid::text as xid, p.seq, p.id::text as id
      from (select 1) one left join page p on true order by p.xid, p.seq`,
  );
  // "" when the user coaches nobody: then no run is cut to a coach's lanes and loadItems skips that look-up
  const scope = res.rows[0]?.scope ?? "";
  const found = res.rows.flatMap(({ type, seq, id, xid }) => (type === null ? [] : [{ type, seq, id, xid }]));
  const rows = found.slice(0, limit);
  const hasMore = found.length > limit;
  const total = params.total ? Number((await db.execute<{ n: string }>(sql`${changes(null)} select count(*) as n from changes`)).rows[0]?.n ?? 0) : undefined;
  const deleted = rows.filter((r) => r.type === "deleted").map((r) => r.id);
  const changed = rows.filter((r): r is ChangeRow & { xid: string } => r.type !== "deleted");
  const items = await loadItems(db, userId, changed, { coaches: scope !== "" });
  const last = rows.at(-1);
  const reply: PullReply = { items, nextCursor: last ? `${last.xid}.${last.seq}` : `${at.xid}.${at.seq}`, hasMore, scope };
  if (total !== undefined) reply.total = total;
  const forget = new Set(deleted);
  if (at.xid === "0") {
    for (const id of await forgottenRuns(db, userId)) forget.add(id);
    const lanes = await forgottenLanes(db, userId);
    if (lanes.length > 0) reply.forgetLanes = lanes;
  }
  if (forget.size > 0) reply.forget = [...forget].slice(0, FORGET_MAX);
  if (!hasMore) {
    reply.models = await hangarOf(db, userId);
    // notes and plans only when the set differs from what the device holds (its fingerprint, echoed back)
    const [notes, plans] = [await notesFor(db, userId), await plansOfPilot(db, userId)];
    reply.coaching = coachingFingerprint(notes, plans);
    if (params.coaching !== reply.coaching) Object.assign(reply, { notes, plans });
    reply.contestDuties = await dutiesOf(db, userId);
  }
  return reply;
}

/** The user's own models for the phone's lane picker (pullReplySchema.models), in the hangar's order. */
async function hangarOf(db: Executor, userId: string): Promise<PulledModel[]> {
  const res = await db.execute<PulledModel>(sql`
    select id::text as id, name, status from models where owner_id = ${userId}
    order by case status when 'flying' then 0 when 'being-repaired' then 1 else 2 end, name`);
  return res.rows;
}

/**
 * Fingerprint of what the user sees as a coach ("" with no grants): the granting pilots and the
 * lanes others recorded for them that they accepted. An expression over visibility()'s `coached`.
 */
const SCOPE = sql`case when not exists (select 1 from coached) then '' else md5(
      coalesce((select string_agg(pilot_id::text, ',' order by pilot_id) from coached), '') || '|' ||
      coalesce((select string_agg(c.run_id::text || ':' || c.lane, ',' order by c.run_id, c.lane) from lane_consents c
                where c.pilot_user_id in (select pilot_id from coached) and c.status = 'accepted'), '')
    ) end`;
