// POST /api/notes — a coach writes a note on a granting pilot's run or session (404 without the pilot's grant, or for a run or session not in the pilot's record)
import { db } from "@/db";
import { createNote } from "@/db/queries/coach/notes";
import { parseJson, route } from "@/lib/api";
import { requireUser } from "@/lib/auth/session";
import { NotFoundError } from "@/lib/errors";
import { noteCreateSchema } from "@/lib/validations/coach";

export const dynamic = "force-dynamic";

export const POST = route(async (request: Request) => {
  const user = await requireUser();
  const input = await parseJson(request, noteCreateSchema);
  const note = await createNote(db, { coachId: user.id, ...input });
  if (!note) throw new NotFoundError("No such run or session of a pilot who lets you see their season.");
  return Response.json({ note }, { status: 201 });
});
