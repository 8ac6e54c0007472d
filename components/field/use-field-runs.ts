"use client";

import { useSyncExternalStore } from "react";
import { getWindowcallDb } from "@/lib/offline/db";
import { FieldRunsReader, type FieldRuns } from "@/lib/offline/field-runs";
import { sharedLiveQuery } from "@/lib/offline/shared-live-query";

export type { FieldRunRow } from "@/lib/offline/field-runs";

const reader = new FieldRunsReader();

/**
 * The device's newest runs (its own and pulled ones): windows still open and the latest finished ones
 * (lib/offline/field-runs.ts). One query for the whole page: /field's open windows and recent results both
 * show it, and each write while the page loads (the first pull) re-reads it once, not once each.
 */
const fieldRuns = sharedLiveQuery(() => reader.read(getWindowcallDb()));

export function useFieldRuns(): FieldRuns | undefined {
  return useSyncExternalStore(fieldRuns.subscribe, fieldRuns.getSnapshot, () => undefined);
}
