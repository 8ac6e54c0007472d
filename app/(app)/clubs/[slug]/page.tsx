import type { Metadata } from "next";
import Link from "next/link";
import { Suspense } from "react";
import { ROLE_LABEL } from "@/lib/clubs/roles";
import { clubPageAccess } from "./_components/access";
import { Coming } from "./_components/coming";
import { Days } from "./_components/days";
import { Fields } from "./_components/fields";
import { Members } from "./_components/members";
import { RecentResults } from "./_components/recent-results";

export const metadata: Metadata = { title: "Club" };
export const dynamic = "force-dynamic";

/** A club's home: members and roles, its fields with their cautions, coming days and contests, members' recent results. */
export default async function ClubPage({ params }: { params: Promise<{ slug: string }> }) {
  const access = await clubPageAccess((await params).slug);
  const { club } = access;
  return (
    <div className="space-y-8">
      <header className="space-y-1">
        <h1 className="text-2xl font-extrabold">{club.name}</h1>
        {(access.clubRole === "officer" || access.role === "admin") && (
          <Link className="underline" href={`/contests/new?club=${club.slug}`}>Set up a contest</Link>
        )}
        <p className="text-muted">{access.clubRole ? `You are ${ROLE_LABEL[access.clubRole].toLowerCase()} here.` : "You see this club as a site admin."}</p>
      </header>
      <Suspense fallback={<p aria-busy="true">Loading the fields…</p>}>
        <Fields access={access} />
      </Suspense>
      <Suspense fallback={<p aria-busy="true">Loading the field days…</p>}>
        <Days access={access} />
      </Suspense>
      <Suspense fallback={<p aria-busy="true">Loading what is coming…</p>}>
        <Coming clubId={club.id} slug={club.slug} />
      </Suspense>
      <Suspense fallback={<p aria-busy="true">Loading members…</p>}>
        <Members access={access} />
      </Suspense>
      <Suspense fallback={<p aria-busy="true">Loading results…</p>}>
        <RecentResults clubId={club.id} />
      </Suspense>
    </div>
  );
}
