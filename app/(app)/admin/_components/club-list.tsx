import { db } from "@/db";
import { listClubsWithCounts } from "@/db/queries/admin-lists";
import { Empty } from "./admin-section";

/** Every club with its number of members (read only: clubs are run by their officers). */
export async function ClubList() {
  const clubs = await listClubsWithCounts(db);
  if (!clubs.length) return <Empty>No clubs yet.</Empty>;
  return (
    <ul className="space-y-2" aria-label="Clubs">
      {clubs.map((c) => (
        <li key={c.id} className="flex items-center justify-between gap-3 rounded-lg border border-line bg-raised p-3">
          <div>
            <p className="font-bold">{c.name}</p>
            <p className="text-sm text-muted">
              {c.slug}
              {c.homeField ? ` · ${c.homeField}` : ""}
            </p>
          </div>
          <p className="figures whitespace-nowrap">
            {c.members} {c.members === 1 ? "member" : "members"}
          </p>
        </li>
      ))}
    </ul>
  );
}
