/** Coach notes as threads (pure): which notes belong on a run's page, and each note with its answers. */

export type NoteLike = { id: string; sessionId: string; runId: string | null; replyTo: string | null; createdAtMs: number };

/** The notes about a run and about the run's whole session. */
export function notesOn<N extends NoteLike>(notes: readonly N[], run: { id: string; sessionId: string }): N[] {
  return notes.filter((n) => n.runId === run.id || (n.runId === null && n.sessionId === run.sessionId));
}

/** Each note (oldest first) with its answers (oldest first); an answer whose note is missing is left out. */
export function threadsOf<N extends NoteLike>(notes: readonly N[]): { note: N; answers: N[] }[] {
  const byTime = [...notes].sort((a, b) => a.createdAtMs - b.createdAtMs || a.id.localeCompare(b.id));
  const threads = byTime.filter((n) => n.replyTo === null).map((note) => ({ note, answers: [] as N[] }));
  const byId = new Map(threads.map((t) => [t.note.id, t]));
  for (const n of byTime) if (n.replyTo !== null) byId.get(n.replyTo)?.answers.push(n);
  return threads;
}
