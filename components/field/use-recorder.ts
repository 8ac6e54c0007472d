"use client";

import { useCallback, useLayoutEffect, useMemo, useRef, useState } from "react";
import type { ClockEstimate } from "@/lib/clock";
import type { EventBody, RunEvent, Stamp } from "@/lib/events/schema";
import { inputMonoOf } from "@/lib/field/input-time";
import type { TimeSource } from "@/lib/field/time-source";
import { getWindowcallDb } from "@/lib/offline/db";
import { getPageId, stampFromInput } from "@/lib/offline/device";
import { recordEvent } from "@/lib/offline/record";
import { isQuotaError } from "@/lib/offline/storage";

/** Decides what to record once every earlier write is stored; null records nothing. */
export type BodyFor = (events: readonly RunEvent[], stamp: Stamp) => EventBody | null;

type Options = {
  runId: string;
  stored: readonly RunEvent[];
  clocks: TimeSource;
  estimate: ClockEstimate | null;
  onWritten?: (event: RunEvent, all: readonly RunEvent[]) => void;
};

/**
 * Every write of the live screen goes through one queue: the stamp is taken at the input
 * (its own `event.timeStamp`), then — after every earlier write is stored — the body is
 * decided from the stored events and `recordEvent` writes event + outbox in one transaction.
 * Only then does the screen change (the event joins `events`). Nothing is debounced.
 */
export function useRecorder({ runId, stored, clocks, estimate, onWritten }: Options) {
  const queue = useRef<Promise<unknown>>(Promise.resolve());
  const [written, setWritten] = useState<RunEvent[]>([]);
  const [error, setError] = useState<{ message: string; quota: boolean } | null>(null);

  const events = useMemo(() => {
    const ids = new Set(stored.map((e) => e.id));
    return [...stored, ...written.filter((e) => !ids.has(e.id))];
  }, [stored, written]);
  const latest = useRef(events);
  useLayoutEffect(() => {
    latest.current = events;
  }, [events]);

  /** A stamp for an input: its own timeStamp when that is on this page's clock, else "now". */
  const stampInput = useCallback(
    (eventTimeStamp: number): Stamp => {
      const monoNow = clocks.monoNow();
      const mono = clocks.inputsOnMonoClock() ? inputMonoOf(eventTimeStamp, monoNow).monoMs : monoNow;
      return stampFromInput(mono, estimate, clocks, getPageId());
    },
    [clocks, estimate],
  );

  const record = useCallback(
    (stamp: Stamp, bodyFor: BodyFor): Promise<RunEvent | null> => {
      const job = queue.current.then(async () => {
        const body = bodyFor(latest.current, stamp);
        if (!body) return null;
        try {
          const event = await recordEvent(getWindowcallDb(), { runId, body, stamp });
          latest.current = [...latest.current, event];
          setWritten((w) => [...w, event]);
          setError(null);
          onWritten?.(event, latest.current);
          return event;
        } catch (e) {
          const quota = isQuotaError(e);
          setError({
            quota,
            message: quota
              ? "The phone's storage is full: this tap was NOT saved. Free some space, then tap again."
              : `This tap was NOT saved: ${e instanceof Error ? e.message : String(e)}`,
          });
          return null;
        }
      });
      queue.current = job;
      return job;
    },
    [runId, onWritten],
  );

  return { events, record, stampInput, error, clearError: () => setError(null) };
}
