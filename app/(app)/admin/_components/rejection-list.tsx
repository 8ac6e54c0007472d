import { db } from "@/db";
import { listSyncRejections } from "@/db/queries/admin-lists";
import { Empty } from "./admin-section";
import { ListPager, type AdminParams } from "./list-pager";
import { When } from "./when";

/** Items phones pushed that the server refused, newest first, a page at a time: which device, whose, why, and when. */
export async function RejectionList({ page, params }: { page: number; params: AdminParams }) {
  const { rows: rejections, more } = await listSyncRejections(db, page);
  if (!rejections.length) return <Empty>{page > 1 ? "No older refusals." : "No pushed item has been refused."}</Empty>;
  return (
    <>
    <ul className="space-y-2" aria-label="Refused items">
      {rejections.map((r) => (
        <li key={r.id} className="space-y-1 rounded-lg border border-line bg-raised p-3">
          <p className="font-semibold">{r.reason}</p>
          <p className="break-all text-sm text-muted">
            device {r.deviceId} · {r.userEmail ?? "account removed"} · item {r.itemId}
          </p>
          <p className="text-sm text-muted">
            <When date={r.createdAt} />
          </p>
        </li>
      ))}
    </ul>
    <ListPager params={params} param="rejections" page={page} more={more} section="rejections" label="sync rejections" />
    </>
  );
}
