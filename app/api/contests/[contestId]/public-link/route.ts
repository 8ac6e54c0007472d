// POST /api/contests/[contestId]/public-link — an officer makes (or renews) the public results link; DELETE revokes it
import { randomBytes } from "node:crypto";
import { db } from "@/db";
import { setPublicToken } from "@/db/queries/contest-results";
import { route } from "@/lib/api";
import { requireContestRole } from "@/lib/auth/contest-role";
import { requireUser } from "@/lib/auth/session";
import { NotFoundError } from "@/lib/errors";
import { contestIdSchema } from "@/lib/validations/contests";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ contestId: string }> };

async function officersContest(context: Context): Promise<string> {
  await requireUser();
  const params = contestIdSchema.safeParse(await context.params);
  if (!params.success) throw new NotFoundError();
  await requireContestRole(params.data.contestId, "officer");
  return params.data.contestId;
}

/** 401, 404, 403 as every officer route. A new secret each time: an older link stops working. */
export const POST = route(async (_request: Request, context: Context) => {
  const contestId = await officersContest(context);
  const token = randomBytes(32).toString("base64url");
  await setPublicToken(db, { contestId, token });
  return Response.json({ token, path: `/results/${token}` }, { status: 201, headers: { "cache-control": "no-store" } });
});

/** Revokes the link (idempotent). */
export const DELETE = route(async (_request: Request, context: Context) => {
  const contestId = await officersContest(context);
  await setPublicToken(db, { contestId, token: null });
  return Response.json({ revoked: true }, { headers: { "cache-control": "no-store" } });
});
