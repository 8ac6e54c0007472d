// GET /api/contests/[contestId]/results?format=json|csv|flights-csv|penalties-csv|pdf — the live standings, for the club's members
import { route, toValidationError } from "@/lib/api";
import { requireContestRole } from "@/lib/auth/contest-role";
import { requireUser } from "@/lib/auth/session";
import { NotFoundError } from "@/lib/errors";
import { contestIdSchema } from "@/lib/validations/contests";
import { resultsQuerySchema } from "@/lib/validations/contest-results";
import { resultsReply } from "../../results-reply";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ contestId: string }> };

/** 401 signed out, 404 no such contest or not a member of its club; 422 an unknown format. */
export const GET = route(async (request: Request, context: Context) => {
  await requireUser();
  const query = resultsQuerySchema.safeParse(Object.fromEntries(new URL(request.url).searchParams));
  if (!query.success) throw toValidationError(query.error);
  const params = contestIdSchema.safeParse(await context.params);
  if (!params.success) throw new NotFoundError();
  await requireContestRole(params.data.contestId, "member");
  return resultsReply(params.data.contestId, query.data.format, { members: true });
});

