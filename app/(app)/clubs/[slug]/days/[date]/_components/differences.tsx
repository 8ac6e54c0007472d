"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { InlineError } from "@/components/ui/form-footer";
import type { DayBoardView } from "@/lib/days/board";
import { secondsText } from "../../../../../season/_components/season-format";
import { sendJson } from "@/components/request/json";
import { momentText, offsetText, timeText, uncertaintyText } from "./day-format";
import { dayBoardKey } from "./day-board-query";

type Lane = DayBoardView["disagreements"][number];
type Part = { board: DayBoardView; name: (id: string) => string };

/** A phone as the board names it: its recorder and the end of its id (one person may time on two phones). */
const phoneText = (name: string, deviceId: string) => `${name}’s phone …${deviceId.slice(-6)}`;

/** A corrected instant to the tenth of a second on the club's clock: "14:03:10.4". */
const tenthText = (ms: number, timeZone: string) => `${timeText(ms, timeZone)}.${Math.floor((((ms % 1000) + 1000) % 1000) / 100)}`;

/**
 * Lanes two phones recorded differently, each phone's version side by side: its result (runResult
 * of that record, as stored), its flights on the corrected clock, the phone and its clock offset.
 * An officer records a decision (whose record stands, or a note), kept with who and when; the record
 * that stands is the board's result for the lane (db/queries/club-day-decided.ts).
 */
export function Differences({ board, name, slug, canDecide }: Part & { slug: string; canDecide: boolean }) {
  return (
    <section aria-labelledby="differences" className="space-y-3">
      <h2 id="differences" className="text-lg font-bold">
        Recorded differently
      </h2>
      {board.disagreements.length === 0 ? (
        <p className="text-muted">No run was recorded differently by two phones.</p>
      ) : (
        <ul className="space-y-3" aria-label="Runs recorded differently">
          {board.disagreements.map((d) => {
            const run = board.runs.find((r) => r.runId === d.runId);
            const label = `${name(d.pilotId)}, ${run ? timeText(run.startMs, board.timeZone) : "a run"}`;
            return (
              <li key={`${d.runId}-${d.lane}`} aria-label={label} data-run-id={d.runId} className="card space-y-2 rounded-xl border border-line bg-raised p-3">
                <p className="font-bold">{label}</p>
                <div className="grid grid-cols-2 gap-2">
                  {d.versions.map((v) => (
                    <Version key={v.deviceId} board={board} name={name} version={v} stands={d.decision?.deviceId === v.deviceId} />
                  ))}
                </div>
                <p className="text-sm text-muted">
                  The result uses the pilot&apos;s own record first (then the earlier one) unless an officer decides which record stands. A
                  decision counts on this day&apos;s board and summary only: the run&apos;s page, the logbook and the Season keep the first
                  rule&apos;s result, and the pilot can still dispute it there.
                </p>
                <DecisionText board={board} name={name} lane={d} />
                {canDecide ? <DecisionForm board={board} name={name} lane={d} slug={slug} label={label} /> : null}
              </li>
            );
          })}
        </ul>
      )}
    </section>
  );
}

function Version({ board, name, version: v, stands }: Part & { version: Lane["versions"][number]; stands: boolean }) {
  const clock = board.clocks.find((c) => c.deviceId === v.deviceId);
  return (
    <div className="space-y-1 rounded-lg border border-line p-2 text-sm" data-device-id={v.deviceId}>
      <p className="font-semibold">{phoneText(name(v.recordedBy), v.deviceId)}</p>
      <p>
        Result {secondsText(v.resultTenths)}, {v.flights} {v.flights === 1 ? "flight" : "flights"}
        {v.chosen ? " · used" : ""}
        {stands ? " · stands by decision" : ""}
      </p>
      <ol className="list-decimal pl-5" aria-label={`Flights on ${phoneText(name(v.recordedBy), v.deviceId)}`}>
        {v.flightTimes.map((f, i) => (
          <li key={i}>
            {tenthText(f.launchAtMs, board.timeZone)} → {f.landAtMs === null ? "not landed" : tenthText(f.landAtMs, board.timeZone)}
          </li>
        ))}
      </ol>
      <p className="text-muted">
        Clock {clock?.offsetMs == null ? "not measured" : `${offsetText(clock.offsetMs)}${clock.uncertaintyMs == null ? "" : ` ${uncertaintyText(clock.uncertaintyMs)}`}`}
      </p>
    </div>
  );
}

function DecisionText({ board, name, lane }: Part & { lane: Lane }) {
  const d = lane.decision;
  if (!d) return null;
  const stands = lane.versions.find((v) => v.deviceId === d.deviceId);
  return (
    <p role="status" data-testid="decision">
      Decided {d.decidedBy ? `by ${name(d.decidedBy)} ` : ""}on {momentText(d.decidedAt, board.timeZone)}: {stands ? `the record on ${phoneText(name(stands.recordedBy), stands.deviceId)} stands` : "no record chosen"}
      {d.note ? `. Note: ${d.note}` : ""}
    </p>
  );
}

function DecisionForm({ board, name, lane, slug, label }: Part & { lane: Lane; slug: string; label: string }) {
  const client = useQueryClient();
  const [deviceId, setDeviceId] = useState<string>(lane.decision?.deviceId ?? "");
  const [note, setNote] = useState(lane.decision?.note ?? "");
  const save = useMutation({
    mutationFn: async () => {
      const reply = await sendJson("PUT", `/api/clubs/${slug}/days/${board.day}/decisions`, { runId: lane.runId, lane: lane.lane, deviceId: deviceId || null, note });
      if (!reply.ok) throw new Error(reply.message);
    },
    onSuccess: () => client.invalidateQueries({ queryKey: dayBoardKey(slug, board.day) }),
  });
  const group = `decide-${lane.runId}-${lane.lane}`;
  return (
    <form
      aria-label={`Decision, ${label}`}
      className="space-y-2"
      onSubmit={(e) => {
        e.preventDefault();
        save.mutate();
      }}
    >
      <fieldset className="space-y-1">
        <legend className="font-semibold">Which record stands?</legend>
        {lane.versions.map((v) => (
          <label key={v.deviceId} className="flex min-h-12 items-center gap-3">
            <input type="radio" name={group} className="h-6 w-6" checked={deviceId === v.deviceId} onChange={() => setDeviceId(v.deviceId)} />
            <span>
              The record on {phoneText(name(v.recordedBy), v.deviceId)} ({secondsText(v.resultTenths)})
            </span>
          </label>
        ))}
        <label className="flex min-h-12 items-center gap-3">
          <input type="radio" name={group} className="h-6 w-6" checked={deviceId === ""} onChange={() => setDeviceId("")} />
          <span>Neither: a note only</span>
        </label>
      </fieldset>
      <label className="block space-y-1">
        <span className="font-semibold">Note</span>
        <textarea value={note} maxLength={500} onChange={(e) => setNote(e.target.value)} rows={2} className="w-full rounded-lg border-2 border-line bg-raised p-2" />
      </label>
      <button type="submit" disabled={save.isPending} className="min-h-12 rounded-lg border-2 border-ink px-3 font-bold disabled:opacity-50">
        {save.isPending ? "Saving…" : "Record the decision"}
      </button>
      <InlineError message={save.error?.message} />
    </form>
  );
}
