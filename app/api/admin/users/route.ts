// GET /api/admin/users?q=&page= — site administration: accounts whose e-mail or name contains q, one page at a time (admins only)
import { db } from "@/db";
import { searchUsers } from "@/db/queries/admin";
import { route } from "@/lib/api";
import { requireRole } from "@/lib/auth/session";
import { userSearchSchema } from "@/lib/validations/admin";

export const dynamic = "force-dynamic";

export const GET = route(async (request: Request) => {
  await requireRole("admin");
  const query = userSearchSchema.parse(Object.fromEntries(new URL(request.url).searchParams));
  return Response.json(await searchUsers(db, query), { headers: { "cache-control": "no-store" } });
});
