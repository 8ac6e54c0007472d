import "server-only";
import { and, asc, eq, sql } from "drizzle-orm";
import type { Database } from "../index";
import { clubDays, clubFields } from "../schema";
import { freezeDayRuns } from "./club-day-board";
import { runIsUsers } from "./run-own";

export type ClubDayRow = { id: string; fieldId: string; fieldName: string; day: string; openedBy: string | null; createdAt: Date };

/**
 * Opens a day at one of the club's fields (the club in the WHERE: another club's field opens nothing).
 * Opening a day that is open already returns it. Null when the field is not the club's; "closed" when
 * the club closed that date already (a new field's day would let its runs in and mail the summary again).
 */
export async function openClubDay(
  db: Database,
  params: { clubId: string; fieldId: string; day: string; userId: string },
): Promise<{ day: ClubDayRow; created: boolean } | "closed" | null> {
  const inserted = await db.execute<{ id: string }>(sql`
    insert into club_days (club_id, field_id, day, opened_by)
    select f.club_id, f.id, ${params.day}::date, ${params.userId}
    from club_fields f where f.id = ${params.fieldId} and f.club_id = ${params.clubId}
      and not exists (select 1 from club_days x where x.club_id = ${params.clubId} and x.day = ${params.day}::date and x.closed_at is not null)
    on conflict (club_id, field_id, day) do nothing
    returning id`);
  const [row] = await listClubDays(db, { clubId: params.clubId, day: params.day, fieldId: params.fieldId });
  if (!row) {
    const closed = await db.execute(sql`select 1 from club_days where club_id = ${params.clubId} and day = ${params.day}::date and closed_at is not null`);
    return closed.rows.length > 0 ? "closed" : null;
  }
  return { day: row, created: inserted.rows.length > 0 };
}

/** The club's open days on one date (each at one field), by field name. */
export async function listClubDays(
  db: Database,
  params: { clubId: string; day: string; fieldId?: string },
): Promise<ClubDayRow[]> {
  return db
    .select({
      id: clubDays.id, fieldId: clubDays.fieldId, fieldName: clubFields.name, day: clubDays.day,
      openedBy: clubDays.openedBy, createdAt: clubDays.createdAt,
    })
    .from(clubDays)
    .innerJoin(clubFields, eq(clubFields.id, clubDays.fieldId))
    .where(
      and(
        eq(clubDays.clubId, params.clubId),
        eq(clubDays.day, params.day),
        params.fieldId === undefined ? undefined : eq(clubDays.fieldId, params.fieldId),
      ),
    )
    .orderBy(asc(clubFields.name), asc(clubDays.id));
}

/**
 * Closes the club's days on a date (every field's at once; closing again changes nothing) and claims
 * the day summary: `summaryRecipients` is the members who asked for it, and it is non-empty only the
 * first time (summary_sent_at is set in the same statement), so a second close or a double press
 * mails nobody twice. The close also keeps the runs that belong to the day now (freezeDayRuns): a
 * phone that syncs after it changes no closed day's list of runs. The day rows' FOR UPDATE lock orders the
 * close against pushes, which hold the days their runs may belong to FOR SHARE (club-day-locks.ts): a push
 * that got there first is waited for and kept, one that comes later waits and stays out. Null when no day
 * is open on that date.
 */
export async function closeClubDay(
  db: Database,
  params: { clubId: string; day: string; userId: string },
): Promise<{ closedAt: Date; summaryRecipients: { email: string; name: string }[] } | null> {
  return db.transaction(async (tx) => {
    const closed = await tx.execute<{ closed_at: Date | string; claimed: boolean; unfrozen: boolean }>(sql`
      with old as (
        select id, summary_sent_at, runs_frozen_at from club_days where club_id = ${params.clubId} and day = ${params.day}::date order by id for update
      )
      update club_days d set closed_at = coalesce(d.closed_at, now()), closed_by = coalesce(d.closed_by, ${params.userId}::uuid),
        summary_sent_at = coalesce(d.summary_sent_at, now())
      from old where old.id = d.id
      returning d.closed_at, (old.summary_sent_at is null) as claimed, (old.runs_frozen_at is null) as unfrozen`);
    if (closed.rows.length === 0) return null;
    if (closed.rows.some((r) => r.unfrozen)) await freezeDayRuns(tx, params);
    const closedAt = new Date(closed.rows[0]!.closed_at);
    if (!closed.rows.some((r) => r.claimed)) return { closedAt, summaryRecipients: [] };
    return { closedAt, summaryRecipients: await summaryRecipients(tx, params.clubId) };
  });
}

/** The members who asked for the club's day summaries (memberships.day_summaries), enabled accounts only. */
async function summaryRecipients(db: Pick<Database, "execute">, clubId: string): Promise<{ email: string; name: string }[]> {
  const to = await db.execute<{ email: string; name: string }>(sql`
    select u.email, u.name from memberships m join users u on u.id = m.user_id
    where m.club_id = ${clubId} and m.day_summaries and u.disabled_at is null and u.deleted_at is null
    order by u.email`);
  return to.rows;
}

/**
 * Who gets the updated summary of a decision made after the day's summary went (the day closed, its
 * summary claimed): the members who ask for summaries now. Empty while the day is open (its summary
 * is still to come, at the close).
 */
export async function lateSummaryRecipients(db: Database, params: { clubId: string; day: string }): Promise<{ email: string; name: string }[]> {
  const sent = await db.execute(sql`
    select 1 from club_days where club_id = ${params.clubId} and day = ${params.day}::date and closed_at is not null and summary_sent_at is not null limit 1`);
  return sent.rows.length === 0 ? [] : summaryRecipients(db, params.clubId);
}

/** The member's own day-summary setting for the club; false when they are not a member (nothing changes). */
export async function setDaySummaries(db: Database, params: { clubId: string; userId: string; on: boolean }): Promise<boolean> {
  const res = await db.execute(sql`
    update memberships set day_summaries = ${params.on} where club_id = ${params.clubId} and user_id = ${params.userId} returning id`);
  return res.rows.length > 0;
}

export async function getDaySummaries(db: Database, params: { clubId: string; userId: string }): Promise<boolean> {
  const res = await db.execute<{ on: boolean }>(sql`
    select day_summaries as on from memberships where club_id = ${params.clubId} and user_id = ${params.userId}`);
  return res.rows[0]?.on ?? false;
}

/** The club days (every club of the user's) a run may be put in, newest first, with whether it is in each. */
export type RunDayChoice = { dayId: string; clubSlug: string; clubName: string; fieldName: string; day: string; chosen: boolean; closed: boolean };

/**
 * Days of the user's clubs within a week of the run, for a run the user set up or flies in (else
 * nothing: the choice is the pilot's). The run must be the user's own record there: disputed or
 * hidden lanes offer nothing.
 */
export async function listRunDayChoices(db: Database, params: { userId: string; runId: string }): Promise<RunDayChoice[]> {
  const res = await db.execute<{ day_id: string; slug: string; club_name: string; field_name: string; day: string; chosen: boolean; closed: boolean }>(sql`
    with r as (
      select r.id, r.created_at from runs r
      where r.id = ${params.runId} and ${runIsUsers(sql`r`, params.userId)}
    )
    select d.id as day_id, c.slug, c.name as club_name, f.name as field_name, d.day::text as day,
      exists (select 1 from club_day_runs x where x.day_id = d.id and x.run_id = r.id) as chosen, (d.closed_at is not null) as closed
    from r
    join memberships m on m.user_id = ${params.userId}
    join clubs c on c.id = m.club_id
    join club_days d on d.club_id = m.club_id and d.day between (r.created_at - interval '7 days')::date and (r.created_at + interval '7 days')::date
    join club_fields f on f.id = d.field_id
    order by d.day desc, c.name, f.name`);
  return res.rows.map((r) => ({ dayId: r.day_id, clubSlug: r.slug, clubName: r.club_name, fieldName: r.field_name, day: r.day, chosen: r.chosen, closed: r.closed }));
}

/**
 * Puts the run in the day (or takes it out); false when the day is not among the run's choices for
 * this user, "closed" when the day is closed (its runs were kept at the close and change no more).
 */
export async function chooseRunDay(db: Database, params: { userId: string; runId: string; dayId: string; chosen: boolean }): Promise<boolean | "closed"> {
  const choice = (await listRunDayChoices(db, params)).find((c) => c.dayId === params.dayId);
  if (!choice) return false;
  if (choice.closed) return "closed";
  if (params.chosen) {
    await db.execute(sql`insert into club_day_runs (day_id, run_id, chosen_by)
      select ${params.dayId}, ${params.runId}, ${params.userId} where not exists (select 1 from club_days d where d.id = ${params.dayId} and d.closed_at is not null)
      on conflict do nothing`);
  } else {
    await db.execute(sql`delete from club_day_runs where day_id = ${params.dayId} and run_id = ${params.runId}`);
  }
  return true;
}

export type ClubDayDate = { day: string; fields: string[]; closed: boolean };

/** The club's field days from `from` on (YYYY-MM-DD) and before `before` when given, newest first, one entry per date with its fields. */
export async function listClubDayDates(db: Database, params: { clubId: string; from: string; before?: string; limit?: number }): Promise<ClubDayDate[]> {
  const res = await db.execute<{ day: string; fields: string[]; closed: boolean }>(sql`
    select d.day::text as day, array_agg(f.name order by f.name) as fields, bool_or(d.closed_at is not null) as closed
    from club_days d join club_fields f on f.id = d.field_id
    where d.club_id = ${params.clubId} and d.day >= ${params.from}::date and (${params.before ?? null}::date is null or d.day < ${params.before ?? null}::date)
    group by d.day order by d.day desc limit ${params.limit ?? 20}`);
  return res.rows;
}
