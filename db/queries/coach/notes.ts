import "server-only";
import { sql } from "drizzle-orm";
import type { Database } from "../../index";
import type { Executor } from "../sync-db";
import type { PulledNote } from "@/lib/validations/coaching-sync";

/** Most notes one pull carries (newest first when cut; a coach's notes on a few pilots are far fewer). */
export const NOTES_MAX = 5_000;

/**
 * Who may read a note row: its pilot, or its coach while the pilot's grant to that coach holds.
 * Every read of notes goes through this condition (`n` is the coach_notes alias).
 */
const readable = (userId: string) => sql`(n.pilot_id = ${userId} or (n.coach_id = ${userId} and exists (
  select 1 from coach_grants g where g.pilot_id = n.pilot_id and g.coach_id = ${userId} and g.revoked_at is null)))`;

/**
 * A coach's new note on one of the pilot's runs or sessions. Null (the route answers 404) unless
 * the coach holds the pilot's unrevoked grant and the run counts in the pilot's record (the pilot
 * created it, or accepted a lane recorded for them) or the session is the pilot's own.
 */
export async function createNote(
  db: Database,
  p: { coachId: string; pilotId: string; runId?: string; sessionId?: string; body: string },
): Promise<PulledNote | null> {
  const target = p.runId
    ? sql`select r.session_id, r.id as run_id from runs r join run_lanes l on l.run_id = r.id
        left join lane_consents c on c.run_id = l.run_id and c.lane = l.lane
        where r.id = ${p.runId} and l.pilot_user_id = ${p.pilotId} and (r.created_by = ${p.pilotId} or c.status = 'accepted') limit 1`
    : sql`select s.id as session_id, null::uuid as run_id from field_sessions s where s.id = ${p.sessionId!} and s.owner_id = ${p.pilotId}`;
  const res = await db.execute<{ id: string }>(sql`
    with target as (${target}), granted as (
      select 1 from coach_grants g where g.coach_id = ${p.coachId} and g.pilot_id = ${p.pilotId} and g.revoked_at is null limit 1
    )
    insert into coach_notes (session_id, run_id, pilot_id, coach_id, author_id, body)
    select t.session_id, t.run_id, ${p.pilotId}, ${p.coachId}, ${p.coachId}, ${p.body} from target t where exists (select 1 from granted)
    returning id::text as id`);
  const id = res.rows[0]?.id;
  return id ? ((await noteRows(db, p.coachId, sql`n.id = ${id}`))[0] ?? null) : null;
}

/**
 * An answer in a note's thread, by its pilot or by its coach while the grant holds; answering an
 * answer answers its thread. Null (404) for anyone else or an unknown note.
 */
export async function replyToNote(db: Database, p: { userId: string; noteId: string; body: string }): Promise<PulledNote | null> {
  const res = await db.execute<{ id: string }>(sql`
    with root as (
      select n.id, n.session_id, n.run_id, n.pilot_id, n.coach_id from coach_notes n
      where n.id = (select coalesce(x.reply_to, x.id) from coach_notes x where x.id = ${p.noteId}) and ${readable(p.userId)}
    )
    insert into coach_notes (session_id, run_id, pilot_id, coach_id, author_id, reply_to, body)
    select session_id, run_id, pilot_id, coach_id, ${p.userId}, id, ${p.body} from root
    returning id::text as id`);
  const id = res.rows[0]?.id;
  return id ? ((await noteRows(db, p.userId, sql`n.id = ${id}`))[0] ?? null) : null;
}

/** Every note and answer the user may read now (pullReplySchema.notes), oldest first. */
export async function notesFor(db: Executor, userId: string): Promise<PulledNote[]> {
  return noteRows(db, userId, sql`true`);
}

async function noteRows(db: Executor, userId: string, where: ReturnType<typeof sql>): Promise<PulledNote[]> {
  const res = await db.execute<{
    id: string; pilot_id: string; coach_id: string; author_id: string; author_name: string; session_id: string;
    run_id: string | null; reply_to: string | null; body: string; created_at: string | Date;
  }>(sql`select * from (
      select n.id::text, n.pilot_id::text, n.coach_id::text, n.author_id::text, u.name as author_name, n.session_id::text,
        n.run_id::text, n.reply_to::text, n.body, n.created_at
      from coach_notes n join users u on u.id = n.author_id
      where ${readable(userId)} and ${where}
      order by n.created_at desc, n.id desc limit ${NOTES_MAX}
    ) x order by created_at, id`);
  return res.rows.map((r) => ({
    id: r.id, pilotId: r.pilot_id, coachId: r.coach_id, authorId: r.author_id, authorName: r.author_name, sessionId: r.session_id,
    runId: r.run_id, replyTo: r.reply_to, body: r.body, createdAtMs: new Date(r.created_at).getTime(),
  }));
}
