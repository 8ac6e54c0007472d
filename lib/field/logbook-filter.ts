/**
 * The logbook's filters (pilot, task, field, date range, one session) as they travel in the
 * page's address, so a filtered view can be shared. Pure: no framework, no storage.
 */
export type LogbookFilters = { pilot: string; task: string; field: string; from: string; to: string; session: string };

export const FILTER_KEYS = ["pilot", "task", "field", "from", "to", "session"] as const satisfies readonly (keyof LogbookFilters)[];

const DATE = /^\d{4}-\d{2}-\d{2}$/;

/** Reads the filters from a query string; an unreadable date is ignored rather than matching nothing. */
export function readFilters(params: { get(name: string): string | null }): LogbookFilters {
  const get = (k: keyof LogbookFilters) => (params.get(k) ?? "").trim().slice(0, 200);
  const date = (k: "from" | "to") => (DATE.test(get(k)) ? get(k) : "");
  return { pilot: get("pilot"), task: get("task"), field: get("field"), from: date("from"), to: date("to"), session: get("session") };
}

/** The query string for the filters (empty ones left out), e.g. "pilot=Kit+Marsh&task=B". */
export function filtersQuery(f: LogbookFilters): string {
  const q = new URLSearchParams();
  for (const k of FILTER_KEYS) if (f[k]) q.set(k, f[k]);
  return q.toString();
}

export const anyFilter = (f: LogbookFilters) => FILTER_KEYS.some((k) => f[k] !== "");

/** A run as the filters see it. `day` is the session's local calendar day, "YYYY-MM-DD". */
export type FilterableRun = { sessionId: string; field: string; day: string; pilots: readonly string[]; taskKey: string };

/** Whether a run passes every filter set (names compared without case or outer spaces). */
export function matchesFilters(run: FilterableRun, f: LogbookFilters): boolean {
  const same = (a: string, b: string) => a.trim().toLocaleLowerCase() === b.trim().toLocaleLowerCase();
  if (f.session && run.sessionId !== f.session) return false;
  if (f.field && !same(run.field, f.field)) return false;
  if (f.task && run.taskKey !== f.task) return false;
  if (f.pilot && !run.pilots.some((p) => same(p, f.pilot))) return false;
  if (f.from && run.day < f.from) return false;
  if (f.to && run.day > f.to) return false;
  return true;
}

/** The local calendar day of a wall-clock instant, "YYYY-MM-DD" (as a date input gives it). */
export function localDay(wallMs: number): string {
  const d = new Date(wallMs);
  const pad = (n: number) => String(n).padStart(2, "0");
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}`;
}

/** Distinct values, sorted for a choice list. */
export function choices(values: Iterable<string>): string[] {
  return [...new Set([...values].map((v) => v.trim()).filter(Boolean))].sort((a, b) => a.localeCompare(b));
}
