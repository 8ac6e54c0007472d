"use client";

import { useLiveQuery } from "dexie-react-hooks";
import { useState } from "react";
import { useSearchParams } from "next/navigation";
import type { ClockEstimate } from "@/lib/clock";
import type { RunEvent } from "@/lib/events/schema";
import { secondsText } from "@/lib/field/display";
import { choices, filtersQuery, localDay, matchesFilters, readFilters, type LogbookFilters } from "@/lib/field/logbook-filter";
import { formatDate } from "@/lib/format";
import { consentFor, listedInLogbook } from "@/lib/offline/consent";
import { getWindowcallDb, type StoredRun } from "@/lib/offline/db";
import { readPhoneView } from "@/lib/offline/run-result";
import type { SessionEntity } from "@/lib/events/entities";
import { ConsentBar, RecordedFor } from "./consent-bar";
import { DiscardButton } from "@/components/field/discard-button";
import { wasStarted } from "@/lib/results";
import { LogbookFilterBar } from "./logbook-filters";
import { scoreStoredRun, taskTitle, type ScoredRun } from "./run-results";

/**
 * Every session on this phone, newest first, with its runs and results (read from IndexedDB
 * only). A run someone else recorded for the pilot says so, with accept / dispute / hide; hidden
 * ones are left out, and so is a session whose every run is hidden, unless "Show hidden runs" is on.
 * Filters (pilot, task, field, dates, one session) live in the address: replaceState keeps them
 * shareable and works offline.
 */
export function LogbookList() {
  const [showHidden, setShowHidden] = useState(false);
  const filters = readFilters(useSearchParams());
  const setFilters = (next: LogbookFilters) => {
    const q = filtersQuery(next);
    window.history.replaceState(null, "", q ? `/logbook?${q}` : "/logbook");
  };
  const data = useLiveQuery(async () => {
    const db = getWindowcallDb();
    const view = await readPhoneView(db);
    const me = view.me;
    const stored = await db.sessions.orderBy("startedAtWallMs").reverse().toArray();
    const all = await db.runs.where("sessionId").anyOf(stored.map((s) => s.id)).toArray();
    const hidden = all.filter((r) => !listedInLogbook(r, me)).length;
    const listed = showHidden ? all : all.filter((r) => listedInLogbook(r, me));
    const events = await db.events.where("runId").anyOf(listed.map((r) => r.id)).toArray();
    // A window someone else set up for this pilot and never started is not theirs to see.
    const runs = listed.filter((r) => !r.recordedBy || r.recordedBy.id === me || wasStarted(events.filter((e) => e.runId === r.id)));
    const sessions = stored.filter((s) => runs.some((r) => r.sessionId === s.id) || !all.some((r) => r.sessionId === s.id));
    return { sessions, runs, hidden, events, me, deviceId: view.deviceId, estimate: view.estimate };
  }, [showHidden]);

  if (!data) return <p aria-busy="true">Reading this phone’s logbook…</p>;
  const toggle = data.hidden > 0 || showHidden ? <HiddenToggle count={data.hidden} on={showHidden} set={setShowHidden} /> : null;
  if (data.sessions.length === 0) {
    return (
      <div className="space-y-4">
        {toggle}
        <EmptyLogbook />
      </div>
    );
  }
  const sessionById = new Map(data.sessions.map((s) => [s.id, s]));
  const view = (r: StoredRun) => {
    const session = sessionById.get(r.sessionId);
    const task = taskOf(r);
    return { sessionId: r.sessionId, field: session?.fieldName ?? "", day: localDay(session?.startedAtWallMs ?? r.createdAtWallMs), pilots: r.lanes.map((l) => l.pilotName), taskKey: task.key };
  };
  const shown = data.runs.filter((r) => matchesFilters(view(r), filters));
  const filtering = Object.values(filters).some(Boolean);
  // filtered, a session shows only with a run that passes
  const sessions = filtering ? data.sessions.filter((s) => shown.some((r) => r.sessionId === s.id)) : data.sessions;
  const runsOf = (s: SessionEntity) => shown.filter((r) => r.sessionId === s.id).sort((a, b) => a.createdAtWallMs - b.createdAtWallMs);
  const tasks = new Map(data.runs.map((r) => taskOf(r)).map((t) => [t.key, t.title]));
  const one = filters.session ? sessionById.get(filters.session) : undefined;
  return (
    <div className="space-y-4">
      {toggle}
      <LogbookFilterBar
        filters={filters}
        onChange={setFilters}
        pilots={choices(data.runs.flatMap((r) => r.lanes.map((l) => l.pilotName)))}
        tasks={[...tasks].map(([key, title]) => ({ key, title })).sort((a, b) => a.title.localeCompare(b.title))}
        fields={choices(data.sessions.map((s) => s.fieldName))}
        sessionLabel={one ? `${formatDate(new Date(one.startedAtWallMs))}, ${one.fieldName}` : filters.session ? "not on this phone yet" : null}
      />
      {sessions.length === 0 ? <p className="font-semibold">No runs match these filters.</p> : null}
    <ol className="space-y-4" aria-label="Sessions">
      {sessions.map((s) => (
        <li key={s.id} className="card space-y-2 rounded-xl border border-line bg-raised p-4">
          <h2 className="text-lg font-bold">{formatDate(new Date(s.startedAtWallMs))}</h2>
          <p>
            {s.fieldName}
            <span className="block text-sm text-muted">{conditionsText(s.conditions)}</span>
          </p>
          <RunRows runs={runsOf(s)} data={data} fieldName={s.fieldName} />
        </li>
      ))}
    </ol>
    </div>
  );
}

function EmptyLogbook() {
  return (
    <div className="card space-y-2 rounded-xl border border-line bg-raised p-4">
      <p className="font-semibold">Nothing in the logbook on this phone yet.</p>
      <p className="text-muted">Time a window at the field — it works with no signal. Sessions timed on your other phones arrive here after they sync.</p>
      <a href="/field" className="inline-flex min-h-touch items-center font-bold underline">
        Go to the field
      </a>
    </div>
  );
}

/** "Show hidden runs": lists the runs recorded for the pilot that they hid, so they can un-hide one. */
function HiddenToggle({ count, on, set }: { count: number; on: boolean; set: (on: boolean) => void }) {
  return (
    <label className="flex min-h-touch items-center gap-3 font-semibold">
      <input type="checkbox" className="size-6" checked={on} onChange={(e) => set(e.target.checked)} />
      Show hidden runs ({count})
    </label>
  );
}

/** A run's task for the filters: its letter, or a custom task's name. */
function taskOf(r: StoredRun): { key: string; title: string } {
  const t = r.task as { letter?: unknown; name?: unknown };
  const name = typeof t.name === "string" ? t.name : "Unreadable task";
  return typeof t.letter === "string" && t.letter ? { key: t.letter, title: `${t.letter} · ${name}` } : { key: `custom:${name}`, title: name };
}

type Data = { events: RunEvent[]; me: string | null; deviceId: string | null; estimate: ClockEstimate | null };

function RunRows({ runs, data, fieldName }: { runs: StoredRun[]; data: Data; fieldName: string }) {
  if (runs.length === 0) return <p className="text-sm text-muted">No runs in this session.</p>;
  return (
    <ul className="divide-y-2 divide-line border-t-2 border-line" aria-label="Runs">
      {runs.map((r) => {
        const scored = scoreStoredRun(r, data.events.filter((e) => e.runId === r.id), { deviceId: data.deviceId, me: data.me, estimate: data.estimate });
        const started = scored.task ? scored.started : true;
        const title = scored.task ? taskTitle(scored.task) : "Unreadable task";
        const consent = consentFor(r, data.me);
        const recorder = r.recordedBy?.name ?? "someone else";
        const pilotName = (lane: number) => r.lanes.find((l) => l.lane === lane)?.pilotName ?? `Lane ${lane + 1}`;
        return (
          <li key={r.id} className="space-y-2 pb-2">
            <a href={`/logbook/run?id=${r.id}`} className="flex min-h-touch items-center justify-between gap-3 py-2">
              <span className="min-w-0">
                <span className="block font-semibold">{title}</span>
                <span className="block text-sm text-muted">{fieldName}</span>
              </span>
              <span className="figures text-right text-sm">
                {r.lanes.map((l) => (
                  <span key={l.lane} className="block whitespace-nowrap">
                    {`${l.pilotName} `}
                    <b>{laneText(scored, l.lane)}</b>
                  </span>
                ))}
              </span>
              <span aria-hidden="true">›</span>
            </a>
            {started ? null : (
              <div className="space-y-1">
                <p className="text-sm text-muted">Set up, never started: no result.</p>
                <DiscardButton runId={r.id} what={title} />
              </div>
            )}
            {consent ? <ConsentBar runId={r.id} consent={consent} recorder={recorder} label={`${title}, recorded by ${recorder}`} /> : null}
            {r.recordedBy?.id === data.me && r.consents ? <RecordedFor consents={r.consents} pilotName={pilotName} /> : null}
          </li>
        );
      })}
    </ul>
  );
}

/** A lane's result as the one result function gives it: null (nobody timed it, never started) is "—", never 0.0. */
function laneText(scored: ScoredRun, lane: number): string {
  if (!scored.task) return "—";
  const t = scored.lanes.find((d) => d.lane === lane)?.resultTenths ?? null;
  return t === null ? "—" : `${secondsText(t)} s`;
}

function conditionsText(c: SessionEntity["conditions"]): string {
  const parts = [
    c.windMs !== undefined ? `wind ${c.windMs} m/s${c.gustMs !== undefined ? `, gusts ${c.gustMs}` : ""}` : null,
    c.temperatureC !== undefined ? `${c.temperatureC} °C` : null,
    c.notes ? c.notes : null,
  ].filter(Boolean);
  return parts.length ? parts.join(" · ") : "No conditions noted";
}
