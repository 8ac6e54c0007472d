import { REFLIGHT_CAUSE_WORDS, REFLIGHT_PLACEMENT_WORDS } from "@/lib/field/ruling-words";
import type { RulingNote } from "@/lib/results";

/** Enough of a note to say it (a pulled server note has no ids). */
type NoteShown = Pick<RulingNote, "kind" | "recordedBy" | "points" | "flightIndex" | "reason" | "reflight">;

/** One ruling that does not count, in plain words: what was given, by whom, and why it is not applied. */
export function describeRulingNote(note: NoteShown, who: (userId: string) => string): string {
  const by = who(note.recordedBy);
  const detail = note.reason ? ` (${note.reason})` : "";
  const what =
    note.kind === "penalty"
      ? `${by}’s penalty of ${note.points} points${detail}`
      : note.kind === "invalid"
        ? `${by}’s invalid mark on flight ${(note.flightIndex ?? 0) + 1}${detail}`
        : note.kind === "unsigned"
          ? `${by} marked the result as not signed, which would score the round zero`
          : `${by} asked for a re-flight${note.reflight ? ` because of ${REFLIGHT_CAUSE_WORDS[note.reflight.cause]}, ${REFLIGHT_PLACEMENT_WORDS[note.reflight.placement].label}` : ""}${detail}`;
  return `Not applied: ${what}. Only a contest official’s ruling, or the pilot’s own on the record they timed, counts.`;
}

/**
 * The lane's rulings that do not count (lib/results rulingNotes): a partner's penalty, "not
 * signed" or re-flight at practice is shown, never silently dropped. Nothing when there are none.
 */
export function RulingNotes({ notes, lane, label, who }: { notes: readonly NoteShown[] | undefined; lane: number; label: string; who: (userId: string) => string }) {
  if (!notes || notes.length === 0) return null;
  return (
    <ul role="list" aria-label={`Rulings not applied, ${label}`} className="space-y-1 rounded-lg border-2 border-line p-3 text-sm">
      {notes.map((n, i) => (
        <li key={i} data-testid={`ruling-note-${lane}`}>
          {describeRulingNote(n, who)}
        </li>
      ))}
    </ul>
  );
}
