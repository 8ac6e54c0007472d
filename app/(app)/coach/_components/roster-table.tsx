import Link from "next/link";
import type { RosterPilot } from "./coach-api";
import type { PulledPlan } from "@/lib/validations/coaching-sync";
import { dayText, secondsText, shareText } from "@/app/(app)/season/_components/season-format";
import { ScrollRegion } from "@/components/ui/scroll-region";

// the Season's own formats, so a pilot's share and turnaround read the same on both screens
const secs = (v: number | null) => secondsText(v === null ? null : Math.round(v * 10));

/** "up", "down" or "steady" in words (a share higher is better; a turnaround lower is better). */
function trend(recent: number | null, before: number | null, better: "higher" | "lower", fmt: (v: number | null) => string): string {
  if (recent === null) return "no runs in the last 30 days";
  if (before === null) return `${fmt(recent)} (nothing to compare with)`;
  const delta = recent - before;
  const same = Math.abs(delta) < (better === "higher" ? 0.01 : 0.05);
  const improved = better === "higher" ? delta > 0 : delta < 0;
  return `${fmt(recent)}, ${same ? "steady" : improved ? "better" : "worse"} than the 30 days before (${fmt(before)})`;
}

const when = (iso: string | null) => (iso ? dayText(iso) : "never");

/** The roster as a table: a pilot's name opens their Season. */
export function RosterTable({ pilots, plans }: { pilots: RosterPilot[]; plans: PulledPlan[] }) {
  return (
    <ScrollRegion label="Pilots who let you see their season">
      <table className="w-full text-left text-sm">
        <caption className="sr-only">Pilots who let you see their season</caption>
        <thead>
          <tr>
            <th scope="col" className="p-2">Pilot</th>
            <th scope="col" className="p-2">Last session</th>
            <th scope="col" className="p-2">Runs this month</th>
            <th scope="col" className="p-2">Result (share of maximum)</th>
            <th scope="col" className="p-2">Median turnaround</th>
            <th scope="col" className="p-2">Open practice plans</th>
          </tr>
        </thead>
        <tbody>
          {pilots.map((p) => (
            <tr key={p.pilotId} className="border-t border-line">
              <th scope="row" className="p-2">
                <Link href={`/season?pilot=${p.pilotId}`} className="font-bold underline">{p.name}</Link>
              </th>
              <td className="p-2">{when(p.lastSessionAt)}</td>
              <td className="p-2">{p.runsThisMonth}</td>
              <td className="p-2">{trend(p.result.recent, p.result.before, "higher", shareText)}</td>
              <td className="p-2">{trend(p.turnaround.recent, p.turnaround.before, "lower", secs)}</td>
              <td className="p-2">
                {plans.filter((x) => x.pilotId === p.pilotId && !x.progress.done).map((x) => (
                  <a key={x.id} href={`#plan-${x.id}`} className="block underline">{x.title}</a>
                ))}
                {plans.some((x) => x.pilotId === p.pilotId && !x.progress.done) ? null : "none"}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </ScrollRegion>
  );
}
