import type { RunEvent } from "@/lib/events/schema";
import type { RunLane } from "@/lib/events/entities";

type Props = {
  events: readonly RunEvent[];
  lanes: readonly RunLane[];
  /** This device's id, to say "this phone". */
  deviceId: string | null;
  /** Names of known recorders by user id (e.g. the signed-in user), else the id is shortened. */
  names?: Readonly<Record<string, string>>;
};

const clock = new Intl.DateTimeFormat("en-GB", { hour: "2-digit", minute: "2-digit", second: "2-digit" });
const WORDS: Record<RunEvent["body"]["kind"], string> = {
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
  unsigned: "not-signed ruling",
  signed: "signature of pilot and timekeeper",
  reflight: "re-flight",
  model: "model choice",
};
const AUDITED = new Set(["void", "correct", "invalid", "penalty", "unsigned", "reflight"]);

/**
 * The audit trail: every undo, time correction, invalid mark and penalty, oldest first,
 * with when (device clock) and by whom on which device. The events they supersede stay in
 * the log; the results above already apply them.
 */
export function CorrectionsList({ events, lanes, deviceId, names = {} }: Props) {
  const byId = new Map(events.map((e) => [e.id, e]));
  const laneName = (lane: number) => lanes.find((l) => l.lane === lane)?.pilotName ?? `lane ${lane + 1}`;
  const rows = events.filter((e) => AUDITED.has(e.body.kind)).sort((a, b) => a.stamp.wallMs - b.stamp.wallMs || a.seq - b.seq);
  if (rows.length === 0) return <p className="text-muted">No corrections: every tap stands as recorded.</p>;
  return (
    <ol aria-label="Corrections" className="space-y-2">
      {rows.map((e) => {
        const device = e.deviceId === deviceId ? "this phone" : `phone ${e.deviceId.slice(-6)}`;
        const officer = e.body.kind === "void" && e.body.setAside ? `${e.body.setAside.by ?? "an officer"}, officer, on the server` : null;
        const who = officer ?? (e.recordedBy ? `${names[e.recordedBy] ?? `user ${e.recordedBy.slice(0, 8)}`} on ${device}` : device);
        return (
          <li key={e.id} className="rounded-lg border-2 border-line p-2">
            <p className="font-semibold">{describe(e, byId, laneName)}</p>
            <p className="figures text-sm text-muted">
              {clock.format(new Date(e.stamp.wallMs))} · {who}
            </p>
          </li>
        );
      })}
    </ol>
  );
}

function describe(e: RunEvent, byId: Map<string, RunEvent>, laneName: (lane: number) => string): string {
  const b = e.body;
  const of = (t: RunEvent | undefined) => (t && "lane" in t.body ? ` of ${laneName(t.body.lane)}` : "");
  switch (b.kind) {
    case "void": {
      const t = byId.get(b.targetId);
      if (b.setAside) return `Set aside by ${b.setAside.by ?? "an officer"} on the contest's round page: the ${t ? WORDS[t.body.kind] : "event"}${of(t)} no longer counts (${b.setAside.reason})`;
      return `Undo: the ${t ? WORDS[t.body.kind] : "event"}${of(t)} no longer counts`;
    }
    case "correct": {
      const t = byId.get(b.targetId);
      if (!t) return "Corrected a time";
      const moved = Math.round((b.wallMs - t.stamp.wallMs) / 100) / 10;
      return `Moved the ${WORDS[t.body.kind]}${of(t)} by ${moved >= 0 ? "+" : "−"}${Math.abs(moved).toFixed(1)} s`;
    }
    case "invalid": {
      const launch = b.flightId ? byId.get(b.flightId) : undefined;
      const which = launch ? `The flight launched at ${clock.format(new Date(launch.stamp.wallMs))}` : b.flightIndex !== undefined ? `Flight ${b.flightIndex + 1}` : "A flight";
      return `${which} of ${laneName(b.lane)} scores zero: ${b.reason.replaceAll("-", " ")}`;
    }
    case "penalty":
      return `Penalty −${b.points} points for ${laneName(b.lane)}: ${b.reason}${b.midAir ? " (mid-air collision)" : ""}`;
    case "unsigned":
      return `The round result of ${laneName(b.lane)} was not signed: the round scores zero`;
    case "reflight":
      return `Re-flight granted to ${laneName(b.lane)}${b.reason ? `: ${b.reason}` : ""}`;
    default:
      return WORDS[b.kind];
  }
}
