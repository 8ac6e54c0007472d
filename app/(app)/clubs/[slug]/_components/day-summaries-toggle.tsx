"use client";

import { useState } from "react";
import { InlineError } from "@/components/ui/form-footer";
import { sendJson } from "@/components/request/json";

/** The member's own choice: an e-mail with each field day's summary when an officer closes the day. */
export function DaySummariesToggle({ slug, on }: { slug: string; on: boolean }) {
  const [checked, setChecked] = useState(on);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);

  // the box follows the click at once and goes back if the server refuses
  async function change(next: boolean) {
    setChecked(next);
    setBusy(true);
    setError(null);
    const reply = await sendJson("PUT", `/api/clubs/${slug}/day-summaries`, { on: next });
    setBusy(false);
    if (!reply.ok) {
      setChecked(!next);
      setError(reply.message);
    }
  }

  return (
    <div className="space-y-1" id="day-summaries">
      <label className="flex min-h-12 items-center gap-3">
        <input type="checkbox" className="h-6 w-6" checked={checked} disabled={busy} onChange={(e) => void change(e.target.checked)} />
        <span>E-mail me the summary of each field day when it is closed</span>
      </label>
      <InlineError message={error} />
    </div>
  );
}
