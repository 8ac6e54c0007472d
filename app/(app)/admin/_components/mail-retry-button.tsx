"use client";

import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { Button } from "@/components/ui/button";
import { adminRequest } from "./admin-request";

/** Sends a failed message again: due at once, with fresh attempts; the page reloads the queue and the audit log. */
export function MailRetryButton({ mailId, to }: { mailId: string; to: string }) {
  const router = useRouter();
  const [busy, startTransition] = useTransition();
  const [message, setMessage] = useState<string | null>(null);

  function retry() {
    setMessage(null);
    startTransition(async () => {
      const reply = await adminRequest(`/api/admin/mail/${mailId}/retry`, "POST", {});
      if (!reply.ok) return setMessage(reply.message);
      setMessage(`The message to ${to} is queued again.`);
      router.refresh();
    });
  }

  return (
    <div className="space-y-1">
      <Button variant="secondary" disabled={busy} onClick={retry}>
        Retry
      </Button>
      <p role="status" aria-live="polite" className="font-semibold empty:hidden">
        {message}
      </p>
    </div>
  );
}
