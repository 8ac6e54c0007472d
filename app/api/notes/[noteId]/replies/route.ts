// POST /api/notes/[noteId]/replies — the note's pilot, or its coach while the grant holds, answers in its thread (404 for anyone else)
import { db } from "@/db";
import { replyToNote } from "@/db/queries/coach/notes";
import { parseJson, route } from "@/lib/api";
import { requireUser } from "@/lib/auth/session";
import { noteIdSchema, noteReplySchema } from "@/lib/validations/coach";
import { NotFoundError } from "@/lib/errors";

export const dynamic = "force-dynamic";
type Context = { params: Promise<{ noteId: string }> };

export const POST = route(async (request: Request, context: Context) => {
  const user = await requireUser();
  const params = noteIdSchema.safeParse(await context.params);
  if (!params.success) throw new NotFoundError("No such note.");
  const { body } = await parseJson(request, noteReplySchema);
  const note = await replyToNote(db, { userId: user.id, noteId: params.data.noteId, body });
  if (!note) throw new NotFoundError("No such note.");
  return Response.json({ note }, { status: 201 });
});
