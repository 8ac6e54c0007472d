import "server-only";
import { sql, type SQL } from "drizzle-orm";

/**
 * Which model flew a flight, in SQL: the lane's latest "model" event (not undone) at or before the
 * flight's launch on the corrected clock — the rule of lib/hangar/stats.ts `modelAt`, which the
 * model's page applies to the same events (db/queries/model-record.ts lists them in the order this
 * breaks ties: corrected time, then id). A lane's model swaps are events, so one window can fly
 * two models; the Season's model filter (db/queries/season/scope.ts) counts flights by this.
 */

/** A lane's model events that are not undone by a "void" event. */
const notVoided = sql`not exists (select 1 from events v where v.run_id = e.run_id and v.kind = 'void' and v.body ->> 'targetId' = e.id::text)`;

/** The (not undone) model events of a lane that name `modelId`: a lane without one never flew it. */
export function lanesNamingModel(runId: SQL, lane: SQL, modelId: string): SQL {
  return sql`select 1 from events e where e.run_id = ${runId} and e.kind = 'model' and (e.body ->> 'lane')::int = ${lane}
    and e.body ->> 'modelId' = ${modelId} and ${notVoided}`;
}

/**
 * The launch of the lane_flights row `f` on the corrected clock (epoch ms), from the lane's stored
 * derivation `derived` (run_lanes.derived), as lib/results/flight-instants.ts reads it: the
 * flight's `launchAtMs`, or for a lane derived before flights carried it, the chosen version's
 * flight at the same place; null when neither has it (such a flight has no model).
 */
export function launchAtMs(derived: SQL, f: SQL): SQL {
  return sql`coalesce((${derived} #>> array['flights', ${f}.position::text, 'launchAtMs'])::float8,
    (select (v #>> array['flights', ${f}.position::text, 'launchAtMs'])::float8 from jsonb_array_elements(
      case when jsonb_typeof(${derived} -> 'versions') = 'array' then ${derived} -> 'versions' else '[]'::jsonb end) v
      where (v ->> 'chosen')::boolean limit 1))`;
}

/** The id (text) of the model flying in lane `lane` of run `runId` at `atMs` (corrected clock), or null. */
export function modelAtSql(runId: SQL, lane: SQL, atMs: SQL): SQL {
  return sql`(select e.body ->> 'modelId' from events e where e.run_id = ${runId} and e.kind = 'model' and (e.body ->> 'lane')::int = ${lane}
    and e.corrected_ms <= ${atMs} and ${notVoided} order by e.corrected_ms desc, e.id desc limit 1)`;
}
