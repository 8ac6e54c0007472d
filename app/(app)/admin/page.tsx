import type { Metadata } from "next";
import { notFound, redirect } from "next/navigation";
import { Suspense, type ReactNode } from "react";
import { getSessionUser } from "@/lib/auth/session";
import { adminListPageSchema, userSearchSchema } from "@/lib/validations/admin";
import { AdminSection } from "./_components/admin-section";
import { AuditList } from "./_components/audit-list";
import { ClubList } from "./_components/club-list";
import { MailList } from "./_components/mail-list";
import { RejectionList } from "./_components/rejection-list";
import { UserList } from "./_components/user-list";
import { UserSearchForm } from "./_components/user-search-form";

export const metadata: Metadata = { title: "Administration" };
export const dynamic = "force-dynamic";

type Props = { searchParams: Promise<Record<string, string | string[] | undefined>> };

const one = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);
const loading = (what: string): ReactNode => <p className="text-muted">Loading {what}…</p>;

/**
 * Site administration, for site admins only: a member gets the not-found page (they need not know it
 * exists), a signed-out visitor the sign-in page. The role is read from the database on this very
 * request, so a demoted admin loses the page at once. The actions go through /api/admin/**, which check
 * the role again. The service worker never caches this page (worker/sw.ts).
 */
export default async function AdminPage({ searchParams }: Props) {
  const user = await getSessionUser();
  if (!user) redirect("/sign-in");
  if (user.role !== "admin") notFound();
  const params = await searchParams;
  const parsed = userSearchSchema.safeParse({ q: one(params.q), page: one(params.page) });
  const search = parsed.success ? parsed.data : { q: "", page: 1 };
  // each list's page in the URL (a bad value is page 1); the links of one list keep the others'
  const listPage = (key: string) => adminListPageSchema.catch(1).parse(one(params[key]));
  const pages = { audit: listPage("audit"), mail: listPage("mail"), rejections: listPage("rejections") };
  const kept = Object.fromEntries(Object.entries(params).flatMap(([k, v]) => (["q", "page", "audit", "mail", "rejections"].includes(k) && one(v) ? [[k, one(v)!]] : [])));
  return (
    <div className="space-y-8">
      <h1 className="text-2xl font-extrabold">Administration</h1>
      <AdminSection id="users" title="Users">
        <UserSearchForm q={search.q} />
        <Suspense key={`${search.q}|${search.page}`} fallback={loading("accounts")}>
          <UserList search={search} meId={user.id} />
        </Suspense>
      </AdminSection>
      <AdminSection id="audit" title="Audit log">
        <Suspense key={pages.audit} fallback={loading("the audit log")}>
          <AuditList page={pages.audit} params={kept} />
        </Suspense>
      </AdminSection>
      <AdminSection id="mail" title="E-mail queue">
        <Suspense key={pages.mail} fallback={loading("the e-mail queue")}>
          <MailList page={pages.mail} params={kept} />
        </Suspense>
      </AdminSection>
      <AdminSection id="rejections" title="Sync rejections">
        <Suspense key={pages.rejections} fallback={loading("sync rejections")}>
          <RejectionList page={pages.rejections} params={kept} />
        </Suspense>
      </AdminSection>
      <AdminSection id="clubs" title="Clubs">
        <Suspense fallback={loading("clubs")}>
          <ClubList />
        </Suspense>
      </AdminSection>
    </div>
  );
}
