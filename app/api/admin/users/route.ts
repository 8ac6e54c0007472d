// GET /api/admin/users — site administration: every account (admins only)
import { db } from "@/db";
import { listUsers } from "@/db/queries/admin";
import { route } from "@/lib/api";
import { requireRole } from "@/lib/auth/session";

export const dynamic = "force-dynamic";

export const GET = route(async () => {
  await requireRole("admin");
  return Response.json({ users: await listUsers(db) });
});
