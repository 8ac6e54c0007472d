import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { db } from "@/db";
import { listClubFields } from "@/db/queries/club-fields";
import { clubSlugSchema } from "@/lib/validations/clubs";
import { contestPageAccess } from "../_components/guard";
import { NewContestForm } from "./new-contest-form";

export const metadata: Metadata = { title: "New contest" };
export const dynamic = "force-dynamic";

/** An officer sets up a contest for their club (`?club=slug`); anyone else gets 404. */
export default async function NewContestPage({ searchParams }: { searchParams: Promise<{ club?: string }> }) {
  const slug = clubSlugSchema.safeParse((await searchParams).club);
  if (!slug.success) notFound();
  const access = await contestPageAccess({ slug: slug.data, role: "officer", back: `/contests/new?club=${slug.data}` });
  const fields = await listClubFields(db, access.clubId);
  return (
    <div className="space-y-6">
      <h1 className="text-2xl font-extrabold">New contest · {access.club.name}</h1>
      <NewContestForm slug={slug.data} fields={fields.map((f) => f.name)} />
    </div>
  );
}
