"use client";

import { useState } from "react";
import { discardUnstartedRun } from "@/lib/offline/discard";
import { getWindowcallDb } from "@/lib/offline/db";

/** Deletes a window that was set up but never started (asks once more first). */
export function DiscardButton({ runId, what, onDone }: { runId: string; what: string; onDone?: () => void }) {
  const [asking, setAsking] = useState(false);
  const [message, setMessage] = useState<string | null>(null);
  if (!asking) {
    return (
      <button type="button" onClick={() => setAsking(true)} className="min-h-12 rounded-lg border-2 border-danger px-3 text-sm font-bold text-danger">
        Delete this unstarted window<span className="sr-only"> ({what})</span>
      </button>
    );
  }
  return (
    <div className="flex flex-wrap items-center gap-2" role="group" aria-label="Delete the window">
      <span className="text-sm font-semibold">Delete it? It was never started, so nothing is lost.</span>
      <button
        type="button"
        onClick={() =>
          void discardUnstartedRun(getWindowcallDb(), runId).then((r) => {
            if (r === "started") setMessage("This window has started: it is kept.");
            else onDone?.();
          })
        }
        className="min-h-12 rounded-lg border-4 border-danger px-3 text-sm font-extrabold text-danger"
      >
        Delete
      </button>
      <button type="button" onClick={() => setAsking(false)} className="min-h-12 rounded-lg border-2 border-ink px-3 text-sm font-bold">
        Keep
      </button>
      {message ? <p role="alert" className="w-full text-sm font-semibold text-danger">{message}</p> : null}
    </div>
  );
}
