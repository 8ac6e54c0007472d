type Slot = { roundNumber: number; groupNumber: number; entryId: string };

/** The draw's group lists per round, names in entry order. */
export function DrawLists({ slots, names, letters }: { slots: Slot[]; names: Map<string, string>; letters: Map<number, string> }) {
  const rounds = [...new Set(slots.map((s) => s.roundNumber))];
  return (
    <div className="space-y-4">
      {rounds.map((r) => {
        const inRound = slots.filter((s) => s.roundNumber === r);
        const groups = [...new Set(inRound.map((s) => s.groupNumber))];
        return (
          <section key={r} aria-label={`Round ${r}`} className="card rounded-xl border border-line bg-raised p-3">
            <h3 className="font-bold">Round {r} · task {letters.get(r) ?? "?"}</h3>
            {groups.map((g) => (
              <p key={g}><span className="font-semibold">Group {g}:</span>{" "}
                {inRound.filter((s) => s.groupNumber === g).map((s) => names.get(s.entryId) ?? "?").sort().join(", ")}</p>
            ))}
          </section>
        );
      })}
    </div>
  );
}

/** The draw's changes, newest first, with who made them and when (every member sees why a group changed). */
export function DrawChangeList({ changes }: { changes: { id: string; summary: string; by: string | null; at: string }[] }) {
  if (changes.length === 0) return null;
  return (
    <section aria-labelledby="changes-title" className="space-y-1">
      <h3 id="changes-title" className="font-bold">Changes to the draw</h3>
      <ul className="space-y-1 text-sm">
        {changes.map((c) => <li key={c.id}>{c.summary} <span className="text-muted">— {c.by ?? "a former officer"}, {c.at}</span></li>)}
      </ul>
    </section>
  );
}
