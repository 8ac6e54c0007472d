"use client";

import { useLiveQuery } from "dexie-react-hooks";
import { useState } from "react";
import { dutyContest, dutyLanes, dutyRound, dutyText } from "@/lib/contests/timekeepers";
import { getMeta, getWindowcallDb } from "@/lib/offline/db";
import { taskDefinitionSchema } from "@/lib/tasks";
import type { PulledDuty } from "@/lib/validations/contest-sync";
import { openNewRun } from "./open-new-run";
import { useFieldProfile } from "./use-field-profile";
import { useNotifyWrite } from "./use-notify-write";

/**
 * Contest groups this phone's user keeps time for, as the last pull brought them (so they show
 * offline): "Contest: round N, group G — pilots A, B, C" and one tap that sets up the round's task
 * with one named lane per pilot, tied to the pilots' contest slots: when the run syncs, its results
 * are the pilots' official results for the round. A re-flight's duty ("re-flight, round N, group G —
 * pilot X") sets up one lane tied to the grant (`RunEntity.contest.reflightId`): its result is the re-flight's.
 */
export function ContestDuties() {
  const duties = useLiveQuery(async () => (await getMeta(getWindowcallDb(), "contestDuties")) ?? [], []);
  if (!duties || duties.length === 0) return null;
  return (
    <section aria-labelledby="duties-h" className="space-y-3">
      <h2 id="duties-h" className="text-lg font-bold">Timekeeping at a contest</h2>
      {duties.map((d) => <DutyCard key={d.reflightId ?? `${d.roundId}:${d.groupNumber}`} duty={d} />)}
      <p className="text-sm text-muted">As of the last sync. Stand where the contest director puts timekeepers, and follow the field&apos;s safety rules.</p>
    </section>
  );
}

function DutyCard({ duty }: { duty: PulledDuty }) {
  const { profile } = useFieldProfile();
  const notify = useNotifyWrite();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const title = `Contest: ${dutyText(duty)}`;

  const start = async () => {
    const task = taskDefinitionSchema.safeParse(duty.task);
    if (!task.success || !profile) return setError(!profile ? "Sign in once online on this phone first." : "This round's task cannot be timed on this phone.");
    setBusy(true);
    const now = Date.now();
    const { lanes } = dutyLanes(duty);
    const problem = await openNewRun(
      { ownerId: profile.id, fieldName: duty.fieldName.slice(0, 120) || duty.contestName.slice(0, 120), conditions: {}, startedAtWallMs: now, ...(duty.clubId ? { clubId: duty.clubId } : {}) },
      { task: task.data as unknown as Record<string, unknown>, lanes, createdAtWallMs: now, contest: dutyContest(duty) },
      { notify },
    );
    // on success the page is already leaving: busy stays, so a second tap cannot set up a second run
    if (problem) { setBusy(false); setError(problem); }
  };

  return (
    <article aria-label={title} className="space-y-2 rounded-xl border-2 border-line p-3">
      <h3 className="font-bold">{title}</h3>
      <p className="text-sm text-muted">{duty.contestName} · {duty.startsOn} · task {String(duty.task.letter ?? "")}: {String(duty.task.name ?? "")}</p>
      <button type="button" onClick={() => void start()} disabled={busy}
        className="flex min-h-touch w-full items-center justify-between gap-2 rounded-lg bg-accent px-3 text-left font-bold text-accent-ink">
        <span>Set up {duty.reflightId ? "the re-flight, " : ""}{dutyRound(duty)}, group {duty.groupNumber}: {duty.pilots.length === 1 ? "one lane" : `${Math.min(duty.pilots.length, 4)} lanes`}</span>
        <span aria-hidden>▶</span>
      </button>
      {error ? <p role="alert" className="text-sm font-semibold text-warn">{error}</p> : null}
    </article>
  );
}
