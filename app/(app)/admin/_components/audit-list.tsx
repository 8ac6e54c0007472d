import { db } from "@/db";
import { listAdminActions } from "@/db/queries/admin-lists";
import { describeAdminAction } from "@/lib/admin/audit-text";
import { Empty } from "./admin-section";
import { ListPager, type AdminParams } from "./list-pager";
import { When } from "./when";

/** The admin actions, newest first, a page at a time: who did what to whom, and when. */
export async function AuditList({ page, params }: { page: number; params: AdminParams }) {
  const { rows: entries, more } = await listAdminActions(db, page);
  if (!entries.length) return <Empty>{page > 1 ? "No older admin actions." : "No admin actions yet."}</Empty>;
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
      <ListPager params={params} param="audit" page={page} more={more} section="audit" label="audit log" />
    </>
  );
}
