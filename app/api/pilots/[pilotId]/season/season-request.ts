import type { z } from "zod";
import { db } from "@/db";
import { canReadSeason } from "@/db/queries/season/access";
import { toValidationError } from "@/lib/api";
import { requireUserFromToken } from "@/lib/auth/session";
import { NotFoundError } from "@/lib/errors";
import { seasonParamsSchema } from "@/lib/validations/season";

export type SeasonContext = { params: Promise<{ pilotId: string }> };

const NO_SEASON = "No season to show for that pilot.";

/**
 * The start of every season route: the signed-in user (401; the cookie decoded and the account read
 * once, requireUserFromToken), the query parsed by `schema` (422),
 * then the pilot from the path, readable only if canReadSeason says so (else 404, as for a pilot
 * that does not exist: nobody learns whose seasons exist).
 */
export async function readSeasonRequest<T extends z.ZodType>(request: Request, context: SeasonContext, schema: T) {
  const user = await requireUserFromToken();
  const query = schema.safeParse(Object.fromEntries(new URL(request.url).searchParams));
  if (!query.success) throw toValidationError(query.error);
  const params = seasonParamsSchema.safeParse(await context.params);
  if (!params.success) throw new NotFoundError(NO_SEASON);
  if (!(await canReadSeason(db, { viewerId: user.id, pilotId: params.data.pilotId }))) throw new NotFoundError(NO_SEASON);
  return { user, pilotId: params.data.pilotId, query: query.data as z.infer<T> };
}

export const NO_STORE = { "cache-control": "private, no-store" } as const;
