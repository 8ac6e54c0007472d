"use client";

import { secondsText } from "@/lib/field/display";
import { DiscardButton } from "./discard-button";
import { FirstUseCautions } from "./first-use-cautions";
import { PlanEditor } from "./plan-editor";
import { useFieldRuns, type FieldRunRow } from "./use-field-runs";
import { useIsClient } from "./use-is-client";

const when = new Intl.DateTimeFormat("en-GB", { weekday: "short", day: "numeric", month: "short", hour: "2-digit", minute: "2-digit" });

/** /field: windows still open on this phone, the start control, recent results, the cautions. */
export function FieldHome() {
  const client = useIsClient();
  const rows = useFieldRuns();
  const open = rows?.filter((r) => r.open) ?? [];
  // A window set up but never started is left out of results (it can be deleted while open).
  const done = rows?.filter((r) => !r.open && r.started).slice(0, 10) ?? [];
  return (
    <div className="space-y-6">
      <h1 className="text-2xl font-extrabold">Field</h1>
      {client ? <FirstUseCautions /> : null}
      {open.length > 0 ? (
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
      ) : null}
      <a href="/field/new" className="flex min-h-[5.5rem] items-center justify-center rounded-2xl bg-accent text-2xl font-extrabold text-accent-ink">
        Start a task window
      </a>
      {client ? <PlanEditor /> : null}
      <section aria-labelledby="recent-title" className="space-y-2">
        <h2 id="recent-title" className="text-lg font-bold">
          Recent results on this phone
        </h2>
        {rows === undefined ? (
          <p aria-busy="true">Reading this phone&apos;s windows…</p>
        ) : done.length === 0 ? (
          <p className="text-muted">No finished windows yet.</p>
        ) : (
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
        )}
      </section>
      <a href="/cautions" className="flex min-h-touch items-center justify-center rounded-xl border-2 border-ink font-bold">
        <span aria-hidden>⚠&nbsp;</span>Safety cautions
      </a>
    </div>
  );
}

function RunLine({ row }: { row: FieldRunRow }) {
  const t = row.task;
  return (
    <span className="min-w-0">
      <span className="block font-bold">{t ? `${t.letter ? `${t.letter} · ` : ""}${t.name}` : "Unknown task"}</span>
      <span className="block truncate text-sm text-muted">
        {row.run.lanes.map((l) => l.pilotName).join(", ")} · {row.session?.fieldName ?? "field not synced"}
      </span>
      <span className="figures block text-sm text-muted">{when.format(new Date(row.run.createdAtWallMs))}</span>
    </span>
  );
}
