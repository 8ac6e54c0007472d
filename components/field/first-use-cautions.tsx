"use client";

import { useState } from "react";
import { CautionList } from "@/components/cautions/caution-list";
import { CAUTIONS_SEEN_KEY } from "@/components/shell/theme-script";

/**
 * The safety cautions, open on first use until dismissed; the choice stays on this phone.
 * Rendered on the server; a phone that has read them hides them before paint (the head script
 * sets `data-cautions-seen` on <html>), so the page below never moves when it hydrates.
 */
export function FirstUseCautions() {
  const [dismissed, setDismissed] = useState(false);
  if (dismissed) return null;
  return (
    <section aria-labelledby="cautions-title" className="space-y-3 rounded-2xl border-4 border-ink p-4 [[data-cautions-seen]_&]:hidden">
      <h2 id="cautions-title" className="text-xl font-extrabold">
        Before you fly
      </h2>
      <CautionList />
      <button
        type="button"
        onClick={() => {
          localStorage.setItem(CAUTIONS_SEEN_KEY, "1");
          setDismissed(true);
        }}
        className="min-h-touch w-full rounded-xl bg-accent font-bold text-accent-ink"
      >
        I have read these
      </button>
    </section>
  );
}
