import { db } from "@/db";
import { listChanges } from "@/db/queries/sync-pull";
import { applyPush } from "@/db/queries/sync-push";
import { handleApiError } from "@/lib/api";
import { pullQuerySchema, pushRequestSchema, timeRequestSchema } from "@/lib/validations/sync";
import type { Serve } from "../tests/integration/sync-sim-network";

/**
 * The sync routes' work without next-auth (which needs Next's request context): the same
 * zod parsing and the same query functions the route handlers call, in process, as `user`.
 * Used by the benchmark; the integration tests call the real route handlers instead.
 */
export const serveInProcess: Serve = async (user, url, init) => {
  try {
    const t2 = Date.now();
    if (url.startsWith("/api/time")) {
      const { t1 } = timeRequestSchema.parse(JSON.parse(String(init?.body)));
      return Response.json({ t1, t2, t3: Date.now() });
    }
    if (url.startsWith("/api/sync/push")) {
      const body = pushRequestSchema.parse(JSON.parse(String(init?.body)));
      return Response.json(await applyPush(db, user.id, body));
    }
    if (url.startsWith("/api/sync/pull")) {
      const { cursor, limit, total } = pullQuerySchema.parse(Object.fromEntries(new URL(url, "http://bench").searchParams));
      return Response.json(await listChanges(db, { userId: user.id, cursor, limit, total: total === "1" }));
    }
    return new Response("not found", { status: 404 });
  } catch (e) {
    return handleApiError(e);
  }
};
