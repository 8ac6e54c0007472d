import { describe, expect, it } from "vitest";
import { notesOn, threadsOf, type NoteLike } from "@/lib/coach/notes";

const n = (id: string, at: number, o: Partial<NoteLike> = {}): NoteLike => ({ id, sessionId: "s1", runId: "r1", replyTo: null, createdAtMs: at, ...o });

describe("coach notes as threads", () => {
  it("a run's page shows its own notes and the whole session's, not a sibling run's", () => {
    const notes = [n("a", 1), n("b", 2, { runId: null }), n("c", 3, { runId: "r2" }), n("d", 4, { sessionId: "s2", runId: null })];
    expect(notesOn(notes, { id: "r1", sessionId: "s1" }).map((x) => x.id)).toEqual(["a", "b"]);
  });

  it("answers follow their note in time order; an answer without its note is left out", () => {
    const notes = [n("ans2", 30, { replyTo: "a" }), n("a", 10), n("ans1", 20, { replyTo: "a" }), n("b", 15), n("lost", 40, { replyTo: "gone" })];
    expect(threadsOf(notes).map((t) => [t.note.id, t.answers.map((x) => x.id)])).toEqual([["a", ["ans1", "ans2"]], ["b", []]]);
  });
});
