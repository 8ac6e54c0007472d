// GET /api/club-mates — the people who share a club with the signed-in user, so a timekeeper's
// phone can name them as pilots offline (the field set-up keeps the last copy on the device)
import { db } from "@/db";
import { listClubMates } from "@/db/queries/club-mates";
import { route } from "@/lib/api";
import { requireUser } from "@/lib/auth/session";

export const dynamic = "force-dynamic";

export const GET = route(async () => {
  const user = await requireUser();
  return Response.json({ mates: await listClubMates(db, user.id) }, { headers: { "cache-control": "no-store" } });
});
