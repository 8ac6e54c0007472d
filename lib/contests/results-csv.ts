import Papa from "papaparse";
import { secondsText } from "@/lib/tasks/time";
import { RECORDS_UNDECIDED } from "./records";
import { UNDER_DISPUTE } from "./disputes";
import { paperCardResult } from "./paper-card";
import { clockText, penaltyCauseText, penaltyNotCounted, penaltySourceWords, type ContestPenalty } from "./penalties";
import { reflightNote } from "./reflight-note";
import type { Standings, StandingsInput } from "./standings";

const points = (tenths: number | null) => (tenths === null ? "" : (tenths / 10).toFixed(1));
/** CSV with a header row; cells that a spreadsheet would run as a formula are escaped (papaparse escapeFormulae). */
const csv = (fields: string[], data: (string | number)[][]) => Papa.unparse({ fields, data }, { escapeFormulae: true, newline: "\r\n" });

/**
 * The standings as CSV: place, pilot, team, each round's points (a dropped one in brackets), penalties,
 * total, a note (ties, unsigned and disputed results), and the re-flights: per re-flown round both
 * results and which one counted (F3K.9.6).
 */
export function resultsCsv(s: Standings): string {
  const place = new Map(s.final.map((f) => [f.pilotId, f.rank]));
  const fields = ["Place", "Pilot", "Team", ...s.rounds.map((r) => `Round ${r.number}${r.letter ? ` (${r.letter})` : ""}`), "Penalties", "Total", "Note", "Re-flights"];
  const data = [...s.pilots].sort((a, b) => (place.get(a.entryId) ?? 0) - (place.get(b.entryId) ?? 0)).map((p) => [
    place.get(p.entryId) ?? p.rank, p.name, p.team ?? "",
    ...p.rounds.map((c) => (c.dropped ? `(${points(c.pointsTenths)})` : points(c.pointsTenths))),
    points(p.penaltyTenths), points(p.totalTenths),
    [p.unresolvedTie ? "tie: fly-off" : "", ...p.rounds.filter((c) => c.resultTenths !== null && !c.signed).map((c) => `round ${c.roundNumber} unsigned`),
      ...p.rounds.filter((c) => c.disputed).map((c) => `round ${c.roundNumber} ${UNDER_DISPUTE}`),
      ...p.rounds.filter((c) => c.undecided).map((c) => `round ${c.roundNumber} ${RECORDS_UNDECIDED}`)].filter(Boolean).join("; "),
    p.rounds.filter((c) => c.reflight).map((c) => `round ${c.roundNumber}: ${reflightNote(c)}`).join("; "),
  ]);
  return csv(fields, data);
}

export type SlotFlights = { roundId: string; groupNumber: number; entryId: string; runFlights: { timeTenths: number; creditedTenths: number; status: string; reason: string | null }[] | null };

/** Every flight of the contest as CSV: a paper card's times scored by the task engine, or the linked run lane's derived flights. */
export function flightsCsv(input: StandingsInput, slotFlights: readonly SlotFlights[]): string {
  const names = new Map(input.entries.map((e) => [e.id, e.name]));
  const rows: (string | number)[][] = [];
  for (const round of [...input.rounds].sort((a, b) => Number(a.isFlyOff) - Number(b.isFlyOff) || a.number - b.number)) {
    for (const slot of input.slots.filter((s) => s.roundId === round.id).sort((a, b) => a.groupNumber - b.groupNumber)) {
      const label = `${round.isFlyOff ? "Fly-off " : ""}${round.number}`;
      const base = [label, round.task.letter ?? "", slot.groupNumber, names.get(slot.entryId) ?? "?"];
      const signed = slot.signed ? "yes" : "no";
      if (slot.paperFlights !== null) {
        const scored = paperCardResult(round.task, slot.paperFlights);
        slot.paperFlights.forEach((t, i) => {
          const f = scored.flights[i];
          rows.push([...base, "paper card", i + 1, secondsText(t), secondsText(f?.countedTenths ?? 0), f?.status ?? "", f?.reason ?? "", signed]);
        });
      } else {
        const run = slotFlights.find((f) => f.roundId === slot.roundId && f.entryId === slot.entryId)?.runFlights ?? [];
        run.forEach((f, i) => rows.push([...base, "timed run", i + 1, secondsText(f.timeTenths), secondsText(f.creditedTenths), f.status, f.reason ?? "", signed]));
      }
    }
  }
  return csv(["Round", "Task", "Group", "Pilot", "Recorded by", "Flight", "Time (s)", "Counted (s)", "Status", "Reason", "Signed"], rows);
}

/**
 * Every penalty of the contest as CSV, one a row (db/queries/contest-penalties.ts listContestPenalties):
 * round, pilot, points, cause with its rule, the note or the phone's reason, where it was given, who and
 * when (the club's clock, `zone`), whether it counts (and why not: removed, F3K.4.3), and a removal's
 * who, when and why.
 */
export function penaltiesCsv(list: readonly ContestPenalty[], zone: string): string {
  const rows = list.map((p) => [
    `${p.isFlyOff ? "Fly-off " : ""}${p.roundNumber}`, p.name, p.points, penaltyCauseText(p.cause), p.reason ?? "", penaltySourceWords(p.source),
    p.givenBy ?? "", clockText(p.givenAtMs, zone), penaltyNotCounted(p) === null ? "yes" : `no: ${penaltyNotCounted(p)}`,
    p.removedBy ?? "", clockText(p.removedAtMs, zone), p.removedReason ?? "",
  ]);
  return csv(["Round", "Pilot", "Points", "Cause", "Note", "Given", "Given by", "Given at", "Counts", "Removed by", "Removed at", "Why removed"], rows);
}
