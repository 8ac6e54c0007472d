import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { db } from "@/db";
import { getContest, listSlots } from "@/db/queries/contests";
import type { TaskDefinition } from "@/lib/tasks";
import { formatDate } from "@/lib/format";
import { roundName, type RoundRef } from "@/lib/contests/round-key";
import { contestIdSchema } from "@/lib/validations/contests";
import { contestPageAccess } from "../../_components/guard";
import { PrintButton } from "../results/_components/results-tools";

export const metadata: Metadata = { title: "Group lists and scoresheets" };
export const dynamic = "force-dynamic";

/** Boxes on a scoresheet: the task's launch limit or attempts, else six (at most eight fit a printed line). */
function flightBoxes(task: TaskDefinition): number {
  if (task.kind === "all-up") return task.attempts;
  if (task.kind === "window" && task.launchLimit !== null) return Math.min(task.launchLimit, 8);
  return 6;
}

/** For printing: each round's group lists, then one scoresheet per group with boxes for flight times and signature lines. */
export default async function SheetsPage({ params }: { params: Promise<{ contestId: string }> }) {
  const parsed = contestIdSchema.safeParse(await params);
  if (!parsed.success) notFound();
  const { contestId } = parsed.data;
  await contestPageAccess({ contestId, role: "member", back: `/contests/${contestId}/sheets` });
  const found = await getContest(db, contestId);
  if (!found) notFound();
  const { contest, entries } = found;
  // the preliminary rounds, then the fly-off's (their pilots once it is drawn)
  const rounds = [...found.rounds.map((r) => ({ ...r, flyOff: false })), ...found.flyOffRounds.map((r) => ({ ...r, flyOff: true }))];
  const [prelimSlots, flyOffSlots] = await Promise.all([listSlots(db, contestId), found.flyOffRounds.length > 0 ? listSlots(db, contestId, true) : []]);
  const slots = [...prelimSlots.map((s) => ({ ...s, flyOff: false })), ...flyOffSlots.map((s) => ({ ...s, flyOff: true }))];
  const names = new Map(entries.map((e) => [e.id, e.pilotName]));
  const day = formatDate(new Date(`${contest.startsOn}T12:00:00Z`));
  const groupsOf = (r: RoundRef) => {
    const inRound = slots.filter((s) => s.roundNumber === r.number && s.flyOff === r.flyOff);
    return [...new Set(inRound.map((s) => s.groupNumber))].map((g) => ({
      group: g, pilots: inRound.filter((s) => s.groupNumber === g).map((s) => names.get(s.entryId) ?? "?").sort((a, b) => a.localeCompare(b)),
    }));
  };
  return (
    <div className="space-y-8 print:space-y-0">
      <header className="space-y-2 print:hidden">
        <p><Link className="underline" href={`/contests/${contestId}`}>{contest.name}</Link> · <Link className="underline" href={`/contests/${contestId}/results`}>Results</Link></p>
        <h1 className="text-2xl font-extrabold">Group lists and scoresheets</h1>
        {slots.length === 0 ? <p className="text-muted">Not drawn yet.</p> : <p>Draw seed {contest.drawSeed}{contest.drawLockedAt ? " · locked" : " · not locked yet"}</p>}
        <PrintButton label="Print the sheets" />
      </header>
      <section aria-labelledby="group-lists" className="print-sheet space-y-3">
        <h2 id="group-lists" className="text-lg font-bold">Group lists · {contest.name} · {day}</h2>
        {rounds.map((r) => (
          <div key={r.id}>
            <h3 className="font-bold">{roundName(r)} · task {r.task.letter}: {r.task.name}</h3>
            <ul>{groupsOf(r).map(({ group, pilots }) => <li key={group}><span className="font-semibold">Group {group}:</span> {pilots.join(", ")}</li>)}</ul>
          </div>
        ))}
        <p className="text-xs">Draw seed {contest.drawSeed ?? "—"}</p>
      </section>
      {rounds.flatMap((r) => groupsOf(r).map(({ group, pilots }) => {
        const boxes = flightBoxes(r.task);
        return (
          <section key={`${r.id}-${group}`} aria-label={`Scoresheet ${roundName(r).toLowerCase()} group ${group}`} className="print-sheet card space-y-2 rounded-xl border border-line bg-raised p-3 print:rounded-none print:border-0 print:p-0">
            <h2 className="text-lg font-bold">Scoresheet · {roundName(r).toLowerCase()} · group {group}</h2>
            <p className="text-sm">{contest.name} · {day} · task {r.task.letter}: {r.task.name}</p>
            <div className="overflow-x-auto print:overflow-visible" tabIndex={0}>
              <table className="w-full border-collapse text-sm">
                <thead>
                  <tr>
                    <th scope="col" className="border border-line p-1 text-left">Pilot</th>
                    {Array.from({ length: boxes }, (_, i) => <th scope="col" key={i} className="border border-line p-1">Flight {i + 1}</th>)}
                    <th scope="col" className="border border-line p-1">Result</th>
                    <th scope="col" className="border border-line p-1">Penalty</th>
                    <th scope="col" className="border border-line p-1">Pilot&apos;s signature</th>
                    <th scope="col" className="border border-line p-1">Timekeeper&apos;s signature</th>
                  </tr>
                </thead>
                <tbody>
                  {pilots.map((name) => (
                    <tr key={name} className="h-12">
                      <th scope="row" className="border border-line p-1 text-left font-semibold">{name}</th>
                      {Array.from({ length: boxes }, (_, i) => <td key={i} className="min-w-16 border border-line p-1" />)}
                      <td className="min-w-16 border border-line p-1" />
                      <td className="min-w-12 border border-line p-1" />
                      <td className="min-w-32 border border-line p-1" />
                      <td className="min-w-32 border border-line p-1" />
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
            <p className="text-xs">Times to 0.1 s, never rounded up (F3K.7). A result not signed by pilot and timekeeper scores zero (F3K.1.2).</p>
          </section>
        );
      }))}
    </div>
  );
}
