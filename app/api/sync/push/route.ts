// POST /api/sync/push — apply a device's queued sessions, runs and events; acknowledge each one
import { db } from "@/db";
import { applyPush } from "@/db/queries/sync-push";
import { parseJson, route } from "@/lib/api";
import { requireUser } from "@/lib/auth/session";
import { assertSameAccount } from "@/lib/sync/authorise";
import { pushRequestSchema } from "@/lib/validations/sync";

export const dynamic = "force-dynamic";

/**
 * 401 signed out, 422 for a malformed body (before any database work), 403 when the device id
 * belongs to another account, 409 when the body names another account's device database. Otherwise every item gets an ack: applied, duplicate (already
 * stored: the device may forget it) or rejected with the reason (SYNC.md §3).
 */
export const POST = route(async (request: Request) => {
  const user = await requireUser();
  const body = await parseJson(request, pushRequestSchema);
  assertSameAccount(user.id, body.account);
  return Response.json(await applyPush(db, user.id, body), { headers: { "cache-control": "no-store" } });
});
