import { formatCountdown } from "@/lib/field/display";
import type { LiveState } from "@/lib/tasks";

/**
 * The window's clock: working time left in the largest figures on the screen, readable at
 * arm's length, over a strip of the whole working time (elapsed part filled, one tick a minute).
 * Compact (several lanes): label and figures on one line, so every lane's control fits below.
 */
export function ClockPanel({ live, workingTimeSec, compact = false }: { live: LiveState; workingTimeSec: number; compact?: boolean }) {
  const landing = live.phase === "landing-window";
  const ended = live.phase === "ended";
  const label = landing ? "Landing window" : ended ? "Working time over" : "Working time left";
  const ms = landing ? (live.landingWindowLeftMs ?? 0) : (live.workingTimeLeftMs ?? 0);
  const totalMs = workingTimeSec * 1000;
  const elapsed = Math.min(totalMs, Math.max(0, live.elapsedMs ?? 0));
  const minutes = Math.floor(workingTimeSec / 60);
  return (
    <section aria-label="Working time" className="space-y-1">
      <div className="flex items-center justify-between gap-2">
        <div>
          <p className="font-bold uppercase tracking-wide">{label}</p>
          {live.attempt ? (
            <p className="figures font-bold">
              Attempt {live.attempt.index + 1} of {live.attempt.of}
            </p>
          ) : null}
        </div>
        {compact ? <Figures ms={ms} className="text-5xl" /> : null}
      </div>
      {compact ? null : <Figures ms={ms} className="text-center text-[6rem]" />}
      <div aria-hidden className="relative h-5 overflow-hidden rounded border-2 border-ink bg-raised">
        <div className="absolute inset-y-0 left-0 bg-ink" style={{ width: `${(elapsed / totalMs) * 100}%` }} />
        {Array.from({ length: Math.max(0, minutes - 1) }, (_, i) => (
          <div key={i} className="absolute inset-y-0 w-0.5 bg-muted mix-blend-difference" style={{ left: `${((i + 1) * 60 * 100) / workingTimeSec}%` }} />
        ))}
      </div>
    </section>
  );
}

function Figures({ ms, className }: { ms: number; className: string }) {
  return (
    <p className={`figures font-extrabold leading-none ${className}`} data-testid="working-time-left" role="timer" aria-live="off">
      {formatCountdown(ms)}
    </p>
  );
}
