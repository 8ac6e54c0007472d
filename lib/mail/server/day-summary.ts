import "server-only";
import type { DayBoardView } from "@/lib/days/board";
import { boardSummaryLines, dayLabel, decisionChangeLine } from "@/lib/days/summary";
import { formatClock } from "@/lib/format";
import { appLink } from "../links";
import { daySummaryMail, daySummaryUpdateMail } from "../messages";
import { sendMail } from "./send";

type Club = { name: string; slug: string };
type To = { email: string };

const links = (club: Club, day: string) => ({
  boardLink: appLink(`/clubs/${club.slug}/days/${day}`),
  unsubscribe: `${appLink(`/clubs/${club.slug}`)}#day-summaries`, // the setting, on the club page
});

/** The day's summary (at the close), one queued message per recipient. */
export async function sendDaySummary(club: Club, day: string, board: DayBoardView | null, to: readonly To[]): Promise<void> {
  const mail = daySummaryMail({ clubName: club.name, dayText: dayLabel(day), lines: board ? boardSummaryLines(board) : [], ...links(club, day) });
  for (const t of to) await sendMail(t.email, mail);
}

/**
 * The updated summary after a decision made once the summary had gone: what changed on the lane
 * (`before` and `after` are the board before and after the decision), then the summary as it is now.
 * Nothing when the board did not change (the lane's result and every summary line as before).
 */
export async function sendLateDecisionSummary(
  club: Club,
  day: string,
  change: { runId: string; lane: number; deviceId: string | null; before: DayBoardView; after: DayBoardView },
  to: readonly To[],
): Promise<void> {
  const laneOf = (b: DayBoardView) => b.runs.find((r) => r.runId === change.runId)?.lanes.find((l) => l.lane === change.lane);
  const run = change.after.runs.find((r) => r.runId === change.runId);
  const lane = laneOf(change.after);
  if (!run || !lane) return; // not on the board any more: nothing to say
  const name = (id: string | undefined) => (id ? (change.after.people[id] ?? "a member") : "a member");
  const recordedBy = change.after.disagreements
    .find((d) => d.runId === change.runId && d.lane === change.lane)
    ?.versions.find((v) => v.deviceId === change.deviceId)?.recordedBy;
  const beforeTenths = laneOf(change.before)?.resultTenths ?? null;
  const line = decisionChangeLine({
    pilot: name(lane.pilotId), taskCode: run.taskCode, startText: formatClock(new Date(run.startMs), change.after.timeZone, "time"),
    recorder: change.deviceId === null ? null : name(recordedBy), beforeTenths, afterTenths: lane.resultTenths,
  });
  const lines = boardSummaryLines(change.after);
  // the record chosen gives what the board had already (the rules' own pick): nothing to tell
  if (beforeTenths === lane.resultTenths && JSON.stringify(lines) === JSON.stringify(boardSummaryLines(change.before))) return;
  const mail = daySummaryUpdateMail({ clubName: club.name, dayText: dayLabel(day), change: line, lines, ...links(club, day) });
  for (const t of to) await sendMail(t.email, mail);
}
