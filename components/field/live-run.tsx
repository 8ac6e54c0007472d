"use client";

import { useEffect, useMemo, useState } from "react";
import { CalloutCaption, useCallouts, useWakeLock, WakeLockNote } from "@/components/callouts";
import type { RunEvent } from "@/lib/events/schema";
import { isRunOpen } from "@/lib/field/lane-tap";
import { parsePrepPlan, prepPlanKey, prepStageAt, type PrepPlan } from "@/lib/field/prep-plan";
import type { TimeSource } from "@/lib/field/time-source";
import { getPageId } from "@/lib/offline/device";
import { phoneResult, placeOnRun, type PhoneView } from "@/lib/offline/run-result";
import { liveState } from "@/lib/tasks";
import { CorrectionsList } from "@/components/run";
import { ClockPanel } from "./clock-panel";
import { ContestSignatures } from "./contest-signatures";
import { LaneArea } from "./lane-area";
import { ModelPicker } from "./model-picker";
import type { RunLane } from "@/lib/events/entities";
import { PrepPanel } from "./prep-panel";
import { SignalElsewhereButton, SignalElsewhereNote, useSignalElsewhere } from "./signal-elsewhere";
import { RunHeader } from "./run-header";
import { RunSummary } from "./run-summary";
import { describeWrite } from "./announce";
import { useFieldProfile } from "./use-field-profile";
import { useNotifyWrite } from "./use-notify-write";
import { useNow } from "./use-now";
import { useRecorder } from "./use-recorder";
import { useRunActions } from "./use-run-actions";
import type { RunData } from "./use-run-data";

/** The live window: a pure function of the stored events and "now", redrawn every frame. */
export function LiveRun({ data, clocks }: { data: Extract<RunData, { state: "ready" }>; clocks: TimeSource }) {
  const { run, task, deviceId, estimate } = data;
  const laneCount = run.lanes.length;
  const notify = useNotifyWrite();
  const { profile } = useFieldProfile();
  const [said, setSaid] = useState({ text: "", n: 0 });
  const me = profile?.id ?? null;
  const view: PhoneView = useMemo(() => ({ deviceId, me, estimate }), [deviceId, me, estimate]);
  const nowOnRun = (all: readonly RunEvent[], wallMs: number, monoMs: number) => placeOnRun(all, view, { wallMs, monoMs, pageId: getPageId(), offset: estimate });
  const onWritten = (event: RunEvent, all: readonly RunEvent[]) => {
    notify();
    const result = phoneResult(run, task, all, view);
    const text = describeWrite(event, task, result.timeline, nowOnRun(all, clocks.wallNow(), clocks.monoNow()), run.lanes);
    if (text) setSaid((s) => ({ text, n: s.n + 1 }));
  };
  const recorder = useRecorder({ runId: run.id, stored: data.events, clocks, estimate, onWritten });
  const actions = useRunActions({ task, laneCount, view, clocks, record: recorder.record, stampInput: recorder.stampInput });
  const open = isRunOpen(recorder.events);
  const modelPicker = (l: RunLane, label: string) =>
    me && l.pilotUserId === me ? <ModelPicker lane={l.lane} laneLabel={label} userId={me} events={recorder.events} open={open} onPick={(id) => actions.model(l.lane, id)} /> : null;
  const now = useNow(clocks, open);
  // The one result function (lib/results), as the logbook and the server use it; "now" on its timeline.
  // It depends on the events only, not on "now": computed once per write, not every frame.
  const result = useMemo(() => phoneResult(run, task, recorder.events, view), [run, task, recorder.events, view]);
  const nowMs = nowOnRun(recorder.events, now.wall, now.mono);
  const live = liveState(task, result.timeline, nowMs, { laneCount });
  // The countdown plan is in device wall time; callouts compare on the run's timeline.
  const wallToRun = nowMs - now.wall;

  // Rendered only in the browser (the run is read from IndexedDB), so localStorage is there.
  const [plan] = useState<PrepPlan | null>(() => parsePrepPlan(localStorage.getItem(prepPlanKey(run.id))));
  const stage = plan && live.phase === "not-started" ? prepStageAt(plan, now.wall) : null;
  // Callouts each frame (said once each) and the screen kept awake while the window is open.
  const laneNames: string[] = [];
  for (const l of run.lanes) laneNames[l.lane] = l.pilotName;
  const calloutPlan = plan ? { startAtMs: plan.beganAtWallMs + (plan.prepSec + plan.noFlySec) * 1000 + wallToRun, preparationSec: plan.prepSec, noFlySec: plan.noFlySec } : null;
  const callouts = useCallouts(task, open ? live : null, nowMs, { runKey: run.id, laneNames, plan: calloutPlan });
  const wake = useWakeLock(open);
  const { startAt, tap, start } = actions;
  useEffect(() => {
    if (open && stage?.stage === "due") void startAt(stage.startsAtWallMs);
  }, [open, stage?.stage, stage?.startsAtWallMs, startAt]);

  // Persistent storage is requested once per page by the sync provider.

  // A Bluetooth clicker sends Space / Enter: they drive the solo lane (or give the start).
  const [signalElsewhere, setSignalElsewhere] = useSignalElsewhere(run.id);
  const notStarted = live.phase === "not-started" && !signalElsewhere;
  useEffect(() => {
    if (laneCount !== 1 || !open) return;
    const onKey = (e: KeyboardEvent) => {
      if ((e.key !== " " && e.key !== "Enter") || e.repeat) return;
      const el = e.target as HTMLElement | null;
      if (el && el !== document.body && el.closest("input, textarea, select, button, a, summary")) return;
      e.preventDefault();
      if (notStarted) void start(e.timeStamp);
      else void tap(0, e.timeStamp);
    };
    // After a finger presses a secondary button, drop its focus so the next clicker press
    // taps the lane instead of pressing that button again.
    const onPointerUp = () => {
      if (document.activeElement instanceof HTMLButtonElement) document.activeElement.blur();
    };
    window.addEventListener("keydown", onKey);
    document.addEventListener("pointerup", onPointerUp);
    return () => {
      window.removeEventListener("keydown", onKey);
      document.removeEventListener("pointerup", onPointerUp);
    };
  }, [laneCount, open, notStarted, start, tap]);

  return (
    <div className="space-y-5">
      <RunHeader task={task} run={run} session={data.session} />
      {recorder.error ? (
        <div role="alert" className="rounded-xl border-4 border-danger p-3 font-bold text-danger">
          <span aria-hidden>⛔ </span>
          {recorder.error.message}
        </div>
      ) : null}
      {open && laneCount === 1 ? <WakeLockNote state={wake} /> : null}
      {open && laneCount === 1 ? <CalloutCaption callout={callouts.last} /> : null}
      <p aria-live="assertive" className="sr-only" data-testid="announcer">
        {said.text}
        {said.n % 2 ? "\u200b" : ""}
      </p>
      {!open ? (
        <>
          {run.contest ? (
            <ContestSignatures lanes={run.lanes} events={recorder.events} result={result} keeperName={profile?.name ?? "Timekeeper"}
              onSign={(lane) => actions.ruling({ kind: "signed", lane })} />
          ) : null}
          <RunSummary runId={run.id} task={task} result={result} lanes={run.lanes} />
        </>
      ) : notStarted ? (
        <>
          <PrepPanel stage={stage} onStart={(t) => void start(t)} />
          <SignalElsewhereButton onChoose={() => setSignalElsewhere(true)} />
        </>
      ) : live.phase === "not-started" ? (
        <>
          <SignalElsewhereNote onUndo={() => setSignalElsewhere(false)} />
          <LaneArea task={task} live={live} lanes={run.lanes} actions={actions} modelPicker={modelPicker} derivations={result.lanes} />
        </>
      ) : (
        <>
          <ClockPanel live={live} workingTimeSec={task.kind === "all-up" ? task.landingDeadlineSec : task.workingTimeSec} compact={laneCount > 1} />
          <LaneArea task={task} live={live} lanes={run.lanes} actions={actions} modelPicker={modelPicker} derivations={result.lanes} />
        </>
      )}
      {/* several lanes: the notes go below, so every lane's control stays in reach */}
      {open && laneCount > 1 ? <CalloutCaption callout={callouts.last} /> : null}
      {open && laneCount > 1 ? <WakeLockNote state={wake} /> : null}
      <details className="rounded-xl border-2 border-line p-3">
        <summary className="min-h-12 cursor-pointer py-3 font-bold">Corrections and undo log</summary>
        <CorrectionsList events={recorder.events} lanes={run.lanes} deviceId={deviceId} names={profile ? { [profile.id]: profile.name } : undefined} />
      </details>
    </div>
  );
}
