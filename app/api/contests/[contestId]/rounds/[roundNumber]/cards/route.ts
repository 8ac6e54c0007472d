// PUT /api/contests/[contestId]/rounds/[roundNumber]/cards — an officer enters one group's paper cards for a round
import { db } from "@/db";
import { saveGroupCards } from "@/db/queries/contest-results";
import { paperCardProblem } from "@/lib/contests/paper-card";
import { parseJson, route } from "@/lib/api";
import { requireOfficerRound } from "@/lib/auth/contest-role";
import { requireUser } from "@/lib/auth/session";
import { ConflictError, ValidationError } from "@/lib/errors";
import { groupCardsSchema } from "@/lib/validations/contest-results";

export const dynamic = "force-dynamic";

type Context = { params: Promise<{ contestId: string; roundNumber: string }> };

/**
 * 401 signed out, 404 no such contest/round or not a member, 403 not an officer; 422 a card for a
 * pilot not drawn in that group, or a task paper cards cannot carry (E). Saves every card or none.
 */
export const PUT = route(async (request: Request, context: Context) => {
  const me = await requireUser();
  const body = await parseJson(request, groupCardsSchema);
  const { round } = await requireOfficerRound(context.params);
  const problem = body.cards.some((c) => c.flights !== null) ? paperCardProblem(round.task) : null;
  if (problem) throw new ConflictError("paper_task", problem);
  const saved = await saveGroupCards(db, { roundId: round.id, groupNumber: body.groupNumber, userId: me.id, cards: body.cards });
  if (saved === "not_in_group") throw new ValidationError("A card names a pilot not drawn in this group.", []);
  return Response.json({ saved: body.cards.length }, { headers: { "cache-control": "no-store" } });
});
