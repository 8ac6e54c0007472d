import { db } from "@/db";
import { listRecentMemberResults } from "@/db/queries/club-home";
import { formatDate } from "@/lib/format";
import { secondsText } from "@/lib/tasks";

/** Members' newest results from sessions flown for the club, only lanes that count in the pilot's own record. */
export async function RecentResults({ clubId }: { clubId: string }) {
  const results = await listRecentMemberResults(db, { clubId });
  return (
    <section aria-labelledby="results" className="space-y-3">
      <h2 id="results" className="text-lg font-bold">
        Recent results
      </h2>
      {results.length === 0 ? (
        <p className="text-muted">No results yet: runs flown for the club appear here once synced.</p>
      ) : (
        <table className="w-full text-left text-sm" aria-label="Recent results">
          <thead>
            <tr>
              <th scope="col">Pilot</th>
              <th scope="col">Task</th>
              <th scope="col" className="text-right">
                Result
              </th>
              <th scope="col">When</th>
            </tr>
          </thead>
          <tbody>
            {results.map((r) => (
              <tr key={`${r.runId}-${r.pilotName}`} className="border-t border-line">
                <td className="py-2">{r.pilotName}</td>
                <td>{r.taskCode}</td>
                <td className="figures text-right">{secondsText(r.resultTenths)} s</td>
                <td className="pl-2">{formatDate(r.startedAt)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </section>
  );
}
