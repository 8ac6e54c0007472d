"use client";

import { useLiveQuery } from "dexie-react-hooks";
import { useEffect, useRef } from "react";
import type { RunEvent } from "@/lib/events/schema";
import { getWindowcallDb } from "@/lib/offline/db";
import { cachedModels, lastModel, refreshModels, rememberModel, type CachedModel } from "@/lib/offline/models-cache";

const NONE: readonly CachedModel[] = [];

type Props = { lane: number; laneLabel: string; userId: string; events: readonly RunEvent[]; open: boolean; onPick: (modelId: string) => Promise<boolean> };

/** The lane's current model: its latest "model" event that no undo names. */
export function currentModel(events: readonly RunEvent[], lane: number): string | null {
  const voided = new Set(events.flatMap((e) => (e.body.kind === "void" ? [e.body.targetId] : [])));
  let id: string | null = null;
  for (const e of events) if (e.body.kind === "model" && e.body.lane === lane && !voided.has(e.id)) id = e.body.modelId;
  return id;
}

/**
 * Which of the pilot's models flies in this lane. The one flown last is chosen at once when the
 * lane has none yet; a change mid-window is a new "model" event (a swap), so each launch knows its model.
 */
export function ModelPicker({ lane, laneLabel, userId, events, open, onPick }: Props) {
  const models = useLiveQuery(() => cachedModels(getWindowcallDb()), [userId]) ?? NONE;
  const current = currentModel(events, lane);
  const preselected = useRef(false);
  useEffect(() => {
    void refreshModels(getWindowcallDb());
  }, [userId]);
  useEffect(() => {
    if (preselected.current || !open || current) return;
    const last = lastModel(userId);
    if (last && models.some((m) => m.id === last && m.status !== "sold")) {
      preselected.current = true;
      void onPick(last);
    }
  }, [open, current, models, userId, onPick]);
  const choices = models.filter((m) => m.status === "flying" || m.status === "being-repaired" || m.id === current);
  if (choices.length === 0) return null;
  return (
    <div className="space-y-1">
      <label htmlFor={`model-${lane}`} className="block font-semibold">Model<span className="sr-only">, {laneLabel}</span></label>
      <select
        id={`model-${lane}`}
        value={current ?? ""}
        disabled={!open}
        className="min-h-14 w-full rounded-lg border-2 border-line bg-raised px-3 text-lg"
        onChange={(e) => {
          if (!e.target.value) return;
          rememberModel(userId, e.target.value);
          void onPick(e.target.value);
        }}
      >
        {current ? null : <option value="">Choose a model</option>}
        {choices.map((m) => <option key={m.id} value={m.id}>{m.name}</option>)}
      </select>
    </div>
  );
}
