import "server-only";
import { sql } from "drizzle-orm";
import type { Database } from "../../index";
import type { Executor } from "../sync-db";
import { flightsOnSignal, isTurnaround } from "../season/turnaround";
import { planItemSchema, planProgress, type PlanInput, type PlanItem, type PlanRun } from "@/lib/coach/plan-goals";
import type { PulledPlan } from "@/lib/validations/coaching-sync";
import type { PlanUpdate } from "@/lib/validations/coach";

/**
 * A coach assigns a plan to a pilot who grants them their season; null (404) without the grant.
 * The items are stored as planInputSchema parsed them.
 */
export async function createPlan(db: Database, p: { coachId: string; pilotId: string; plan: PlanInput }): Promise<PulledPlan | null> {
  const res = await db.execute<{ id: string }>(sql`
    insert into practice_plans (pilot_id, coach_id, title, items)
    select ${p.pilotId}, ${p.coachId}, ${p.plan.title}, ${JSON.stringify(p.plan.items)}::jsonb
    where exists (select 1 from coach_grants g where g.coach_id = ${p.coachId} and g.pilot_id = ${p.pilotId} and g.revoked_at is null)
    returning id::text as id`);
  const id = res.rows[0]?.id;
  return id ? ((await plansWhere(db, sql`p.id = ${id}`))[0] ?? null) : null;
}

/**
 * The coach who made a plan changes it while the pilot still grants them their season: title and
 * items, and/or closed (closed_at set, or cleared to reopen). Null (404) for anyone else.
 */
export async function updatePlan(db: Database, p: { coachId: string; planId: string; change: PlanUpdate }): Promise<PulledPlan | null> {
  const c = p.change;
  const sets = [
    ...("items" in c ? [sql`title = ${c.title}`, sql`items = ${JSON.stringify(c.items)}::jsonb`, sql`updated_at = now()`] : []),
    ...(c.closed === undefined ? [] : [c.closed ? sql`closed_at = coalesce(closed_at, now())` : sql`closed_at = null`]),
  ];
  const res = await db.execute<{ id: string }>(sql`
    update practice_plans p set ${sql.join(sets, sql`, `)}
    where p.id = ${p.planId} and p.coach_id = ${p.coachId}
      and exists (select 1 from coach_grants g where g.coach_id = ${p.coachId} and g.pilot_id = p.pilot_id and g.revoked_at is null)
    returning p.id::text as id`);
  const id = res.rows[0]?.id;
  return id ? ((await plansWhere(db, sql`p.id = ${id}`))[0] ?? null) : null;
}

/** The plans assigned to the pilot (pullReplySchema.plans, the pilot's Field), newest first. */
export function plansOfPilot(db: Executor, pilotId: string): Promise<PulledPlan[]> {
  return plansWhere(db, sql`p.pilot_id = ${pilotId}`);
}

/** The plans a coach assigned to pilots who still grant them their season (the Coach desk), newest first. */
export function plansOfCoach(db: Executor, coachId: string): Promise<PulledPlan[]> {
  return plansWhere(db, sql`p.coach_id = ${coachId} and exists (
    select 1 from coach_grants g where g.coach_id = ${coachId} and g.pilot_id = p.pilot_id and g.revoked_at is null)`);
}

/**
 * Plans with their progress: each plan's runs are those its pilot created from one of its items
 * (runs.plan_id / plan_item), read with the pilot's lane as the push derived it through
 * lib/results (result, the breakdown's maximum) and its turnarounds as the Season counts them
 * (season/turnaround.ts), and judged by lib/coach/plan-goals.
 */
async function plansWhere(db: Executor, where: ReturnType<typeof sql>): Promise<PulledPlan[]> {
  const plans = await db.execute<{
    id: string; pilot_id: string; pilot_name: string; coach_name: string | null; title: string; items: unknown; created_at: string | Date;
    updated_at: string | Date | null; closed_at: string | Date | null; synced_at: string | Date | null;
  }>(sql`select p.id::text, p.pilot_id::text, pu.name as pilot_name, cu.name as coach_name, p.title, p.items, p.created_at,
      p.updated_at, p.closed_at, (select max(d.last_seen_at) from devices d where d.user_id = p.pilot_id) as synced_at
    from practice_plans p join users pu on pu.id = p.pilot_id left join users cu on cu.id = p.coach_id
    where ${where} order by p.created_at desc, p.id limit 1000`);
  if (plans.rows.length === 0) return [];
  const runs = await db.execute<{ plan_id: string; item: number; result_tenths: number | null; max_tenths: number | string | null; ground_ms: unknown }>(sql`
    select r.plan_id::text, r.plan_item as item, l.result_tenths, l.season_max_tenths as max_tenths,
      array(select f.ground_ms from lane_flights f where f.run_id = l.run_id and f.lane = l.lane and ${isTurnaround(sql`f.ground_ms`, flightsOnSignal(sql`r`))} order by f.position) as ground_ms
    from runs r join practice_plans p on p.id = r.plan_id
    join run_lanes l on l.run_id = r.id and l.pilot_user_id = p.pilot_id
    where r.plan_id in (${sql.join(plans.rows.map((p) => sql`${p.id}::uuid`), sql`, `)}) and r.created_by = p.pilot_id`);
  const byPlan = new Map<string, PlanRun[]>();
  for (const r of runs.rows) {
    const list = byPlan.get(r.plan_id) ?? [];
    list.push({ item: Number(r.item), resultTenths: r.result_tenths, maxTenths: r.max_tenths === null ? null : Number(r.max_tenths), groundMs: (r.ground_ms as (number | string)[] | null ?? []).map(Number) });
    byPlan.set(r.plan_id, list);
  }
  return plans.rows.map((p) => {
    const items = readItems(p.items);
    return {
      id: p.id, pilotId: p.pilot_id, pilotName: p.pilot_name, coachName: p.coach_name, title: p.title, items,
      createdAtMs: new Date(p.created_at).getTime(), updatedAtMs: msOrNull(p.updated_at), closedAtMs: msOrNull(p.closed_at),
      pilotSyncedAtMs: msOrNull(p.synced_at), progress: planProgress(items, byPlan.get(p.id) ?? []),
    };
  });
}

const msOrNull = (v: string | Date | null) => (v === null ? null : new Date(v).getTime());

function readItems(raw: unknown): PlanItem[] {
  if (!Array.isArray(raw)) return [];
  return raw.flatMap((i) => {
    const parsed = planItemSchema.safeParse(i);
    return parsed.success ? [parsed.data] : [];
  });
}
