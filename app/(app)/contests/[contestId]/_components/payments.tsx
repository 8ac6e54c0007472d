"use client";
import { useSend } from "@/components/request/use-send";
import { Button } from "@/components/ui/button";

const Alert = ({ message }: { message: string | null }) => (message ? <p role="alert" className="text-danger">{message}</p> : null);

/** The pilot pays (again) for their entry: a new Checkout page of the payments service, then back here. */
export function PayButton({ contestId, entryId, label }: { contestId: string; entryId: string; label: string }) {
  const { send, busy, error } = useSend();
  async function pay() {
    const reply = await send<{ checkoutUrl: string }>("POST", `/api/contests/${contestId}/entries/${entryId}/checkout`, undefined, { refresh: false, leaving: true });
    if (reply?.ok) window.location.assign(reply.data.checkoutUrl);
  }
  return (
    <div className="space-y-1">
      <Button type="button" onClick={() => void pay()} disabled={busy}>{label}</Button>
      <Alert message={error} />
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
