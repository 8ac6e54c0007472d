import Link from "next/link";
import { Card } from "@/components/ui/card";
import { db } from "@/db";
import { searchUsers } from "@/db/queries/admin";
import type { UserSearch } from "@/lib/validations/admin";
import { Empty } from "./admin-section";
import { UserActions } from "./user-actions";
import { When } from "./when";

const pageHref = (q: string, page: number) => `/admin?${new URLSearchParams({ ...(q ? { q } : {}), page: String(page) })}`;

/** One page of the accounts matching the search, each with its actions; links to the pages either side. */
export async function UserList({ search, meId }: { search: UserSearch; meId: string }) {
  const { users, total, page, pageSize } = await searchUsers(db, search);
  const pages = Math.max(1, Math.ceil(total / pageSize));
  if (!users.length && total > 0) {
    return (
      <Empty>
        Page {page} is past the last page. <Link href={pageHref(search.q, 1)} className="font-bold underline">First page</Link>
      </Empty>
    );
  }
  if (!users.length) return <Empty>{search.q ? `No account matches “${search.q}”.` : "No accounts."}</Empty>;
  return (
    <div className="space-y-3">
      <p className="text-sm text-muted">
        {total} {total === 1 ? "account" : "accounts"}
        {pages > 1 ? ` · page ${page} of ${pages}` : ""}
      </p>
      <ul className="space-y-2" aria-label="Accounts found">
        {users.map((u) => (
          <li key={u.id} aria-label={u.email}>
            <Card className="space-y-2">
              <div>
                <p className="font-bold">
                  {u.name} {u.id === meId ? <span className="text-muted">(you)</span> : null}
                </p>
                <p className="break-all">{u.email}</p>
                <p className="text-sm text-muted">
                  {u.role === "admin" ? "Admin" : "Member"} · {u.disabledAt ? "Disabled" : "Active"}
                  {u.emailVerifiedAt ? "" : " · address not verified"} · since <When date={u.createdAt} />
                </p>
              </div>
              <UserActions userId={u.id} email={u.email} role={u.role} disabled={u.disabledAt !== null} isMe={u.id === meId} />
            </Card>
          </li>
        ))}
      </ul>
      {pages > 1 ? (
        <nav aria-label="Pages of accounts" className="flex justify-between font-bold">
          {page > 1 ? <Link href={pageHref(search.q, page - 1)} className="underline">‹ Previous</Link> : <span />}
          {page < pages ? <Link href={pageHref(search.q, page + 1)} className="underline">Next ›</Link> : <span />}
        </nav>
      ) : null}
    </div>
  );
}
