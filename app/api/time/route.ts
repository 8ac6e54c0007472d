// POST /api/time — one NTP-style exchange: echo the device's T1 with the server's receive (T2) and send (T3) times
import { parseJson, route } from "@/lib/api";
import { requireUser } from "@/lib/auth/session";
import { timeRequestSchema, type TimeReply } from "@/lib/validations/sync";

export const dynamic = "force-dynamic";

/**
 * RFC 5905 §8: T2 is read first thing and T3 last, so the server's own work falls inside
 * (T3 − T2) and is not counted as network delay. Signed-in users only (the clock is not a
 * public service), so a 401 still costs the device nothing but one sample.
 */
export const POST = route(async (request: Request) => {
  const t2 = Date.now();
  await requireUser();
  const { t1 } = await parseJson(request, timeRequestSchema);
  const reply: TimeReply = { t1, t2, t3: 0 };
  reply.t3 = Date.now();
  return Response.json(reply, { headers: { "cache-control": "no-store" } });
});
