// GET /api/public-results/[token]?format=json|csv — a contest's standings through its public link (no account)
import { db } from "@/db";
import { contestIdByPublicToken } from "@/db/queries/contest-results";
import { route, toValidationError } from "@/lib/api";
import { NotFoundError } from "@/lib/errors";
import { publicResultsQuerySchema, publicTokenSchema } from "@/lib/validations/contest-results";
import { resultsReply } from "../../contests/results-reply";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ token: string }> };

/**
 * Public on purpose: the officer made this unguessable link (32 random bytes) to publish the
 * standings; it reads the same standings members see and nothing else, and 404s once revoked.
 */
export const GET = route(async (request: Request, context: Context) => {
  const query = publicResultsQuerySchema.safeParse(Object.fromEntries(new URL(request.url).searchParams));
  if (!query.success) throw toValidationError(query.error);
  const params = publicTokenSchema.safeParse(await context.params);
  if (!params.success) throw new NotFoundError();
  const contestId = await contestIdByPublicToken(db, params.data.token);
  if (!contestId) throw new NotFoundError();
  return resultsReply(contestId, query.data.format, { members: false });
});
