// POST /api/sync/push — apply a device's queued sessions, runs and events; acknowledge each one
import { db } from "@/db";
import { applyPush } from "@/db/queries/sync-push";
import { BODY_LIMIT, parseJson, route } from "@/lib/api";
import { pushLimit } from "@/lib/auth/limits";
import { requireUser } from "@/lib/auth/session";
import { ValidationError } from "@/lib/errors";
import { assertSameAccount } from "@/lib/sync/authorise";
import { pushEnvelopeSchema, readPush, UnnamedItemError } from "@/lib/validations/sync-push";

export const dynamic = "force-dynamic";

/**
 * 401 signed out, 413 over 1 MB, 429 past 120 pushes a minute (lib/auth/limits.ts), 422 for a malformed envelope or an item without a usable id
 * (before any database work), 403 when the device id belongs to another account, 409 when the
 * body names another account's device database. Otherwise every item gets an ack: applied,
 * duplicate (already stored: the device may forget it) or rejected with the reason — an item
 * that fails its own schema included, so the rest of the batch still applies (SYNC.md §3).
 */
export const POST = route(async (request: Request) => {
  const user = await requireUser();
  const envelope = await parseJson(request, pushEnvelopeSchema, { maxBytes: BODY_LIMIT.push });
  let read: ReturnType<typeof readPush>;
  try {
    read = readPush(envelope);
  } catch (e) {
    if (e instanceof UnnamedItemError) throw new ValidationError(e.message, [{ path: e.path, message: "an item needs an id" }]);
    throw e;
  }
  assertSameAccount(user.id, read.request.account);
  const tooMany = await pushLimit(user.id);
  if (tooMany) return tooMany;
  return Response.json(await applyPush(db, user.id, read.request, read.refused), { headers: { "cache-control": "no-store" } });
});
