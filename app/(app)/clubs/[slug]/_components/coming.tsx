import Link from "next/link";
import { db } from "@/db";
import { getClubTimeZone } from "@/db/queries/clubs";
import { listComing } from "@/db/queries/club-home";
import { localDate } from "@/lib/days/time-zone";
import { formatDate } from "@/lib/format";

/** The club's coming field days (one entry per date, whatever its fields) and contests, from today on the club's clock, soonest first. */
export async function Coming({ clubId, slug }: { clubId: string; slug: string }) {
  const items = await listComing(db, { clubId, today: localDate(new Date().getTime(), await getClubTimeZone(db, clubId)) });
  return (
    <section aria-labelledby="coming" className="space-y-3">
      <h2 id="coming" className="text-lg font-bold">
        Coming days and contests
      </h2>
      {items.length === 0 ? (
        <p className="text-muted">Nothing planned yet.</p>
      ) : (
        <ul className="space-y-2" aria-label="Coming days and contests">
          {items.map((i) => (
            <li key={`${i.kind}-${i.id}`} className="card rounded-xl border border-line bg-raised p-3">
              <p className="font-bold">
                {i.kind === "day" ? <Link className="underline" href={`/clubs/${slug}/days/${i.on}`}>Field day: {i.fieldName}</Link> : <Link className="underline" href={`/contests/${i.id}`}>Contest: {i.name}</Link>}
              </p>
              <p className="text-sm text-muted">
                {formatDate(new Date(`${i.on}T12:00:00Z`))}
                {i.kind === "contest" ? ` · ${i.fieldName}` : ""}
              </p>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
