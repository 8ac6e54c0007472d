"use client";

import { useState } from "react";
import { CautionList } from "@/components/cautions/caution-list";

export const CAUTIONS_SEEN_KEY = "windowcall.cautions.seen";

/** The safety cautions, open on first use until dismissed; the choice stays on this phone. */
export function FirstUseCautions() {
  const [seen, setSeen] = useState(() => localStorage.getItem(CAUTIONS_SEEN_KEY) === "1");
  if (seen) return null;
  return (
    <section aria-labelledby="cautions-title" className="space-y-3 rounded-2xl border-4 border-ink p-4">
      <h2 id="cautions-title" className="text-xl font-extrabold">
        Before you fly
      </h2>
      <CautionList />
      <button
        type="button"
        onClick={() => {
          localStorage.setItem(CAUTIONS_SEEN_KEY, "1");
          setSeen(true);
        }}
        className="min-h-touch w-full rounded-xl bg-accent font-bold text-accent-ink"
      >
        I have read these
      </button>
    </section>
  );
}
