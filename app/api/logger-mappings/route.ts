// GET /api/logger-mappings — the column mappings the pilot saved, one per logger, latest first
import { db } from "@/db";
import { listLoggerMappings } from "@/db/queries/altimeter";
import { route } from "@/lib/api";
import { requireUser } from "@/lib/auth/session";

export const dynamic = "force-dynamic";

export const GET = route(async () => {
  const user = await requireUser();
  return Response.json({ loggers: await listLoggerMappings(db, { ownerId: user.id }) }, { headers: { "cache-control": "no-store" } });
});
