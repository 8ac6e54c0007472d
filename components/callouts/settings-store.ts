"use client";

import { useCallback, useSyncExternalStore } from "react";
import { DEFAULT_CALLOUT_SETTINGS, parseCalloutSettings, type CalloutSettings } from "@/lib/callouts";

/** Callout settings live on the device (localStorage), so they work offline and per phone. */
export const CALLOUT_SETTINGS_KEY = "windowcall.callouts";

const listeners = new Set<() => void>();
let cachedRaw: string | null | undefined;
let cached: CalloutSettings = DEFAULT_CALLOUT_SETTINGS;

function readRaw(): string | null {
  try {
    return localStorage.getItem(CALLOUT_SETTINGS_KEY);
  } catch {
    return null; // storage blocked: defaults
  }
}

/** The stored settings (parsed once per stored value, so the snapshot is stable for React). */
export function loadCalloutSettings(): CalloutSettings {
  const raw = readRaw();
  if (raw !== cachedRaw) {
    cachedRaw = raw;
    let parsed: unknown = null;
    try {
      parsed = raw === null ? null : JSON.parse(raw);
    } catch {
      parsed = null;
    }
    cached = parseCalloutSettings(parsed);
  }
  return cached;
}

/** Stores the settings and tells every hook on the page. */
export function saveCalloutSettings(next: CalloutSettings): void {
  try {
    localStorage.setItem(CALLOUT_SETTINGS_KEY, JSON.stringify(next));
  } catch {
    cachedRaw = undefined; // private mode: keep them for this page only
    cached = next;
  }
  listeners.forEach((l) => l());
}

function subscribe(listener: () => void): () => void {
  listeners.add(listener);
  const onStorage = (e: StorageEvent) => {
    if (e.key === CALLOUT_SETTINGS_KEY) listener();
  };
  window.addEventListener("storage", onStorage); // another tab changed them
  return () => {
    listeners.delete(listener);
    window.removeEventListener("storage", onStorage);
  };
}

/** The device's callout settings and a setter; defaults during server rendering. */
export function useCalloutSettings(): [CalloutSettings, (next: CalloutSettings) => void] {
  const settings = useSyncExternalStore(subscribe, loadCalloutSettings, () => DEFAULT_CALLOUT_SETTINGS);
  const update = useCallback((next: CalloutSettings) => saveCalloutSettings(next), []);
  return [settings, update];
}
