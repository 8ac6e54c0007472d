// GET /api/sync/pull?cursor=C&limit=N[&coaching=F] — everything the user may see that changed after cursor C, a page of at most N items
import { db } from "@/db";
import { listChanges } from "@/db/queries/sync-pull";
import { route, toValidationError } from "@/lib/api";
import { requireUser } from "@/lib/auth/session";
import { assertSameAccount } from "@/lib/sync/authorise";
import { pullQuerySchema } from "@/lib/validations/sync";

export const dynamic = "force-dynamic";

export const GET = route(async (request: Request) => {
  const user = await requireUser();
  const parsed = pullQuerySchema.safeParse(Object.fromEntries(new URL(request.url).searchParams));
  if (!parsed.success) throw toValidationError(parsed.error);
  assertSameAccount(user.id, parsed.data.account);
  const { cursor, limit, total, coaching } = parsed.data;
  const reply = await listChanges(db, { userId: user.id, cursor, limit, total: total === "1", coaching });
  return Response.json(reply, { headers: { "cache-control": "no-store" } });
});
