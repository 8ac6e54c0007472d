"use client";

import { weekdayDateTimeText } from "@/lib/field/clock-text";
import { secondsText } from "@/lib/field/display";
import { DiscardButton } from "./discard-button";
import { useFieldRuns, type FieldRunRow } from "./use-field-runs";

/** /field: windows still open on this phone (nothing while there are none). Loaded after first paint (field-islands.tsx). */
export function OpenWindows() {
  const open = useFieldRuns()?.open ?? [];
  if (open.length === 0) return null;
  return (
    <section aria-labelledby="open-title" className="space-y-2">
      <h2 id="open-title" className="text-lg font-bold">
        Open windows
      </h2>
      <ul className="space-y-2">
        {open.map((r) => (
          <li key={r.run.id} className="space-y-1">
            <a href={`/field/run?id=${r.run.id}`} className="card flex min-h-touch items-center justify-between gap-3 rounded-xl border border-line bg-raised p-3">
              <RunLine row={r} />
              <span className="font-bold">{r.started ? "Resume →" : "Open →"}</span>
            </a>
            {r.started ? null : <DiscardButton runId={r.run.id} what={r.task?.name ?? "window"} />}
          </li>
        ))}
      </ul>
    </section>
  );
}

/** /field: the latest finished windows on this phone with their results. Loaded after first paint (field-islands.tsx). */
export function RecentResults() {
  const runs = useFieldRuns();
  // A window set up but never started is left out of results (it can be deleted while open).
  const done = runs?.recent ?? [];
  if (runs === undefined) return <ReadingWindows />;
  if (done.length === 0) return <p className="text-muted">No finished windows yet.</p>;
  return (
    <ul className="space-y-2">
      {done.map((r) => (
        <li key={r.run.id}>
          <a href={`/logbook/run?id=${r.run.id}`} className="card flex min-h-touch items-center justify-between gap-3 rounded-xl border border-line bg-raised p-3">
            <RunLine row={r} />
            <span className="figures whitespace-nowrap text-right font-bold">{r.resultsTenths.map((t) => (t === null ? "—" : `${secondsText(t)} s`)).join(" · ")}</span>
          </a>
        </li>
      ))}
    </ul>
  );
}

/** What the recent list shows until this phone's windows are read. */
function ReadingWindows() {
  return <p aria-busy="true">Reading this phone&apos;s windows…</p>;
}

function RunLine({ row }: { row: FieldRunRow }) {
  const t = row.task;
  return (
    <span className="min-w-0">
      <span className="block font-bold">{t ? `${t.letter ? `${t.letter} · ` : ""}${t.name}` : "Unknown task"}</span>
      <span className="block truncate text-sm text-muted">
        {row.run.lanes.map((l) => l.pilotName).join(", ")} · {row.session?.fieldName ?? "field not synced"}
      </span>
      <span className="figures block text-sm text-muted">{weekdayDateTimeText(row.run.createdAtWallMs)}</span>
    </span>
  );
}
