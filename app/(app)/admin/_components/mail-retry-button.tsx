"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { useSend } from "@/components/request/use-send";

/** Sends a failed message again: due at once, with fresh attempts; the page reloads the queue and the audit log. */
export function MailRetryButton({ mailId, to }: { mailId: string; to: string }) {
  const { send, busy, error } = useSend();
  const [done, setDone] = useState<string | null>(null);

  async function retry() {
    setDone(null);
    const reply = await send("POST", `/api/admin/mail/${mailId}/retry`, {});
    if (reply?.ok) setDone(`The message to ${to} is queued again.`);
  }
  const message = error ?? done;

  return (
    <div className="space-y-1">
      <Button variant="secondary" disabled={busy} onClick={() => void retry()}>
        Retry
      </Button>
      <p role="status" aria-live="polite" className="font-semibold empty:hidden">
        {message}
      </p>
    </div>
  );
}
