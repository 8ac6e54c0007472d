import Link from "next/link";
import { Card } from "@/components/ui/card";
import { db } from "@/db";
import { listRecentSessions } from "@/db/queries/sessions";
import { formatDate } from "@/lib/format";

type Conditions = { windMs?: number; gustMs?: number; temperatureC?: number };

/** The ten newest sessions the user owns or flew in, each opening that session in the logbook; or a friendly empty state. */
export async function RecentSessions({ userId }: { userId: string }) {
  const sessions = await listRecentSessions(db, { userId, limit: 10 });
  if (sessions.length === 0) {
    return (
      <Card>
        <p className="font-semibold">No sessions yet.</p>
        <p className="text-muted">Start a task window at the field: it works with no signal and syncs when you are back online.</p>
      </Card>
    );
  }
  return (
    <ul className="space-y-2" aria-label="Recent sessions">
      {sessions.map((s) => {
        const c = (s.conditions ?? {}) as Conditions;
        return (
          <li key={s.id}>
            <Link href={`/logbook?session=${s.id}`} className="card flex min-h-touch items-center justify-between gap-3 rounded-xl border border-line bg-raised p-4">
              <div>
                <p className="font-bold">{s.fieldName}</p>
                <p className="text-sm text-muted">
                  {formatDate(s.startedAt)}
                  {c.windMs !== undefined ? ` · wind ${c.windMs} m/s` : ""}
                </p>
              </div>
              <p className="figures text-right text-sm">
                {s.runCount} {s.runCount === 1 ? "run" : "runs"}
                <br />
                <span className="text-muted">tasks {s.taskCodes.join(", ") || "–"}</span>
              </p>
              <span aria-hidden="true">›</span>
            </Link>
          </li>
        );
      })}
    </ul>
  );
}
