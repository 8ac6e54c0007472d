import "server-only";
import { sql } from "drizzle-orm";
import type { RunEvent } from "@/lib/events/schema";
import type { RunEntity, SessionEntity } from "@/lib/offline/entities";
import type { LaneResult, PullItem, PullReply } from "@/lib/validations/sync";
import type { Executor } from "./sync-db";

/** Items per pull page. */
export const PULL_PAGE_SIZE = 500;

type Row = { type: "session" | "run" | "event"; seq: string; id: string };

/**
 * Everything the user may see that changed after `cursor`, in server_seq order, one page at a
 * time (SYNC.md §3): sessions they own; runs in those sessions, runs they created (timing
 * someone), runs where they fly a lane, and runs of pilots who granted them coach access
 * (not revoked); the events of all those runs. A run in someone else's session carries that
 * session with it; every run carries its derived results.
 *
 * Visibility is decided now, so rows that became visible through a new coach grant may lie
 * below the user's cursor: every reply carries `scope`, a fingerprint of the active grants, and
 * a device that sees it change pulls again from 0.
 */
export async function listChanges(db: Executor, params: { userId: string; cursor: number; limit?: number }): Promise<PullReply> {
  const limit = params.limit ?? PULL_PAGE_SIZE;
  const { userId, cursor } = params;
  const visible = sql`
    with coached as (
      select pilot_id from coach_grants where coach_id = ${userId} and revoked_at is null
    ), visible_runs as (
      select r.id, r.session_id from runs r join field_sessions s on s.id = r.session_id
      where s.owner_id = ${userId} or r.created_by = ${userId}
         or s.owner_id in (select pilot_id from coached)
         or exists (select 1 from run_lanes l where l.run_id = r.id
                    and (l.pilot_user_id = ${userId} or l.pilot_user_id in (select pilot_id from coached)))
    )`;
  const res = await db.execute<Row>(sql`${visible}
    select * from (
      select 'session' as type, s.server_seq as seq, s.id::text as id from field_sessions s
        where s.server_seq > ${cursor} and s.owner_id = ${userId}
      union all
      select 'run', r.server_seq, r.id::text from runs r
        where r.server_seq > ${cursor} and r.id in (select id from visible_runs)
      union all
      select 'event', e.server_seq, e.id::text from events e
        where e.server_seq > ${cursor} and e.run_id in (select id from visible_runs)
    ) changes order by seq limit ${limit + 1}`);
  const rows = res.rows.slice(0, limit);
  const hasMore = res.rows.length > limit;
  const [items, scope] = await Promise.all([loadItems(db, userId, rows), visibilityScope(db, userId)]);
  const last = rows.at(-1);
  return { items, nextCursor: last ? Number(last.seq) : cursor, hasMore, scope };
}

/** Fingerprint of the pilots whose runs the user sees as their coach ("" with no grants). */
async function visibilityScope(db: Executor, userId: string): Promise<string> {
  const res = await db.execute<{ scope: string }>(sql`
    select coalesce(md5(string_agg(pilot_id::text, ',' order by pilot_id)), '') as scope
    from coach_grants where coach_id = ${userId} and revoked_at is null`);
  return res.rows[0]?.scope ?? "";
}

const ids = (rows: Row[], type: Row["type"]) => rows.filter((r) => r.type === type).map((r) => sql`${r.id}::uuid`);
const inList = (list: ReturnType<typeof ids>) => (list.length ? sql.join(list, sql`, `) : sql`null`);

async function loadItems(db: Executor, userId: string, rows: Row[]): Promise<PullItem[]> {
  const [sessions, runs, events] = await Promise.all([
    db.execute<SessionRow>(sql`select ${SESSION_COLS} from field_sessions s
      where s.id in (${inList(ids(rows, "session"))})
         or s.id in (select session_id from runs where id in (${inList(ids(rows, "run"))}))`),
    db.execute<RunRow>(sql`select r.id, r.session_id, r.task, r.created_at,
        (select json_agg(json_build_object('lane', l.lane, 'pilotName', l.pilot_name, 'pilotUserId', l.pilot_user_id,
           'resultTenths', l.result_tenths, 'needsReview', l.needs_review, 'reviewReason', l.review_reason,
           'penaltyPoints', l.derived->'breakdown'->'penaltyPoints', 'versions', l.derived->'versions', 'derived', l.derived is not null)
           order by l.lane) from run_lanes l where l.run_id = r.id) as lanes
      from runs r where r.id in (${inList(ids(rows, "run"))})`),
    db.execute<EventRow>(sql`select e.id, e.run_id, e.device_id, e.seq, e.recorded_by, e.body, e.wall_ms, e.mono_ms, e.page_id,
        e.offset_theta_ms, e.offset_delta_ms, e.offset_measured_at_ms
      from events e where e.id in (${inList(ids(rows, "event"))})`),
  ]);
  const sessionById = new Map(sessions.rows.map((s) => [s.id, s]));
  const runById = new Map(runs.rows.map((r) => [r.id, r]));
  const eventById = new Map(events.rows.map((e) => [e.id, e]));
  const out: PullItem[] = [];
  for (const row of rows) {
    const seq = Number(row.seq);
    if (row.type === "session") {
      const s = sessionById.get(row.id);
      if (s) out.push({ type: "session", seq, data: toSession(s) });
    } else if (row.type === "run") {
      const r = runById.get(row.id);
      if (!r) continue;
      const session = sessionById.get(r.session_id);
      const item: PullItem = { type: "run", seq, data: toRun(r) };
      if (session && session.owner_id !== userId) item.session = toSession(session);
      const results = toResults(r);
      if (results) item.results = results;
      out.push(item);
    } else {
      const e = eventById.get(row.id);
      if (e) out.push({ type: "event", seq, data: toEvent(e) });
    }
  }
  return out;
}

const SESSION_COLS = sql`s.id, s.owner_id, s.club_id, s.field_name, s.latitude, s.longitude, s.conditions, s.started_at`;
type SessionRow = {
  id: string; owner_id: string; club_id: string | null; field_name: string; latitude: number | null; longitude: number | null;
  conditions: SessionEntity["conditions"]; started_at: Date | string;
};
type LaneJson = {
  lane: number; pilotName: string; pilotUserId: string | null; resultTenths: number | null; needsReview: boolean;
  reviewReason: string | null; penaltyPoints: number | null; versions: LaneResult["versions"] | null; derived: boolean;
};
type RunRow = { id: string; session_id: string; task: Record<string, unknown>; created_at: Date | string; lanes: LaneJson[] | null };
type EventRow = {
  id: string; run_id: string; device_id: string; seq: number; recorded_by: string; body: RunEvent["body"];
  wall_ms: number; mono_ms: number; page_id: string;
  offset_theta_ms: number | null; offset_delta_ms: number | null; offset_measured_at_ms: number | null;
};

function toSession(s: SessionRow): SessionEntity {
  const out: SessionEntity = {
    id: s.id, ownerId: s.owner_id, fieldName: s.field_name, conditions: s.conditions,
    startedAtWallMs: new Date(s.started_at).getTime(),
  };
  if (s.latitude !== null && s.longitude !== null) out.position = { lat: s.latitude, lon: s.longitude };
  if (s.club_id !== null) out.clubId = s.club_id;
  return out;
}

function toRun(r: RunRow): RunEntity {
  return {
    id: r.id, sessionId: r.session_id, task: r.task, createdAtWallMs: new Date(r.created_at).getTime(),
    lanes: (r.lanes ?? []).map((l) => (l.pilotUserId ? { lane: l.lane, pilotName: l.pilotName, pilotUserId: l.pilotUserId } : { lane: l.lane, pilotName: l.pilotName })),
  };
}

function toResults(r: RunRow): LaneResult[] | null {
  const lanes = r.lanes ?? [];
  if (lanes.length === 0 || lanes.some((l) => !l.derived)) return null;
  return lanes.map((l) => ({
    lane: l.lane, resultTenths: l.resultTenths, penaltyPoints: l.penaltyPoints ?? 0, needsReview: l.needsReview, reviewReason: l.reviewReason,
    versions: (l.versions ?? []).map((v) => ({ deviceId: v.deviceId, official: v.official, chosen: v.chosen, resultTenths: v.resultTenths })),
  }));
}

function toEvent(e: EventRow): RunEvent {
  const offset =
    e.offset_theta_ms !== null && e.offset_delta_ms !== null && e.offset_measured_at_ms !== null
      ? { thetaMs: e.offset_theta_ms, deltaMs: e.offset_delta_ms, measuredAtWallMs: e.offset_measured_at_ms }
      : null;
  return {
    id: e.id, runId: e.run_id, deviceId: e.device_id, seq: e.seq, recordedBy: e.recorded_by,
    stamp: { wallMs: e.wall_ms, monoMs: e.mono_ms, pageId: e.page_id, offset }, body: e.body,
  };
}
