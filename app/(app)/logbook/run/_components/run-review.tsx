"use client";

import { useSearchParams } from "next/navigation";
import { Breakdown, ClockNote, CorrectionsList, FlightsTable, RulingNotes, Rulings, SetAsidePenalties, TimelineStrip } from "@/components/run";
import { setAsidePenalties } from "@/lib/results";
import { DiscardButton } from "@/components/field/discard-button";
import { RunNotes } from "@/components/notes/run-notes";
import { ClubDayChoice } from "@/components/run/club-day-choice";
import { LaneDayDecisions, useRunDayDecisions } from "@/components/run/day-decisions";
import { describeRuleSettings, describeTask } from "@/lib/field/describe-task";
import { secondsText } from "@/lib/field/display";
import { formatDate } from "@/lib/format";
import { consentFor } from "@/lib/offline/consent";
import { ConsentBar, RecordedFor } from "../../_components/consent-bar";
import { scoreStoredRun, taskTitle } from "../../_components/run-results";
import { useLogbookRun } from "./use-logbook-run";
import { Versions } from "./versions";
import { LaunchHeights } from "./launch-heights";
import { LogUpload } from "./log-upload";
import { heightsForLane, useLaunchHeights } from "./use-launch-heights";

/** One run from the logbook: each pilot's result, strip, flights and lost points; the corrections; other phones' versions. */
export function RunReview() {
  const id = useSearchParams().get("id");
  const data = useLogbookRun(id);
  const altimeter = useLaunchHeights(id);
  const dayDecisions = useRunDayDecisions(id);
  if (!data) return <p aria-busy="true">Reading the run…</p>;
  const { run, session, events } = data;
  if (!run) {
    return (
      <div className="space-y-2">
        <h1 className="text-2xl font-extrabold">Run not found</h1>
        <p>This run is not on this phone. If it was timed on another phone, it appears after both have synced.</p>
        <a href="/logbook" className="font-bold underline">Back to the logbook</a>
      </div>
    );
  }
  const scored = scoreStoredRun(run, events, { deviceId: data.deviceId, me: data.profile?.id ?? null, estimate: data.estimate });
  if (!scored.task) return <p role="alert">{scored.error}</p>;
  const { task, folded } = scored;
  const names = data.profile ? { [data.profile.id]: data.profile.name } : {};
  const me = data.profile?.id ?? null;
  const consent = consentFor(run, me);
  const recorder = run.recordedBy?.name ?? "someone else";
  const pilotName = (lane: number) => run.lanes.find((l) => l.lane === lane)?.pilotName ?? `Lane ${lane + 1}`;
  const who = (userId: string) =>
    names[userId] ?? (run.recordedBy?.id === userId ? run.recordedBy.name : run.lanes.find((l) => l.pilotUserId === userId)?.pilotName ?? "Someone else");
  return (
    <div className="space-y-6">
      <header className="space-y-1">
        <a href="/logbook" className="text-sm font-bold underline">‹ Logbook</a>
        <h1 className="text-2xl font-extrabold">{taskTitle(task)}</h1>
        <p className="text-sm text-muted">{describeTask(task)}</p>
        <p className="text-sm text-muted" data-testid="rule-settings">{describeRuleSettings(task)}</p>
        {session ? <p className="text-sm">{formatDate(new Date(session.startedAtWallMs))} · {session.fieldName}</p> : null}
        {!scored.started ? (
          <div className="space-y-1">
            <p className="font-semibold text-warn">Set up, never started: this window has no result.</p>
            {!run.recordedBy || run.recordedBy.id === me ? <DiscardButton runId={run.id} what={taskTitle(task)} /> : null}
          </div>
        ) : folded.windowStartMs === null ? (
          <p className="font-semibold text-warn">The working time was never started, so no flight scores.</p>
        ) : null}
      </header>
      {consent ? <ConsentBar runId={run.id} consent={consent} recorder={recorder} label={`Recorded by ${recorder}`} /> : null}
      {run.recordedBy?.id === me && run.consents ? <RecordedFor consents={run.consents} pilotName={pilotName} /> : null}
      {run.lanes.map((l) => {
        const lane = folded.lanes[l.lane];
        if (!lane) return null;
        const laneResult = scored.lanes.find((d) => d.lane === l.lane)?.resultTenths ?? null;
        return (
          <section key={l.lane} aria-labelledby={`lane-${l.lane}`} className="space-y-3">
            <h2 id={`lane-${l.lane}`} className="flex items-baseline justify-between gap-3 border-b-2 border-line pb-1">
              <span className="text-xl font-bold">{l.pilotName}</span>
              <span className="figures text-3xl font-extrabold" data-testid={`lane-result-${l.lane}`}>{laneResult === null ? "—" : `${secondsText(laneResult)} s`}</span>
            </h2>
            <LaneDayDecisions decisions={dayDecisions.filter((d) => d.lane === l.lane)} />
            {lane.sumCapTenths !== null && lane.rawTenths > lane.sumCapTenths ? (
              <p className="text-sm text-muted">Flights add up to {secondsText(lane.rawTenths)} s; the working time allows {secondsText(lane.sumCapTenths)} s (F3K.7).</p>
            ) : null}
            <ClockNote derivation={scored.lanes.find((d) => d.lane === l.lane)} />
            <TimelineStrip definition={task} flights={lane.flights} label={l.pilotName} launchHeights={heightsForLane(altimeter.logs, l.lane)} />
            <FlightsTable flights={lane.flights} label={l.pilotName} />
            <Rulings lane={lane} label={l.pilotName} />
            <SetAsidePenalties list={setAsidePenalties(events).filter((s) => s.lane === l.lane)} label={l.pilotName} />
            <RulingNotes notes={scored.lanes.find((d) => d.lane === l.lane)?.derived.notes} lane={l.lane} label={l.pilotName} who={who} />
            <h3 className="text-lg font-bold">Where the points went</h3>
            <Breakdown definition={task} lane={lane} />
            <LaunchHeights logs={altimeter.logs} lane={l.lane} label={l.pilotName} />
            {l.pilotUserId === me || (!l.pilotUserId && (!run.recordedBy || run.recordedBy.id === me)) ? (
              <details>
                <summary className="cursor-pointer font-bold">Upload an altimeter log</summary>
                <LogUpload runId={run.id} lane={l.lane} onDone={altimeter.reload} />
              </details>
            ) : null}
          </section>
        );
      })}
      <RunNotes run={run} me={me} />
      <ClubDayChoice runId={run.id} />
      <section aria-labelledby="versions-h" className="space-y-2">
        <h2 id="versions-h" className="text-lg font-bold">Server result and each phone’s version</h2>
        <Versions run={run} deviceId={data.deviceId} />
      </section>
      <section aria-labelledby="corrections-h" className="space-y-2">
        <h2 id="corrections-h" className="text-lg font-bold">Corrections</h2>
        <CorrectionsList events={events} lanes={run.lanes} deviceId={data.deviceId} names={names} />
      </section>
    </div>
  );
}
