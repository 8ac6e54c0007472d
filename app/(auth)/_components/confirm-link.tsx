"use client";

import Link from "next/link";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { FormError } from "@/components/ui/form-footer";
import { sendJson } from "@/components/request/json";

/**
 * A mailed link's page: one button that uses the token. It is not used on load, so a mail scanner
 * that opens links does not spend it.
 */
export function ConfirmLink({ token, url, action, done }: { token: string; url: string; action: string; done: string }) {
  const [state, setState] = useState<{ ok: boolean; message: string } | null>(null);
  const [busy, setBusy] = useState(false);

  async function confirm() {
    setBusy(true);
    const reply = await sendJson("POST", url, { token });
    setBusy(false);
    setState(reply.ok ? { ok: true, message: done } : { ok: false, message: reply.message ?? "Something went wrong." });
  }

  if (state?.ok) {
    return (
      <div className="space-y-4">
        <p role="status" className="font-semibold">
          {state.message}
        </p>
        <Link href="/" className="font-bold underline">
          Go to Windowcall
        </Link>
      </div>
    );
  }
  return (
    <div className="space-y-4">
      <Button type="button" onClick={confirm} disabled={busy} className="w-full">
        {busy ? "Confirming…" : action}
      </Button>
      <FormError message={state?.message} />
    </div>
  );
}
