import { z } from "zod";
import { text } from "./bounds";
import { calendarDaySchema } from "./calendar-day";

/**
 * The Season screen's inputs (app/(app)/season, /api/pilots/[pilotId]/season/**): the filters
 * that travel in the page's address and in each request, and the tables' paging and sorting.
 * The model filter keeps the flights the model flew (the model flying at each launch, as the model's
 * page counts them) and the windows with one of them (db/queries/season/scope.ts).
 */

const blankToUndefined = (v: unknown) => (v === "" || v === null ? undefined : v);

export const SEASON_KINDS = ["all", "practice", "contest"] as const;
export type SeasonKind = (typeof SEASON_KINDS)[number];

/** A task filter: a rulebook letter, or "custom" for the pilot's own tasks. */
export const seasonTaskSchema = z.union([z.enum(["A", "B", "C", "D", "E", "F", "G", "H", "I", "J", "K", "L", "M", "N"]), z.literal("custom")]);

export const seasonFiltersSchema = z.object({
  /** First and last calendar day (UTC), both included. */
  from: z.preprocess(blankToUndefined, calendarDaySchema.optional()),
  to: z.preprocess(blankToUndefined, calendarDaySchema.optional()),
  task: z.preprocess(blankToUndefined, seasonTaskSchema.optional()),
  /** The field's name, exactly as the sessions name it. */
  field: z.preprocess(blankToUndefined, text(120).optional()),
  /** Practice (a session outside any contest day), contest, or both. */
  kind: z.preprocess(blankToUndefined, z.enum(SEASON_KINDS).default("all")),
  /** A model of the hangar (its id): lanes flown with it, launches made with it. */
  model: z.preprocess(blankToUndefined, z.uuid("Not a model.").optional()),
});
export type SeasonFilters = z.infer<typeof seasonFiltersSchema>;

export const RUN_SORTS = ["date", "field", "task", "result", "share", "flights"] as const;
export const FLIGHT_SORTS = ["date", "task", "duration", "credited", "turnaround"] as const;
export const PAGE_SIZES = [10, 25, 50, 100] as const;

const paging = {
  page: z.preprocess(blankToUndefined, z.coerce.number().int().min(1).max(100_000).default(1)),
  size: z.preprocess(blankToUndefined, z.coerce.number().pipe(z.union(PAGE_SIZES.map((n) => z.literal(n)))).default(25)),
  dir: z.preprocess(blankToUndefined, z.enum(["asc", "desc"]).default("desc")),
};

export const seasonRunsQuerySchema = seasonFiltersSchema.extend({ ...paging, sort: z.preprocess(blankToUndefined, z.enum(RUN_SORTS).default("date")) });
export type SeasonRunsQuery = z.infer<typeof seasonRunsQuerySchema>;

export const seasonFlightsQuerySchema = seasonFiltersSchema.extend({ ...paging, sort: z.preprocess(blankToUndefined, z.enum(FLIGHT_SORTS).default("date")) });
export type SeasonFlightsQuery = z.infer<typeof seasonFlightsQuerySchema>;

export const seasonExportQuerySchema = seasonFiltersSchema.extend({ what: z.enum(["runs", "flights"]) });

/** The pilot a season route reads, from its path. */
export const seasonParamsSchema = z.object({ pilotId: z.uuid() });

/** The filters as a query string (defaults and empty values left out), in a fixed order so equal filters give equal strings. */
export function seasonFiltersQuery(f: Partial<Record<string, string | number | undefined>>): string {
  const q = new URLSearchParams();
  for (const k of Object.keys(f).sort()) {
    const v = f[k];
    if (v === undefined || v === "" || (k === "kind" && v === "all")) continue;
    q.set(k, String(v));
  }
  return q.toString();
}
