import { jsPDF } from "jspdf";
import { penaltyCauseText, penaltyNotCounted, penaltyWhoWhen, type ContestPenalty } from "./penalties";
import { reflightNote } from "./reflight-note";
import type { Standings } from "./standings";

const pts = (tenths: number | null) => (tenths === null ? "-" : (tenths / 10).toFixed(1));
/** The PDF's standard font covers Latin-1 only: anything else is shown as "?" rather than garbled. */
const latin1 = (s: string) => s.replace(/[^\u0020-\u007e\u00a0-\u00ff]/g, "?");

/**
 * The results as a PDF (jsPDF, A4 landscape): place, pilot, team, every round's points (a
 * dropped one in brackets, an unsigned one marked "u", one under an open dispute "d", a re-flown one "r", one
 * whose two records wait for the officer's decision "t"
 * with both results and which counted listed below, F3K.9.6), penalties, total; then the fly-off and
 * the teams; every penalty is listed under the table with its cause and, with `withWho`, who gave it
 * and when (the club's clock). The same numbers as the standings screen (one `Standings` value).
 */
export function resultsPdf(s: Standings, title: { name: string; day: string; field: string }, penalties: { list: readonly ContestPenalty[]; zone: string; withWho: boolean } = { list: [], zone: "UTC", withWho: false }): Uint8Array {
  const doc = new jsPDF({ orientation: "landscape", unit: "mm", format: "a4" });
  const left = 12;
  const bottom = 195;
  let y = 16;
  doc.setFont("helvetica", "bold").setFontSize(14).text(latin1(`Results: ${title.name}`), left, y);
  y += 6;
  doc.setFont("helvetica", "normal").setFontSize(9).text(latin1(`${title.day} - ${title.field}`), left, y);
  y += 8;

  const table = (rounds: Standings["rounds"], rows: Standings["pilots"], places: Map<string, number> | null) => {
    const roundW = Math.min(18, (273 - 110) / Math.max(1, rounds.length));
    const cols = [{ x: left, w: 12 }, { x: left + 12, w: 48 }, { x: left + 60, w: 30 }];
    const xRound = (i: number) => left + 90 + i * roundW;
    const xPen = left + 90 + rounds.length * roundW;
    const header = () => {
      doc.setFont("helvetica", "bold");
      doc.text("Place", cols[0]!.x, y).text("Pilot", cols[1]!.x, y).text("Team", cols[2]!.x, y);
      rounds.forEach((r, i) => doc.text(`R${r.number}${r.letter ? ` ${r.letter}` : ""}`, xRound(i) + roundW - 2, y, { align: "right" }));
      doc.text("Pen.", xPen + 14, y, { align: "right" }).text("Total", xPen + 34, y, { align: "right" });
      doc.setFont("helvetica", "normal").line(left, y + 1.5, xPen + 36, y + 1.5);
      y += 6;
    };
    header();
    for (const p of rows) {
      if (y > bottom) { doc.addPage(); y = 16; header(); }
      const place = places?.get(p.entryId) ?? p.rank;
      doc.text(`${place}${p.unresolvedTie ? "=" : ""}`, cols[0]!.x, y).text(latin1(p.name).slice(0, 30), cols[1]!.x, y).text(latin1(p.team ?? "").slice(0, 18), cols[2]!.x, y);
      p.rounds.forEach((c, i) => {
        const text = `${c.dropped ? `(${pts(c.pointsTenths)})` : pts(c.pointsTenths)}${c.resultTenths !== null && !c.signed ? " u" : ""}${c.disputed ? " d" : ""}${c.reflight ? " r" : ""}${c.undecided ? " t" : ""}`;
        doc.text(text, xRound(i) + roundW - 2, y, { align: "right" });
      });
      doc.text(p.penaltyTenths > 0 ? `-${pts(p.penaltyTenths)}` : "0", xPen + 14, y, { align: "right" });
      doc.setFont("helvetica", "bold").text(pts(p.totalTenths), xPen + 34, y, { align: "right" }).setFont("helvetica", "normal");
      y += 5.5;
    }
    y += 4;
  };

  const places = new Map(s.final.map((f) => [f.pilotId, f.rank]));
  table(s.rounds, [...s.pilots].sort((a, b) => (places.get(a.entryId) ?? 0) - (places.get(b.entryId) ?? 0)), places);
  doc.setFontSize(8).text("Points: result / best in the group x 1000 (F3K.9.1). u: not signed, scores 0 (F3K.1.2). d: result under dispute. r: re-flown (below). t: two records, not decided yet (the one held now counts). (x): dropped round; penalties count even so (F3K.10). =: tie for a fly-off.", left, Math.min(y, bottom + 8));
  y += 8;
  doc.setFontSize(9);
  const reflown = s.pilots.flatMap((p) => p.rounds.filter((c) => c.reflight).map((c) => `${p.name}, round ${c.roundNumber}: ${reflightNote(c)}`));
  if (reflown.length > 0) {
    if (y > bottom - 20) { doc.addPage(); y = 16; }
    doc.setFont("helvetica", "bold").text("Re-flights (F3K.9.6): which result counted", left, y).setFont("helvetica", "normal");
    y += 6;
    for (const line of reflown) {
      if (y > bottom) { doc.addPage(); y = 16; }
      doc.text(latin1(line), left, y);
      y += 5.5;
    }
    y += 4;
  }
  const penaltyLines = penalties.list.map((p) => {
    const what = `${p.isFlyOff ? "Fly-off round" : "Round"} ${p.roundNumber}, ${p.name}: -${p.points}${p.cause ? `, ${penaltyCauseText(p.cause)}` : ""}${p.reason ? ` "${p.reason}"` : ""}`;
    const notCounted = penaltyNotCounted(p);
    return `${what}${penalties.withWho ? `; ${penaltyWhoWhen(p, penalties.zone)}` : ""}${notCounted ? ` - not counted (${notCounted})` : ""}`;
  });
  if (penaltyLines.length > 0) {
    if (y > bottom - 20) { doc.addPage(); y = 16; }
    doc.setFont("helvetica", "bold").text("Penalties (F3K.4.3, F3K.9.5, F3K.4.1): each one", left, y).setFont("helvetica", "normal");
    y += 6;
    for (const line of penaltyLines) {
      for (const part of doc.splitTextToSize(latin1(line), 270) as string[]) {
        if (y > bottom) { doc.addPage(); y = 16; }
        doc.text(part, left, y);
        y += 5;
      }
    }
    y += 4;
  }
  if (s.flyOff) {
    if (y > bottom - 20) { doc.addPage(); y = 16; }
    doc.setFont("helvetica", "bold").text(s.flyOff.counted ? "Fly-off" : "Fly-off (fewer than 3 complete rounds: not counted yet)", left, y).setFont("helvetica", "normal");
    y += 6;
    table(s.flyOff.rounds, s.flyOff.pilots, null);
  }
  if (s.teams.length > 0) {
    if (y > bottom - 20) { doc.addPage(); y = 16; }
    doc.setFont("helvetica", "bold").text("Teams (three best members, F3K.10.4)", left, y).setFont("helvetica", "normal");
    y += 6;
    for (const t of s.teams) {
      if (y > bottom) { doc.addPage(); y = 16; }
      doc.text(latin1(`${t.rank}. ${t.team}: ${pts(t.totalTenths)} (${t.counted.join(", ")})`), left, y);
      y += 5.5;
    }
  }
  return new Uint8Array(doc.output("arraybuffer"));
}
