"use client";

import { useSearchParams } from "next/navigation";
import { browserTimeSource, type TimeSource } from "@/lib/field/time-source";
import { LiveRun } from "./live-run";
import { useRunData } from "./use-run-data";

/** /field/run?id=…: reads the run from this device and shows it live. */
export function RunScreen({ clocks = browserTimeSource }: { clocks?: TimeSource }) {
  const runId = useSearchParams().get("id");
  const data = useRunData(runId);
  if (data.state === "loading") return <p aria-busy="true">Opening the window…</p>;
  if (data.state === "missing") {
    return (
      <div className="space-y-3">
        <h1 className="text-2xl font-extrabold">No such window on this phone</h1>
        <p>It may have been started on another phone and not synced here yet.</p>
        <a href="/field" className="flex min-h-touch items-center justify-center rounded-xl bg-accent font-bold text-accent-ink">
          Back to the field
        </a>
      </div>
    );
  }
  if (data.state === "broken") return <p role="alert">{data.message}</p>;
  return <LiveRun data={data} clocks={clocks} />;
}
