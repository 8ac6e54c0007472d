"use client";

import { useLiveQuery } from "dexie-react-hooks";
import { requestJson } from "@/components/request/json";
import { useSync } from "@/components/sync/sync-provider";
import { formatDate } from "@/lib/format";
import { getMeta, getWindowcallDb, setMeta } from "@/lib/offline/db";
import { notesOn, threadsOf } from "@/lib/coach/notes";
import type { StoredRun } from "@/lib/offline/db";
import type { PulledNote } from "@/lib/validations/coaching-sync";
import { NoteForm } from "./note-form";

/** Sends a note or an answer; the reply is kept in the device database at once, and a pull follows. */
async function post(url: string, body: unknown): Promise<PulledNote> {
  const data = await requestJson<{ note: PulledNote }>("POST", url, body);
  const db = getWindowcallDb();
  const kept = (await getMeta(db, "notes")) ?? [];
  await setMeta(db, "notes", [...kept.filter((n) => n.id !== data.note!.id), data.note]);
  return data.note;
}

/**
 * Coach notes on a run and on its session, read from the device database (pulled with everything
 * else, so they show offline), each with its answers. The pilot answers there; a coach who sees
 * the run as a coach's copy writes a new note for its pilot.
 */
export function RunNotes({ run, me }: { run: StoredRun; me: string | null }) {
  const { client, wake } = useSync();
  const notes = useLiveQuery(async () => (await getMeta(getWindowcallDb(), "notes")) ?? [], []);
  if (!notes) return null;
  const threads = threadsOf(notesOn(notes, run));
  // a coach's copy: the run is neither recorded by nor flown by this account
  const coachedLanes = me && run.recordedBy && run.recordedBy.id !== me && !run.lanes.some((l) => l.pilotUserId === me)
    ? run.lanes.filter((l) => l.pilotUserId) : [];
  const after = () => (client ? void client.sync() : wake()); // a client loaded later syncs when it starts
  return (
    <section aria-labelledby="notes-h" className="space-y-3">
      <h2 id="notes-h" className="text-lg font-bold">Coach notes</h2>
      {threads.length === 0 ? <p className="text-muted">No notes on this run or its session yet.</p> : null}
      <ul className="space-y-3">
        {threads.map(({ note, answers }) => (
          <li key={note.id} className="space-y-2 rounded-xl border-2 border-line p-3">
            <article aria-label={`Note from ${note.authorName}`}>
              <p className="text-sm text-muted">{note.authorName} · {formatDate(new Date(note.createdAtMs))} · {note.runId ? "on this run" : "on the whole session"}</p>
              <p className="whitespace-pre-wrap">{note.body}</p>
            </article>
            {answers.length > 0 ? (
              <ul className="space-y-2 border-l-4 border-line pl-3" aria-label="Answers">
                {answers.map((a) => (
                  <li key={a.id}>
                    <p className="text-sm text-muted">{a.authorName} · {formatDate(new Date(a.createdAtMs))}</p>
                    <p className="whitespace-pre-wrap">{a.body}</p>
                  </li>
                ))}
              </ul>
            ) : null}
            {me === note.pilotId || me === note.coachId ? (
              <NoteForm id={`answer-${note.id}`} label="Your answer" submitLabel="Send the answer"
                onSend={async (body) => { await post(`/api/notes/${note.id}/replies`, { body }); after(); }} />
            ) : null}
          </li>
        ))}
      </ul>
      {coachedLanes.map((l) => (
        <div key={l.lane} className="space-y-2">
          <NoteForm id={`note-run-${l.lane}`} label={`A note for ${l.pilotName} on this run`} submitLabel="Send the note"
            onSend={async (body) => { await post("/api/notes", { pilotId: l.pilotUserId, runId: run.id, body }); after(); }} />
          <details>
            <summary className="flex min-h-touch cursor-pointer items-center font-bold">A note on the whole session instead</summary>
            <NoteForm id={`note-session-${l.lane}`} label={`A note for ${l.pilotName} on this session`} submitLabel="Send the session note"
              onSend={async (body) => { await post("/api/notes", { pilotId: l.pilotUserId, sessionId: run.sessionId, body }); after(); }} />
          </details>
        </div>
      ))}
    </section>
  );
}
