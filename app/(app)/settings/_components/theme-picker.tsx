"use client";

import { useEffect, useState } from "react";
import { THEMES, THEME_KEY, type Theme } from "@/components/shell/theme-script";

const LABELS: Record<Theme, string> = { outdoor: "Outdoor (high contrast)", light: "Light", dark: "Dark" };

/** Three schemes; the choice is stored on this device and applied at once. */
export function ThemePicker() {
  const [theme, setTheme] = useState<Theme>("outdoor");
  useEffect(() => {
    const saved = document.documentElement.dataset.theme as Theme | undefined;
    if (saved && THEMES.includes(saved)) setTheme(saved);
  }, []);
  function choose(next: Theme) {
    setTheme(next);
    document.documentElement.dataset.theme = next;
    try {
      localStorage.setItem(THEME_KEY, next);
    } catch {
      /* private mode: the choice lasts for this page only */
    }
  }
  return (
    <fieldset className="space-y-2">
      <legend className="sr-only">Colour scheme</legend>
      {THEMES.map((t) => (
        <label key={t} className="flex min-h-touch items-center gap-3 rounded-xl border-2 border-line bg-raised px-4">
          <input type="radio" name="theme" value={t} checked={theme === t} onChange={() => choose(t)} className="h-6 w-6" />
          <span className="font-semibold">{LABELS[t]}</span>
        </label>
      ))}
    </fieldset>
  );
}
