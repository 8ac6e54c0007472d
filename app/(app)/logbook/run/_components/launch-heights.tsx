"use client";

import type { RunLog } from "./use-launch-heights";

const clock = new Intl.DateTimeFormat("en-GB", { hour: "2-digit", minute: "2-digit", second: "2-digit" });
const gapText = (ms: number) => (Math.abs(ms) < 500 ? "clocks agree" : `logger clock ${(Math.abs(ms) / 1000).toFixed(1)} s ${ms < 0 ? "behind" : "ahead"}`);

/** A lane's launch heights from its logs: matched flights with the clock gap, then the launches no flight matched. */
export function LaunchHeights({ logs, lane, label }: { logs: readonly RunLog[]; lane: number; label: string }) {
  const mine = logs.filter((l) => l.lane === lane);
  if (mine.length === 0) return null;
  return (
    <div className="space-y-2" data-testid={`launch-heights-${lane}`}>
      <h3 className="text-lg font-bold">Launch heights</h3>
      {mine.map((log) => {
        const matched = log.launches.filter((x) => x.flightIndex !== null);
        const unmatched = log.launches.filter((x) => x.flightIndex === null);
        return (
          <div key={log.id} className="space-y-1">
            <p className="text-sm text-muted">
              {log.fileName} ({log.loggerName}, {log.samples ?? 0} samples) · <a className="font-bold underline" href={`/api/logs/${log.id}/download`} onClick={(e) => { e.preventDefault(); void download(log.id); }}>download</a>
            </p>
            {matched.length ? (
              <ul aria-label={`Launch heights, ${label}`} className="figures">
                {matched.map((x) => <li key={x.atMs}>Flight {x.flightIndex! + 1}: {x.heightM.toFixed(1)} m <span className="text-sm text-muted">({gapText(x.gapMs ?? 0)})</span></li>)}
              </ul>
            ) : <p>No launch in the log matched a flight of this lane.</p>}
            {unmatched.length ? (
              <div>
                <p className="font-semibold">Launches in the log that match no flight (not guessed):</p>
                <ul aria-label={`Unmatched launches, ${label}`} className="figures text-sm">
                  {unmatched.map((x) => <li key={x.atMs}>{clock.format(new Date(x.atMs))} — {x.heightM.toFixed(1)} m</li>)}
                </ul>
              </div>
            ) : null}
          </div>
        );
      })}
    </div>
  );
}

async function download(logId: string) {
  const res = await fetch(`/api/logs/${logId}/download`, { cache: "no-store" });
  if (!res.ok) return;
  const { url } = (await res.json()) as { url: string };
  window.location.assign(url);
}
