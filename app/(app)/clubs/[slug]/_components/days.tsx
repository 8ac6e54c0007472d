import Link from "next/link";
import { db } from "@/db";
import { listClubFields } from "@/db/queries/club-fields";
import { getDaySummaries, listClubDayDates } from "@/db/queries/club-days";
import { getClubTimeZone } from "@/db/queries/clubs";
import type { ClubAccess } from "@/lib/auth/session";
import { localDate } from "@/lib/days/time-zone";
import { formatDate } from "@/lib/format";
import { DaySummariesToggle } from "./day-summaries-toggle";
import { OpenDayForm } from "./open-day-form";
import { TimeZoneForm } from "./time-zone-form";

const DAY_MS = 24 * 3600_000;

/**
 * The club's field days of the last 60 days up to yesterday on the club's clock, each a link to its
 * Day board (today's and coming days are listed once, under "Coming days and contests"); officers
 * open a day at one of the club's fields and set the club's time zone; each member chooses whether
 * the day summaries reach them.
 */
export async function Days({ access }: { access: ClubAccess }) {
  const { club } = access;
  const runsClub = access.clubRole === "officer" || access.role === "admin";
  const now = new Date().getTime();
  const timeZone = await getClubTimeZone(db, club.id);
  const today = localDate(now, timeZone);
  const [days, fields, summaries] = await Promise.all([
    listClubDayDates(db, { clubId: club.id, from: localDate(now - 60 * DAY_MS, timeZone), before: today }),
    runsClub ? listClubFields(db, club.id) : Promise.resolve([]),
    access.clubRole ? getDaySummaries(db, { clubId: club.id, userId: access.id }) : Promise.resolve(false),
  ]);
  return (
    <section aria-labelledby="days" className="space-y-3">
      <h2 id="days" className="text-lg font-bold">
        Field days
      </h2>
      <p className="text-sm text-muted">
        Members&apos; runs recorded at the day&apos;s field on that day join its Day board when their phones sync; a pilot can also choose a day from the run&apos;s page.
        A day is a date on the club&apos;s clock: <span data-testid="club-time-zone">{timeZone}</span>.
      </p>
      {days.length === 0 ? (
        <p className="text-muted">No field days in the last 60 days.</p>
      ) : (
        <ul className="space-y-2" aria-label="Field days">
          {days.map((d) => (
            <li key={d.day}>
              <Link href={`/clubs/${club.slug}/days/${d.day}`} className="card flex min-h-12 flex-col justify-center rounded-xl border border-line bg-raised p-3 underline-offset-2 hover:underline">
                <span className="font-bold">{formatDate(new Date(`${d.day}T12:00:00Z`))}</span>
                <span className="text-sm text-muted">
                  {d.fields.join(", ")}
                  {d.closed ? " · closed" : ""}
                </span>
              </Link>
            </li>
          ))}
        </ul>
      )}
      {access.clubRole ? <DaySummariesToggle slug={club.slug} on={summaries} /> : null}
      {runsClub ? (
        <details className="space-y-3">
          <summary className="min-h-12 cursor-pointer py-2 font-bold">Set the club&apos;s time zone</summary>
          <TimeZoneForm slug={club.slug} timeZone={timeZone} />
        </details>
      ) : null}
      {runsClub && fields.length > 0 ? (
        <details className="space-y-3">
          <summary className="min-h-12 cursor-pointer py-2 font-bold">Open a field day</summary>
          <OpenDayForm slug={club.slug} fields={fields.map((f) => ({ id: f.id, name: f.name }))} today={today} />
        </details>
      ) : null}
    </section>
  );
}
