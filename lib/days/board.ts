// The Day board's aggregates, from the lanes of the runs that belong to the day (matching.ts).
// Every result is the lane's runResult: the stored one (run_lanes.result_tenths), or for a lane an
// officer decided, runResult with the chosen record standing (db/queries/club-day-decided.ts). The
// board adds nothing of its own to a run's score. Pure: no framework, no I/O.
import { offsetAt, type ClockEstimate } from "@/lib/clock";
import { flightInstants } from "@/lib/results/flight-instants";
import { median } from "@/lib/hangar/stats";
import { buildLiftTimeline, type LiftBin } from "./lift-timeline";

export type BoardLaneInput = {
  runId: string;
  startMs: number;
  fieldName: string;
  taskCode: string;
  createdBy: string;
  lane: number;
  pilotId: string;
  /** "own" (the pilot set the run up) or "accepted"/"pending" (recorded for them); disputed and hidden never reach here. */
  consent: "own" | "accepted" | "pending";
  resultTenths: number | null;
  needsReview: boolean;
  /** run_lanes.derived as stored. */
  derived: unknown;
  /**
   * The lane's flights' turnarounds: lane_flights.ground_ms where it counts as one (db/queries/season/turnaround.ts
   * isTurnaround), else null (first flight, previous one never landed, or a task whose flights start on a signal).
   */
  groundMs: readonly (number | null)[];
  /** The result follows an officer's decision on the day (db/queries/club-day-decided.ts), not the stored one. */
  decided?: boolean;
};

export type BoardDevice = {
  deviceId: string;
  ownerId: string;
  /** Device wall time of its first event in the day's runs: where its offset is read. */
  firstWallMs: number;
  estimates: readonly ClockEstimate[];
};

type StoredVersion = { deviceId?: unknown; recordedBy?: unknown; chosen?: unknown; resultTenths?: unknown; flights?: { launchAtMs?: unknown; landAtMs?: unknown }[] };
type StoredLane = { versions?: StoredVersion[]; source?: { deviceId?: unknown } | null } | null | undefined;

export type BoardRun = {
  runId: string;
  startMs: number;
  fieldName: string;
  taskCode: string;
  createdBy: string;
  lanes: {
    lane: number;
    pilotId: string;
    pending: boolean;
    needsReview: boolean;
    resultTenths: number | null;
    /** The result is the record an officer chose for the day, not the conflict rules' (the run page keeps theirs). */
    decided: boolean;
    /** Who timed it: the recorder of the version the result comes from (the creator when no version yet). */
    timedBy: string;
    flights: { launchAtMs: number; landAtMs: number | null; timeTenths: number }[];
  }[];
};

export type BestRow = { pilotId: string; resultTenths: number; runId: string; windows: number };
export type FlightLeader = { pilotId: string; longestTenths: number; totalTenths: number; flights: number };
export type TurnaroundLeader = { pilotId: string; medianGroundMs: number; turns: number };
export type TimedPair = { timerId: string; pilotId: string; lanes: number };
export type ClockRow = { deviceId: string; ownerId: string; offsetMs: number | null; uncertaintyMs: number | null };
/** One phone's version of a lane as stored (run_lanes.derived.versions): its result is runResult's for that record. */
export type BoardVersion = {
  deviceId: string;
  recordedBy: string;
  chosen: boolean;
  resultTenths: number;
  flights: number;
  /** Its flights' instants on the corrected clock (landAtMs null: not landed in that record). */
  flightTimes: { launchAtMs: number; landAtMs: number | null }[];
};
export type Disagreement = { runId: string; lane: number; pilotId: string; versions: BoardVersion[] };

/** An officer's decision on a lane recorded differently: whose version stands (null: a note only), who and when. */
export type DayDecision = { deviceId: string | null; note: string; decidedBy: string | null; decidedAt: string };

export type DayBoard = {
  runs: BoardRun[];
  best: { taskCode: string; rows: BestRow[] }[];
  flightLeaders: FlightLeader[];
  turnaroundLeaders: TurnaroundLeader[];
  timed: TimedPair[];
  clocks: ClockRow[];
  disagreements: Disagreement[];
  lift: LiftBin[];
};

/** What the Day board route answers: the aggregates, the day's fields and the names they mention. */
export type DayBoardView = Omit<DayBoard, "disagreements"> & {
  disagreements: (Disagreement & { decision: DayDecision | null })[];
  day: string;
  /** The club's time zone: the day is a date on its clock, and the board shows times on it. */
  timeZone: string;
  fields: { id: string; name: string }[];
  closedAt: string | null;
  /** Who closed the day (a user id; their name is in `people` when they are a member). */
  closedBy: string | null;
  /** Names of the people the board mentions (members of the club only). */
  people: Record<string, string>;
};

const str = (v: unknown): string | null => (typeof v === "string" ? v : null);
const num = (v: unknown): number | null => (typeof v === "number" && Number.isFinite(v) ? v : null);

function versionsOf(derived: unknown): BoardVersion[] {
  const out: BoardVersion[] = [];
  for (const v of (derived as StoredLane)?.versions ?? []) {
    const deviceId = str(v.deviceId);
    const recordedBy = str(v.recordedBy);
    const resultTenths = num(v.resultTenths);
    if (deviceId === null || recordedBy === null || resultTenths === null) continue;
    const flights = Array.isArray(v.flights) ? v.flights : [];
    const flightTimes = flights.flatMap((f) => {
      const launchAtMs = num(f?.launchAtMs);
      return launchAtMs === null ? [] : [{ launchAtMs, landAtMs: num(f?.landAtMs) }];
    });
    out.push({ deviceId, recordedBy, chosen: v.chosen === true, resultTenths, flights: flights.length, flightTimes });
  }
  return out;
}

/** Whether two phones' versions of a lane differ in result or in number of flights. */
function recordedDifferently(versions: BoardVersion[]): boolean {
  return versions.length > 1 && versions.some((v) => v.resultTenths !== versions[0]!.resultTenths || v.flights !== versions[0]!.flights);
}

const byResult = (a: BestRow, b: BestRow) => b.resultTenths - a.resultTenths || (a.pilotId < b.pilotId ? -1 : 1);

/**
 * `day` bounds the lift timeline: a run a pilot chose for the day from another date is listed with
 * its results, but only flights launched within the day paint its air.
 */
export function buildDayBoard(lanes: readonly BoardLaneInput[], devices: readonly BoardDevice[], day: { startMs: number; endMs: number }): DayBoard {
  const runs = new Map<string, BoardRun>();
  const best = new Map<string, Map<string, BestRow>>();
  const flown = new Map<string, FlightLeader>();
  const ground = new Map<string, number[]>();
  const timed = new Map<string, TimedPair>();
  const disagreements: Disagreement[] = [];
  const liftFlights: { pilotId: string; launchedAtMs: number; durationMs: number }[] = [];

  const sorted = [...lanes].sort((a, b) => a.startMs - b.startMs || (a.runId < b.runId ? -1 : a.runId > b.runId ? 1 : a.lane - b.lane));
  for (const l of sorted) {
    const run = runs.get(l.runId) ?? { runId: l.runId, startMs: l.startMs, fieldName: l.fieldName, taskCode: l.taskCode, createdBy: l.createdBy, lanes: [] };
    runs.set(l.runId, run);
    const versions = versionsOf(l.derived);
    const timedBy = versions.find((v) => v.chosen)?.recordedBy ?? l.createdBy;
    const flights = flightInstants(l.derived).map((f) => ({ launchAtMs: f.launchAtMs, landAtMs: f.landAtMs, timeTenths: f.timeTenths }));
    run.lanes.push({ lane: l.lane, pilotId: l.pilotId, pending: l.consent === "pending", needsReview: l.needsReview, resultTenths: l.resultTenths, decided: l.decided === true, timedBy, flights });

    if (l.resultTenths !== null) {
      const perPilot = best.get(l.taskCode) ?? new Map<string, BestRow>();
      best.set(l.taskCode, perPilot);
      const was = perPilot.get(l.pilotId);
      if (!was) perPilot.set(l.pilotId, { pilotId: l.pilotId, resultTenths: l.resultTenths, runId: l.runId, windows: 1 });
      else {
        was.windows += 1;
        if (l.resultTenths > was.resultTenths) Object.assign(was, { resultTenths: l.resultTenths, runId: l.runId });
      }
    }

    const landed = flights.filter((f) => f.landAtMs !== null && f.timeTenths > 0);
    if (landed.length > 0) {
      const leader = flown.get(l.pilotId) ?? { pilotId: l.pilotId, longestTenths: 0, totalTenths: 0, flights: 0 };
      flown.set(l.pilotId, leader);
      for (const f of landed) {
        leader.longestTenths = Math.max(leader.longestTenths, f.timeTenths);
        leader.totalTenths += f.timeTenths;
        leader.flights += 1;
        if (f.launchAtMs >= day.startMs && f.launchAtMs < day.endMs) liftFlights.push({ pilotId: l.pilotId, launchedAtMs: f.launchAtMs, durationMs: f.timeTenths * 100 });
      }
    }
    const turns = l.groundMs.filter((g): g is number => g !== null && Number.isFinite(g) && g >= 0);
    if (turns.length > 0) ground.set(l.pilotId, [...(ground.get(l.pilotId) ?? []), ...turns]);

    if (timedBy !== l.pilotId) {
      const key = `${timedBy}→${l.pilotId}`;
      const pair = timed.get(key) ?? { timerId: timedBy, pilotId: l.pilotId, lanes: 0 };
      pair.lanes += 1;
      timed.set(key, pair);
    }
    if (recordedDifferently(versions)) disagreements.push({ runId: l.runId, lane: l.lane, pilotId: l.pilotId, versions });
  }

  const clocks: ClockRow[] = devices
    .map((d) => {
      const at = offsetAt(d.estimates, d.firstWallMs);
      return { deviceId: d.deviceId, ownerId: d.ownerId, offsetMs: at?.thetaMs ?? null, uncertaintyMs: at?.uncertaintyMs ?? null };
    })
    .sort((a, b) => (a.ownerId < b.ownerId ? -1 : a.ownerId > b.ownerId ? 1 : a.deviceId < b.deviceId ? -1 : 1));

  return {
    runs: [...runs.values()],
    best: [...best.entries()].sort(([a], [b]) => (a < b ? -1 : 1)).map(([taskCode, rows]) => ({ taskCode, rows: [...rows.values()].sort(byResult) })),
    flightLeaders: [...flown.values()].sort((a, b) => b.longestTenths - a.longestTenths || b.totalTenths - a.totalTenths || (a.pilotId < b.pilotId ? -1 : 1)),
    turnaroundLeaders: [...ground.entries()]
      .map(([pilotId, times]) => ({ pilotId, medianGroundMs: median(times) ?? 0, turns: times.length }))
      .sort((a, b) => a.medianGroundMs - b.medianGroundMs || (a.pilotId < b.pilotId ? -1 : 1)),
    timed: [...timed.values()].sort((a, b) => b.lanes - a.lanes || (a.timerId + a.pilotId < b.timerId + b.pilotId ? -1 : 1)),
    clocks,
    disagreements,
    lift: buildLiftTimeline(liftFlights),
  };
}
