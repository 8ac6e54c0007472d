import { sql } from "drizzle-orm";
import type { Database } from "../index";
import { DEMO_CLUB } from "./demo-people";

/**
 * Two field days of the demo club at its home field, opened by its officer (idempotent): the latest
 * date of the demo season on which the most members flew there, and the club evening on which Tobi
 * timed Ada (recorded-for.ts). Their phones' clock estimates are the offsets their events carried,
 * as a push stores them, so the Day board shows each phone's offset and uncertainty. On the evening,
 * the officer decided the lane the two phones recorded differently (recorded-for.ts) for Tobi's own
 * phone, the backup, whose record the conflict rules do not use: the Day board counts it and Ada's run
 * page says so beside the run's own result (issue #14).
 */
export async function seedFieldDays(db: Database): Promise<void> {
  await db.execute(sql`
    with club as (select id from clubs where slug = ${DEMO_CLUB.slug}),
    field as (select f.id from club_fields f join club on f.club_id = club.id where f.name = ${DEMO_CLUB.homeField}),
    officer as (select m.user_id from memberships m join club on m.club_id = club.id where m.role = 'officer' order by m.created_at limit 1),
    busiest as (
      select (s.started_at at time zone 'UTC')::date as day from field_sessions s join club on s.club_id = club.id
      where s.field_name = ${DEMO_CLUB.homeField}
      group by 1 order by count(distinct s.owner_id) desc, 1 desc limit 1
    ),
    evening as (
      select (s.started_at at time zone 'UTC')::date as day from field_sessions s join club on s.club_id = club.id
      join runs r on r.session_id = s.id join run_lanes l on l.run_id = r.id and l.pilot_user_id <> r.created_by
      order by s.started_at desc limit 1
    )
    insert into club_days (club_id, field_id, day, opened_by)
    select club.id, field.id, d.day, officer.user_id from club, field, officer, (select day from busiest union select day from evening) d
    on conflict (club_id, field_id, day) do nothing`);
  await db.execute(sql`
    insert into device_clock_estimates (device_id, theta_ms, delta_ms, measured_at_wall_ms)
    select distinct e.device_id, e.offset_theta_ms, e.offset_delta_ms, e.offset_measured_at_ms
    from club_days d join clubs c on c.id = d.club_id and c.slug = ${DEMO_CLUB.slug}
    join field_sessions s on s.club_id = c.id and (s.started_at at time zone 'UTC')::date = d.day
    join runs r on r.session_id = s.id join events e on e.run_id = r.id
    join devices v on v.id = e.device_id
    where e.offset_measured_at_ms is not null and e.offset_delta_ms is not null and e.offset_theta_ms is not null
    on conflict (device_id, measured_at_wall_ms) do nothing`);
  await db.execute(sql`
    insert into club_day_decisions (club_id, day, run_id, lane, device_id, note, decided_by, decided_at)
    select d.club_id, d.day, r.id, l.lane, 'demo-phone-tobi', 'Ada called her last launch a test throw before the horn.', d.opened_by,
      (d.day + interval '1 day 9 hours')::timestamp at time zone 'UTC'
    from club_days d join clubs c on c.id = d.club_id and c.slug = ${DEMO_CLUB.slug}
    join field_sessions s on s.club_id = c.id and (s.started_at at time zone 'UTC')::date = d.day
    join runs r on r.session_id = s.id join run_lanes l on l.run_id = r.id and l.pilot_user_id <> r.created_by
    where exists (select 1 from events e where e.run_id = r.id and e.device_id = 'demo-phone-tobi')
      and exists (select 1 from events e where e.run_id = r.id and e.device_id = 'demo-phone-tobi-club')
    on conflict (club_id, day, run_id, lane) do nothing`);
}
