import { PENALTY_CAUSE_WORDS } from "@/lib/field/ruling-words";
import type { SetAsidePenalty } from "@/lib/results";

const clock = new Intl.DateTimeFormat("en-GB", { hour: "2-digit", minute: "2-digit", timeZoneName: "short" });

/**
 * The lane's phone penalties an officer set aside on the contest's round page: struck through, with who,
 * when (this phone's clock and zone) and why. They no longer count (runResult folds the decision as an
 * undo); nothing when there are none.
 */
export function SetAsidePenalties({ list, label }: { list: readonly SetAsidePenalty[]; label: string }) {
  if (list.length === 0) return null;
  return (
    <ul aria-label={`Penalties set aside by an officer, ${label}`} className="space-y-1 rounded-lg border-2 border-line p-3 text-sm">
      {list.map((s) => (
        <li key={s.id}>
          <span className="line-through">−{s.points} points · {s.cause ? PENALTY_CAUSE_WORDS[s.cause].label : s.penaltyReason}</span>{" "}
          — set aside by {s.by ?? "an officer"} at {clock.format(new Date(s.atMs))}: {s.why}
        </li>
      ))}
    </ul>
  );
}
