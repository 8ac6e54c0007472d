/**
 * What the season routes answer (db/queries/season → /api/pilots/[pilotId]/season/**): plain JSON
 * values. Times are integer tenths of a second, shares fractions of the task's maximum (0–1),
 * weeks the Monday they start on and days calendar days, both "YYYY-MM-DD" in UTC.
 */

export type MonthSummary = { start: string; runs: number; flights: number; share: number | null; turnaroundTenths: number | null };

export type SeasonSummary = {
  /** The pilot's hangar, for the model filter (not filtered). */
  models: { id: string; name: string }[];
  /** The names of the fields where the pilot's sessions were, for the field filter (not filtered). */
  fields: string[];
  totals: { runs: number; flights: number };
  months: { this: MonthSummary; last: MonthSummary };
  /** The best result per task (task letter or "custom"), with the run that flew it. */
  bests: { task: string; resultTenths: number; maxTenths: number | null; runId: string; day: string }[];
  shareByWeek: { week: string; task: string; share: number; runs: number }[];
  /** Ground time from a landing to the next launch in the same window. */
  turnaroundByWeek: { week: string; count: number; medianTenths: number; p90Tenths: number }[];
  /** Slope of the weekly median turnaround, tenths of a second per week (negative: getting faster); null under two weeks. */
  turnaroundTrend: number | null;
  /** Flights with a target (ladders, poker calls): how far over or under it they landed. */
  targets: { targetSec: number; flights: number; over: number; under: number; meanOverTenths: number; meanUnderTenths: number }[];
  /** Landed flights by duration: [fromSec, toSec) bins; toSec null for the last, open bin. */
  durations: { fromSec: number; toSec: number | null; flights: number }[];
  launchesByWeek: { week: string; windows: number; launches: number }[];
  /** Points lost by cause (tenths of a second, lib/tasks/breakdown.ts) and penalty points, per week. */
  lostByWeek: {
    week: string;
    groundTime: number;
    overCap: number;
    shortOfTarget: number;
    invalid: number;
    notCounted: number;
    roundZero: number;
    penaltyPoints: number;
  }[];
  /**
   * Launch heights an altimeter log matched to the season's flights (metres, one decimal): how many,
   * their median, and the slope of flight time on launch height (seconds more per 10 m more, landed
   * flights; null under two).
   */
  heights: { launches: number; medianM: number | null; secondsPerTenMetres: number | null };
  /** Per week: the matched launches, their median and the best. */
  heightByWeek: { week: string; launches: number; medianM: number; bestM: number }[];
  /** Landed flights with a launch height, by 10 m of launch height ([fromM, toM); toM null for the open last bin): the median flight time. */
  heightVsTime: { fromM: number; toM: number | null; flights: number; medianTenths: number }[];
};

export type SeasonRunRow = {
  runId: string;
  lane: number;
  /** ISO instant with offset. */
  at: string;
  field: string;
  task: string;
  resultTenths: number;
  maxTenths: number | null;
  share: number | null;
  flights: number;
  lostTenths: number | null;
  penaltyPoints: number;
  contest: boolean;
};

export type SeasonFlightRow = {
  runId: string;
  lane: number;
  at: string;
  field: string;
  task: string;
  /** 1-based, as the run page numbers flights. */
  flight: number;
  launchTenths: number;
  landTenths: number | null;
  durationTenths: number;
  creditedTenths: number;
  targetSec: number | null;
  status: string;
  /** Ground time since the lane's previous landing; null for the first flight of the window. */
  turnaroundTenths: number | null;
};

export type SeasonPage<Row> = { rows: Row[]; total: number; page: number; size: number };
