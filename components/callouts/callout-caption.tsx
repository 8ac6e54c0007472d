"use client";

import type { Callout } from "@/lib/callouts";

/** The last callout as text, for pilots who cannot hear it (wind, gloves over the speaker). */
export function CalloutCaption({ callout }: { callout: Callout | null }) {
  return (
    <p aria-live="off" className="figures min-h-6 text-sm text-muted" data-callout-id={callout?.id}>
      {callout ? `🔊 ${callout.text}` : ""}
    </p>
  );
}
