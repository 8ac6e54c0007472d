import Link from "next/link";
import { redirect } from "next/navigation";
import { Suspense } from "react";
import { ButtonLink } from "@/components/ui/button";
import { getSessionUser } from "@/lib/auth/session";
import { db } from "@/db";
import { coachesAnyone } from "@/db/queries/coach/grants";
import { ComingContests } from "./_components/coming-contests";
import { RecentSessions } from "./_components/recent-sessions";

export const dynamic = "force-dynamic";

/** Home: start a window, and the user's recent sessions. */
export default async function HomePage() {
  const user = await getSessionUser();
  if (!user) redirect("/sign-in");
  const coach = await coachesAnyone(db, user);
  return (
    <div className="space-y-6">
      <section aria-labelledby="hello" className="space-y-3">
        <h1 id="hello" className="text-2xl font-extrabold">
          Hello, {user.name.split(" ")[0]}
        </h1>
        <ButtonLink href="/field/new" className="w-full text-lg">
          Start a task window
        </ButtonLink>
        {coach ? (
          <Link href="/coach" className="block font-bold underline">
            Coach desk: your pilots&apos; seasons
          </Link>
        ) : null}
        {user.role === "admin" ? (
          <Link href="/admin" className="block font-bold underline">
            Site administration
          </Link>
        ) : null}
      </section>
      <Suspense fallback={null}>
        <ComingContests userId={user.id} />
      </Suspense>
      <section aria-labelledby="recent" className="space-y-3">
        <h2 id="recent" className="text-lg font-bold">
          Recent sessions
        </h2>
        <Suspense fallback={<p className="text-muted">Loading sessions…</p>}>
          <RecentSessions userId={user.id} />
        </Suspense>
      </section>
    </div>
  );
}
