import "server-only";
import { sql } from "drizzle-orm";
import type { EventBody } from "@/lib/events/schema";
import type { RunDiscard } from "@/lib/events/entities";
import { wasStarted } from "@/lib/results";
import { reject, type PushContext } from "./sync-push-entities";

/**
 * Delete the unstarted windows a device deleted (pushed `discards`, acked by the run's id), each
 * on its own verdict:
 * - a run the server does not hold: applied when it was deleted before (a replay) or never
 *   arrived (the phone deleted it before its push went out) — nothing to do either way;
 * - a run the user neither set up nor owns the session of: refused;
 * - a run with a start or a launch that still counts (lib/results wasStarted, the rule the
 *   phone applies before it queues the deletion): refused, its events are the record;
 * - otherwise the run goes, with its lanes, events and consents (foreign keys cascade), so no
 *   result or logbook can show it, and a `run_deletions` row names it to everyone who could
 *   see it, whose phones drop it at their next pull (db/queries/sync-pull.ts).
 * The run's row is locked first, so an event pushed at the same moment either lands before
 * (and is counted here) or finds no run.
 */
export async function applyDiscards(ctx: PushContext, discards: readonly RunDiscard[]): Promise<void> {
  for (const { id } of discards) {
    if (ctx.acks.some((a) => a.id === id)) continue; // the same id twice in one push: answered once
    const run = await ctx.tx.execute<{ created_by: string; owner_id: string }>(sql`
      select r.created_by::text, s.owner_id::text from runs r join field_sessions s on s.id = r.session_id
      where r.id = ${id}::uuid for update of r`);
    const row = run.rows[0];
    if (!row) {
      ctx.acks.push({ id, status: "applied" });
      continue;
    }
    if (row.created_by !== ctx.userId && row.owner_id !== ctx.userId) {
      reject(ctx, id, "Only the account that set up this window can delete it.");
      continue;
    }
    const events = await ctx.tx.execute<{ id: string; body: EventBody }>(sql`select id::text, body from events where run_id = ${id}::uuid order by server_seq`);
    if (wasStarted(events.rows)) {
      reject(ctx, id, "This window was started: its record stays and it cannot be deleted.");
      continue;
    }
    await ctx.tx.execute(sql`
      insert into run_deletions (run_id, deleted_by, seen_by)
      select r.id, ${ctx.userId}::uuid, array(
        select s.owner_id
        union select r.created_by
        union select l.pilot_user_id from run_lanes l where l.run_id = r.id and l.pilot_user_id is not null
        union select g.coach_id from coach_grants g join run_lanes l on l.pilot_user_id = g.pilot_id
          where l.run_id = r.id and g.revoked_at is null)
      from runs r join field_sessions s on s.id = r.session_id where r.id = ${id}::uuid
      on conflict (run_id) do nothing`);
    await ctx.tx.execute(sql`delete from runs where id = ${id}::uuid`);
    ctx.acks.push({ id, status: "applied" });
  }
}
