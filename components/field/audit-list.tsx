import type { RunEvent } from "@/lib/events/schema";
import type { RunLane } from "@/lib/offline/entities";

type Props = { events: readonly RunEvent[]; lanes: readonly RunLane[]; deviceId: string; myName: string | null };

const time = new Intl.DateTimeFormat("en-GB", { hour: "2-digit", minute: "2-digit", second: "2-digit" });
const KIND_WORDS: Record<string, string> = {
  launch: "launch",
  landing: "landing",
  "window-start": "working-time start",
  target: "target call",
  "end-call": "end-of-working-time call",
  "run-end": "closing of the window",
  correct: "correction",
  void: "undo",
  invalid: "invalid mark",
  penalty: "penalty",
};

/**
 * Every undo, correction, invalid mark and penalty of the run, oldest first, with who and
 * when: each is its own event, and the events it supersedes stay in the log.
 */
export function AuditList({ events, lanes, deviceId, myName }: Props) {
  const byId = new Map(events.map((e) => [e.id, e]));
  const laneName = (lane: number) => lanes.find((l) => l.lane === lane)?.pilotName ?? `lane ${lane + 1}`;
  const rows = events.filter((e) => ["void", "correct", "invalid", "penalty"].includes(e.body.kind)).sort((a, b) => a.stamp.wallMs - b.stamp.wallMs);
  if (rows.length === 0) return <p className="text-muted">No corrections yet.</p>;
  return (
    <ol aria-label="Corrections" className="space-y-2">
      {rows.map((e) => {
        const who = e.deviceId === deviceId ? `${myName ?? "you"} on this phone` : "another phone";
        return (
          <li key={e.id} className="rounded-lg border-2 border-line p-2">
            <p className="font-semibold">{describe(e, byId, laneName)}</p>
            <p className="figures text-sm text-muted">
              {time.format(new Date(e.stamp.wallMs))} · {who}
            </p>
          </li>
        );
      })}
    </ol>
  );
}

function describe(e: RunEvent, byId: Map<string, RunEvent>, laneName: (lane: number) => string): string {
  const b = e.body;
  switch (b.kind) {
    case "void": {
      const t = byId.get(b.targetId);
      const lane = t && "lane" in t.body ? ` (${laneName(t.body.lane)})` : "";
      return `Undid the ${t ? KIND_WORDS[t.body.kind] : "event"}${lane}`;
    }
    case "correct": {
      const t = byId.get(b.targetId);
      if (!t) return "Corrected a time";
      const moved = (b.wallMs - t.stamp.wallMs) / 1000;
      const lane = "lane" in t.body ? ` (${laneName(t.body.lane)})` : "";
      return `Moved the ${KIND_WORDS[t.body.kind]}${lane} by ${moved >= 0 ? "+" : "−"}${Math.abs(moved).toFixed(1)} s`;
    }
    case "invalid":
      return `Flight ${b.flightIndex + 1} of ${laneName(b.lane)} scores zero: ${b.reason.replaceAll("-", " ")}`;
    case "penalty":
      return `Penalty −${b.points} for ${laneName(b.lane)}: ${b.reason}`;
    default:
      return KIND_WORDS[b.kind] ?? b.kind;
  }
}
