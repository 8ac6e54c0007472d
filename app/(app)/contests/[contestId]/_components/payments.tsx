"use client";
import { useState } from "react";
import { sendJson } from "@/components/request/json";
import { useSend } from "@/components/request/use-send";
import { Button } from "@/components/ui/button";

const Alert = ({ message }: { message: string | null }) => (message ? <p role="alert" className="text-danger">{message}</p> : null);

/** The pilot pays (again) for their entry: a new Checkout page of the payments service, then back here. */
export function PayButton({ contestId, entryId, label }: { contestId: string; entryId: string; label: string }) {
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  async function pay() {
    setBusy(true);
    const reply = await sendJson<{ checkoutUrl: string }>("POST", `/api/contests/${contestId}/entries/${entryId}/checkout`);
    if (reply.ok) window.location.assign(reply.data.checkoutUrl);
    else { setBusy(false); setMessage(reply.message); }
  }
  return (
    <div className="space-y-1">
      <Button type="button" onClick={() => void pay()} disabled={busy}>{label}</Button>
      <Alert message={message} />
    </div>
  );
}

/** The officer marks an entry paid in cash. */
export function CashButton({ contestId, entryId, pilotName }: { contestId: string; entryId: string; pilotName: string }) {
  const { send, busy, error } = useSend();
  return (
    <span>
      <Button type="button" variant="secondary" className="px-3 text-sm" disabled={busy} onClick={() => void send("POST", `/api/contests/${contestId}/entries/${entryId}/cash`)}>
        Mark {pilotName} paid in cash
      </Button>
      <Alert message={error} />
    </span>
  );
}
