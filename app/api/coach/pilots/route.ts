// GET /api/coach/pilots — the coach's roster: each granting pilot's last session, runs this month, result and turnaround trend (takes up e-mail offers first)
import { db } from "@/db";
import { acceptEmailOffers } from "@/db/queries/coach/grants";
import { getRoster } from "@/db/queries/coach/roster";
import { route } from "@/lib/api";
import { requireUser } from "@/lib/auth/session";

export const dynamic = "force-dynamic";

export const GET = route(async () => {
  const user = await requireUser();
  await acceptEmailOffers(db, user);
  return Response.json({ pilots: await getRoster(db, user.id) }, { headers: { "cache-control": "private, no-store" } });
});
