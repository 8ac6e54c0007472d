import { db } from "@/db";
import { ADMIN_LIST_LIMIT, listAdminActions } from "@/db/queries/admin-lists";
import { describeAdminAction } from "@/lib/admin/audit-text";
import { Empty } from "./admin-section";
import { When } from "./when";

/** The newest admin actions: who did what to whom, and when. */
export async function AuditList() {
  const entries = await listAdminActions(db);
  if (!entries.length) return <Empty>No admin actions yet.</Empty>;
  return (
    <>
      <ol className="space-y-2" aria-label="Admin actions, newest first">
        {entries.map((e) => (
          <li key={e.id} className="rounded-lg border border-line bg-raised p-3">
            <p>
              <span className="font-bold">{e.actorName ?? "A removed account"}</span>
              {e.actorEmail ? <span className="text-muted"> ({e.actorEmail})</span> : null} {describeAdminAction(e)}
            </p>
            <p className="text-sm text-muted">
              <When date={e.createdAt} />
            </p>
          </li>
        ))}
      </ol>
      {entries.length === ADMIN_LIST_LIMIT ? <p className="text-sm text-muted">The newest {ADMIN_LIST_LIMIT} are shown.</p> : null}
    </>
  );
}
