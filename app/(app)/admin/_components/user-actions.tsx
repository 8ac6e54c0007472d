"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { useSend } from "@/components/request/use-send";
import type { AdminUserAction } from "@/lib/validations/admin";

type Props = { userId: string; email: string; role: "member" | "admin"; disabled: boolean; isMe: boolean };

const DONE: Record<AdminUserAction["action"], string> = { disable: "Disabled", enable: "Re-enabled", "set-role": "Changed the role of" };

/**
 * Disable / re-enable an account and change its site role. Each takes effect at the account's next
 * request; the page then reloads its server parts (this list and the audit log).
 */
export function UserActions({ userId, email, role, disabled, isMe }: Props) {
  const { send, busy, error } = useSend();
  const [done, setDone] = useState<string | null>(null);

  async function act(change: AdminUserAction) {
    setDone(null);
    const reply = await send("PATCH", `/api/admin/users/${userId}`, change);
    if (reply?.ok) setDone(`${DONE[change.action]} ${email}.`);
  }
  const message = error ? { text: error, error: true } : done ? { text: done, error: false } : null;

  return (
    <div className="space-y-2">
      <div className="flex flex-wrap gap-2">
        {disabled ? (
          <Button variant="secondary" disabled={busy} onClick={() => void act({ action: "enable" })}>
            Re-enable
          </Button>
        ) : (
          <Button variant="danger" disabled={busy} onClick={() => void act({ action: "disable" })}>
            {isMe ? "Disable my account" : "Disable"}
          </Button>
        )}
        <Button variant="secondary" disabled={busy} onClick={() => void act({ action: "set-role", role: role === "admin" ? "member" : "admin" })}>
          {role === "admin" ? "Make member" : "Make admin"}
        </Button>
      </div>
      <p role="status" aria-live="polite" className={`font-semibold empty:hidden ${message?.error ? "text-danger" : ""}`}>
        {message?.text}
      </p>
    </div>
  );
}
