import Link from "next/link";
import { db } from "@/db";
import { listMyComingContests } from "@/db/queries/contests";
import { formatDate } from "@/lib/format";

/** Home's list of the coming contests of the user's clubs (nothing shown when there are none). */
export async function ComingContests({ userId }: { userId: string }) {
  const items = await listMyComingContests(db, { userId, today: new Date().toISOString().slice(0, 10) });
  if (items.length === 0) return null;
  return (
    <section aria-labelledby="contests" className="space-y-2">
      <h2 id="contests" className="text-lg font-bold">Coming contests</h2>
      <ul className="space-y-1" aria-label="Coming contests">
        {items.map((c) => (
          <li key={c.id}>
            <Link className="underline" href={`/contests/${c.id}`}>{c.name}</Link>
            <span className="text-sm text-muted"> · {formatDate(new Date(`${c.startsOn}T12:00:00Z`))} · {c.clubName}</span>
          </li>
        ))}
      </ul>
    </section>
  );
}
