"use client";

import Link from "next/link";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { FormError } from "@/components/ui/form-footer";

/** Uses the invitation for the signed-in account; a refusal (used, expired, already a member) is said in words. */
export function JoinButton({ token, clubName, who }: { token: string; clubName: string; who: string }) {
  const [busy, setBusy] = useState(false);
  const [state, setState] = useState<{ ok: true; slug: string } | { ok: false; message: string } | null>(null);

  async function join() {
    setBusy(true);
    const res = await fetch("/api/invitations/accept", { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ token }) }).catch(() => null);
    const data = (await res?.json().catch(() => null)) as { joined?: { slug: string }; error?: { message?: string } } | null;
    setBusy(false);
    if (res?.ok && data?.joined) return setState({ ok: true, slug: data.joined.slug });
    setState({ ok: false, message: data?.error?.message ?? (res ? "Something went wrong. Try again." : "Could not reach the server. Try again when online.") });
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
