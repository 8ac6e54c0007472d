// GET /api/club-fields — the fields of the signed-in user's clubs with their cautions, kept on the phone for the Field screen
import { db } from "@/db";
import { listMyClubFields } from "@/db/queries/club-fields";
import { route } from "@/lib/api";
import { requireUser } from "@/lib/auth/session";

export const dynamic = "force-dynamic";

/** Scoped by the caller's own memberships in the query (like /api/club-mates): nobody reads another club's fields. */
export const GET = route(async () => {
  const user = await requireUser();
  return Response.json({ fields: await listMyClubFields(db, user.id) }, { headers: { "cache-control": "no-store" } });
});
