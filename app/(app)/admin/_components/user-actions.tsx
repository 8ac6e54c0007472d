"use client";

import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { Button } from "@/components/ui/button";
import type { AdminUserAction } from "@/lib/validations/admin";
import { adminRequest } from "./admin-request";

type Props = { userId: string; email: string; role: "member" | "admin"; disabled: boolean; isMe: boolean };

const DONE: Record<AdminUserAction["action"], string> = { disable: "Disabled", enable: "Re-enabled", "set-role": "Changed the role of" };

/**
 * Disable / re-enable an account and change its site role. Each takes effect at the account's next
 * request; the page then reloads its server parts (this list and the audit log).
 */
export function UserActions({ userId, email, role, disabled, isMe }: Props) {
  const router = useRouter();
  const [busy, startTransition] = useTransition();
  const [message, setMessage] = useState<{ text: string; error: boolean } | null>(null);

  function act(change: AdminUserAction) {
    setMessage(null);
    startTransition(async () => {
      const reply = await adminRequest(`/api/admin/users/${userId}`, "PATCH", change);
      if (!reply.ok) return setMessage({ text: reply.message, error: true });
      setMessage({ text: `${DONE[change.action]} ${email}.`, error: false });
      router.refresh();
    });
  }

  return (
    <div className="space-y-2">
      <div className="flex flex-wrap gap-2">
        {disabled ? (
          <Button variant="secondary" disabled={busy} onClick={() => act({ action: "enable" })}>
            Re-enable
          </Button>
        ) : (
          <Button variant="danger" disabled={busy} onClick={() => act({ action: "disable" })}>
            {isMe ? "Disable my account" : "Disable"}
          </Button>
        )}
        <Button variant="secondary" disabled={busy} onClick={() => act({ action: "set-role", role: role === "admin" ? "member" : "admin" })}>
          {role === "admin" ? "Make member" : "Make admin"}
        </Button>
      </div>
      <p role="status" aria-live="polite" className={`font-semibold empty:hidden ${message?.error ? "text-danger" : ""}`}>
        {message?.text}
      </p>
    </div>
  );
}
