"use client";

import { useSyncExternalStore } from "react";
import { THEMES, applyTheme, readTheme, subscribeTheme, type Theme } from "@/components/shell/theme-script";

const LABELS: Record<Theme, string> = { outdoor: "Outdoor (high contrast)", light: "Light", dark: "Dark" };

/** Three schemes; the choice is stored on this device and applied at once. */
export function ThemePicker() {
  const theme = useSyncExternalStore(subscribeTheme, readTheme, () => "outdoor" as Theme);
  return (
    <fieldset className="space-y-2">
      <legend className="sr-only">Colour scheme</legend>
      {THEMES.map((t) => (
        <label key={t} className="flex min-h-touch items-center gap-3 rounded-xl border-2 border-line bg-raised px-4">
          <input type="radio" name="theme" value={t} checked={theme === t} onChange={() => applyTheme(t)} className="h-6 w-6" />
          <span className="font-semibold">{LABELS[t]}</span>
        </label>
      ))}
    </fieldset>
  );
}
