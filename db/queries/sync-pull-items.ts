import "server-only";
import { storedOffset } from "@/lib/clock";
import { sql, type SQL } from "drizzle-orm";
import type { RunEvent } from "@/lib/events/schema";
import type { RunEntity, SessionEntity } from "@/lib/events/entities";
import { consentStatus, type ConsentDecision } from "@/lib/sync/consent";
import type { LaneConsent } from "@/lib/validations/consent";
import type { LaneResult, PullItem } from "@/lib/validations/sync";
import type { Executor } from "./sync-db";
import { visibility } from "./sync-visibility";

/** One changed row of a pull page. */
export type ChangeRow = { type: "session" | "run" | "event"; seq: string; id: string };

const ids = (rows: ChangeRow[], type: ChangeRow["type"]) => rows.filter((r) => r.type === type).map((r) => sql`${r.id}::uuid`);
const inList = (list: ReturnType<typeof ids>) => (list.length ? sql.join(list, sql`, `) : sql`null`);

/**
 * The records of one pull page. Runs the user sees only as a coach (`coach_lanes`) are cut to
 * the lanes they may see: other pilots' lanes, names, results and consents are left out, and so
 * are events on those lanes (an undo or correction belongs to the lane of the event it amends).
 */
export async function loadItems(db: Executor, userId: string, rows: ChangeRow[], opts: { coaches: boolean }): Promise<PullItem[]> {
  const sessionIds = ids(rows, "session");
  const runIds = ids(rows, "run");
  const eventIds = ids(rows, "event");
  // a query with nothing to look up is not sent: an idle pull (no change since the cursor) sends none
  const rowsOf = async <T extends Record<string, unknown>>(needed: boolean, query: SQL) => (needed ? (await db.execute<T>(query)).rows : []);
  // one connection may be a transaction: queries run one after another
  const sessions = await rowsOf<SessionRow>(sessionIds.length + runIds.length > 0, sql`select ${SESSION_COLS} from field_sessions s
      where s.id in (${inList(sessionIds)})
         or s.id in (select session_id from runs where id in (${inList(runIds)}))`);
  const runs = await rowsOf<RunRow>(runIds.length > 0, sql`select r.id, r.session_id, r.task, r.created_at, r.created_by, u.name as creator_name, r.plan_id, r.plan_item,
        (select json_agg(json_build_object('lane', l.lane, 'pilotName', l.pilot_name, 'pilotUserId', l.pilot_user_id,
           'resultTenths', l.result_tenths, 'needsReview', l.needs_review, 'reviewReason', l.review_reason,
           'penaltyPoints', l.derived->'breakdown'->'penaltyPoints', 'versions', l.derived->'versions', 'notes', l.derived->'notes',
           'derived', l.derived is not null, 'decision', c.status, 'reason', c.reason)
           order by l.lane) from run_lanes l left join lane_consents c on c.run_id = l.run_id and c.lane = l.lane
           where l.run_id = r.id) as lanes
      from runs r join users u on u.id = r.created_by where r.id in (${inList(runIds)})`);
  const events = await rowsOf<EventRow>(eventIds.length > 0, sql`select e.id, e.run_id, e.device_id, e.seq, e.recorded_by, e.body, e.wall_ms, e.mono_ms, e.page_id,
        e.offset_theta_ms, e.offset_delta_ms, e.offset_measured_at_ms
      from events e where e.id in (${inList(eventIds)})`);
  // a user who coaches nobody (no active grant: the pull's scope is "") sees every run it gets whole
  const limited = opts.coaches ? await coachLanes(db, userId, [...new Set([...runs.map((r) => r.id), ...events.map((e) => e.run_id)])]) : new Map<string, Set<number>>();
  const eventLane = await eventLanes(db, events.filter((e) => limited.has(e.run_id)));

  const sessionById = new Map(sessions.map((s) => [s.id, s]));
  const runById = new Map(runs.map((r) => [r.id, r]));
  const eventById = new Map(events.map((e) => [e.id, e]));
  const out: PullItem[] = [];
  for (const row of rows) {
    const seq = Number(row.seq);
    if (row.type === "session") {
      const s = sessionById.get(row.id);
      if (s) out.push({ type: "session", seq, data: toSession(s) });
    } else if (row.type === "run") {
      const r = runById.get(row.id);
      if (!r) continue;
      const allowed = limited.get(r.id);
      const lanes = (r.lanes ?? []).filter((l) => !allowed || allowed.has(l.lane));
      const session = sessionById.get(r.session_id);
      const item: PullItem = {
        type: "run", seq, data: toRun(r, lanes), recordedBy: { id: r.created_by, name: r.creator_name }, consents: toConsents(r, lanes),
      };
      if (session && session.owner_id !== userId) item.session = toSession(session);
      const results = toResults(lanes);
      if (results) item.results = results;
      out.push(item);
    } else {
      const e = eventById.get(row.id);
      if (!e) continue;
      const allowed = limited.get(e.run_id);
      const lane = eventLane.get(e.id);
      if (allowed && lane !== undefined && lane !== null && !allowed.has(lane)) continue;
      out.push({ type: "event", seq, data: toEvent(e) });
    }
  }
  return out;
}

/** For the runs the user sees only as a coach: the lanes they may see, by run. */
async function coachLanes(db: Executor, userId: string, runIds: string[]): Promise<Map<string, Set<number>>> {
  const out = new Map<string, Set<number>>();
  if (runIds.length === 0) return out;
  const res = await db.execute<{ run_id: string; lane: number }>(sql`${visibility(userId)}
    select run_id::text, lane from coach_lanes where run_id in (${sql.join(runIds.map((id) => sql`${id}::uuid`), sql`, `)})`);
  for (const r of res.rows) out.set(r.run_id, (out.get(r.run_id) ?? new Set()).add(r.lane));
  return out;
}

/**
 * The lane each event belongs to (null: the run's signals): its own, or for an undo or a
 * correction the lane of the event it amends, followed through undos of undos.
 */
async function eventLanes(db: Executor, list: EventRow[]): Promise<Map<string, number | null>> {
  const out = new Map<string, number | null>();
  if (list.length === 0) return out;
  const runIds = [...new Set(list.map((e) => e.run_id))];
  const all = await db.execute<{ id: string; body: RunEvent["body"] }>(sql`select e.id, e.body from events e
    where e.run_id in (${sql.join(runIds.map((id) => sql`${id}::uuid`), sql`, `)})`);
  const bodyOf = new Map(all.rows.map((e) => [e.id, e.body]));
  for (const e of list) {
    let body: RunEvent["body"] | undefined = e.body;
    for (let hops = 0; body && "targetId" in body && hops < 64; hops++) body = bodyOf.get(body.targetId);
    // an amendment whose target is not on the server amends nothing visible: keep it out
    out.set(e.id, body === undefined ? -1 : "lane" in body ? body.lane : null);
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
  notes: NonNullable<LaneResult["notes"]> | null; decision: ConsentDecision | null; reason: string | null;
};
type RunRow = {
  id: string; session_id: string; task: Record<string, unknown>; created_at: Date | string; created_by: string; creator_name: string;
  plan_id: string | null; plan_item: number | null; lanes: LaneJson[] | null;
};
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

function toRun(r: RunRow, lanes: LaneJson[]): RunEntity {
  const run: RunEntity = {
    id: r.id, sessionId: r.session_id, task: r.task, createdAtWallMs: new Date(r.created_at).getTime(),
    lanes: lanes.map((l) => (l.pilotUserId ? { lane: l.lane, pilotName: l.pilotName, pilotUserId: l.pilotUserId } : { lane: l.lane, pilotName: l.pilotName })),
  };
  if (r.plan_id !== null && r.plan_item !== null) run.plan = { id: r.plan_id, item: r.plan_item };
  return run;
}

function toConsents(r: RunRow, lanes: LaneJson[]): LaneConsent[] {
  return lanes.flatMap((l) => {
    const status = consentStatus(r.created_by, l.pilotUserId, l.decision);
    return status === null ? [] : [{ lane: l.lane, status, reason: status === "disputed" ? l.reason : null }];
  });
}

function toResults(lanes: LaneJson[]): LaneResult[] | null {
  if (lanes.length === 0 || lanes.some((l) => !l.derived)) return null;
  return lanes.map((l) => ({
    lane: l.lane, resultTenths: l.resultTenths, penaltyPoints: l.penaltyPoints ?? 0, needsReview: l.needsReview, reviewReason: l.reviewReason,
    versions: (l.versions ?? []).map((v) => ({ deviceId: v.deviceId, official: v.official, chosen: v.chosen, resultTenths: v.resultTenths })),
    notes: (l.notes ?? []).map((n) => ({ kind: n.kind, recordedBy: n.recordedBy, points: n.points, flightIndex: n.flightIndex, reason: n.reason })),
  }));
}

function toEvent(e: EventRow): RunEvent {
  const offset = storedOffset(e.offset_theta_ms, e.offset_delta_ms, e.offset_measured_at_ms);
  return {
    id: e.id, runId: e.run_id, deviceId: e.device_id, seq: e.seq, recordedBy: e.recorded_by,
    stamp: { wallMs: e.wall_ms, monoMs: e.mono_ms, pageId: e.page_id, offset },
    body: e.body,
  };
}
