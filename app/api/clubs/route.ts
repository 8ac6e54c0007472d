// POST /api/clubs — create a club; its creator becomes its first officer
import { db } from "@/db";
import { createClub } from "@/db/queries/clubs";
import { parseJson, route } from "@/lib/api";
import { requireUser } from "@/lib/auth/session";
import { createClubSchema } from "@/lib/validations/clubs";

export const dynamic = "force-dynamic";

/** Any signed-in account may start a club; the address name comes from the name (made unique). */
export const POST = route(async (request: Request) => {
  const user = await requireUser();
  const { name } = await parseJson(request, createClubSchema);
  const club = await createClub(db, { name, userId: user.id });
  return Response.json({ club: { name: club.name, slug: club.slug } }, { status: 201, headers: { "cache-control": "no-store" } });
});
