"use client";

import { useEffect, useState } from "react";
import { sendJson } from "@/components/request/json";
import { InlineError } from "@/components/ui/form-footer";

type Choice = { dayId: string; clubSlug: string; clubName: string; fieldName: string; day: string; chosen: boolean; closed: boolean };

/**
 * The pilot puts this run in one of their clubs' field days (within a week of it), whatever field
 * its session names: it then shows on that Day board. Needs a connection; offline (or with no day
 * to offer) it shows nothing.
 */
export function ClubDayChoice({ runId }: { runId: string }) {
  const [days, setDays] = useState<Choice[] | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState<string | null>(null);

  const [version, setVersion] = useState(0);
  useEffect(() => {
    let live = true;
    fetch(`/api/runs/${runId}/club-days`, { cache: "no-store" })
      .then((res) => (res.ok ? (res.json() as Promise<{ days: Choice[] }>) : null))
      .then((body) => {
        if (live && body) setDays(body.days);
      })
      .catch(() => undefined); // offline: nothing to offer
    return () => {
      live = false;
    };
  }, [runId, version]);

  async function toggle(c: Choice) {
    setBusy(c.dayId);
    setError(null);
    const reply = await sendJson("PUT", `/api/runs/${runId}/club-days`, { dayId: c.dayId, chosen: !c.chosen });
    setBusy(null);
    if (!reply.ok) return setError(reply.message);
    setVersion((v) => v + 1);
  }

  if (!days || days.length === 0) return null;
  return (
    <section aria-labelledby="club-day-h" className="space-y-2">
      <h2 id="club-day-h" className="text-lg font-bold">Club field days</h2>
      <p className="text-sm text-muted">Runs recorded at a day&apos;s field on its day join it by themselves; put this run in a day here if it was flown there under another name.</p>
      <ul className="space-y-1">
        {days.map((c) => (
          <li key={c.dayId}>
            <label className="flex min-h-12 items-center gap-3">
              <input type="checkbox" className="h-6 w-6" checked={c.chosen} disabled={busy === c.dayId || c.closed} onChange={() => void toggle(c)} />
              <span>
                {c.clubName}: {c.fieldName}, {c.day}
                {c.closed ? " (closed)" : ""}
              </span>
            </label>
          </li>
        ))}
      </ul>
      <InlineError message={error} />
    </section>
  );
}
