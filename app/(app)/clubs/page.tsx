import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { Card } from "@/components/ui/card";
import { db } from "@/db";
import { listMyClubs } from "@/db/queries/clubs";
import { getSessionUser } from "@/lib/auth/session";
import { ROLE_LABEL } from "@/lib/clubs/roles";
import { CreateClubForm } from "./_components/create-club-form";

export const metadata: Metadata = { title: "Clubs" };
export const dynamic = "force-dynamic";

/** My clubs (each with my role) and a form to start one. */
export default async function ClubsPage() {
  const user = await getSessionUser();
  if (!user) redirect("/sign-in?next=/clubs");
  const clubs = await listMyClubs(db, user.id);
  return (
    <div className="space-y-6">
      <h1 className="text-2xl font-extrabold">Clubs</h1>
      <section aria-labelledby="my-clubs" className="space-y-3">
        <h2 id="my-clubs" className="text-lg font-bold">
          My clubs
        </h2>
        {clubs.length === 0 ? (
          <Card>
            <p className="font-semibold">You are not in a club yet.</p>
            <p className="text-muted">An officer of your club can invite you by e-mail, or start a club of your own below.</p>
          </Card>
        ) : (
          <ul className="space-y-2" aria-label="My clubs">
            {clubs.map((c) => (
              <li key={c.id}>
                <Link href={`/clubs/${c.slug}`} className="card flex min-h-touch items-center justify-between gap-3 rounded-xl border border-line bg-raised p-4">
                  <span>
                    <span className="block font-bold">{c.name}</span>
                    <span className="text-sm text-muted">
                      {ROLE_LABEL[c.role]} · {c.members} {c.members === 1 ? "member" : "members"}
                    </span>
                  </span>
                  <span aria-hidden="true">›</span>
                </Link>
              </li>
            ))}
          </ul>
        )}
      </section>
      <section aria-labelledby="new-club" className="space-y-3">
        <h2 id="new-club" className="text-lg font-bold">
          Start a club
        </h2>
        <CreateClubForm />
      </section>
    </div>
  );
}
