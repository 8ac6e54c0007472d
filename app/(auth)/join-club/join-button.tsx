"use client";

import Link from "next/link";
import { useState } from "react";
import { sendJson } from "@/components/request/json";
import { Button } from "@/components/ui/button";
import { FormError } from "@/components/ui/form-footer";

/** Uses the invitation for the signed-in account; a refusal (used, expired, already a member) is said in words. */
export function JoinButton({ token, clubName, who }: { token: string; clubName: string; who: string }) {
  const [busy, setBusy] = useState(false);
  const [state, setState] = useState<{ ok: true; slug: string } | { ok: false; message: string } | null>(null);

  async function join() {
    setBusy(true);
    const reply = await sendJson<{ joined: { slug: string } }>("POST", "/api/invitations/accept", { token });
    setBusy(false);
    setState(reply.ok ? { ok: true, slug: reply.data.joined.slug } : { ok: false, message: reply.message });
  }

  if (state?.ok) {
    return (
      <div className="space-y-4">
        <p role="status" className="font-semibold">
          Welcome to {clubName}.
        </p>
        <Link href={`/clubs/${state.slug}`} className="font-bold underline">
          Open the club
        </Link>
      </div>
    );
  }
  return (
    <div className="space-y-4">
      <p>You will join as {who}.</p>
      <Button type="button" onClick={join} disabled={busy} className="w-full">
        {busy ? "Joining…" : `Join ${clubName}`}
      </Button>
      <FormError message={state && !state.ok ? state.message : null} />
    </div>
  );
}
