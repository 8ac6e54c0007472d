"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { requestJson } from "@/components/request/json";

const STATUSES = [["flying", "Flying"], ["being-repaired", "Being repaired"], ["retired", "Retired"], ["sold", "Sold"]] as const;

export type WaitingOffer = { email: string; withHistory: boolean; expiresOn: string };

const withdrawOffer = (modelId: string) => requestJson("DELETE", `/api/models/${modelId}/transfer`);

/**
 * Status, and offering the model to its buyer by e-mail (with its history only if the seller ticks
 * it). The model moves when the buyer accepts; the seller never learns whether the address has an
 * account, and can withdraw the offer while it waits.
 */
export function ModelActions({ modelId, status, offer }: { modelId: string; status: string; offer: WaitingOffer | null }) {
  const router = useRouter();
  const [email, setEmail] = useState("");
  const [withHistory, setWithHistory] = useState(false);
  const [message, setMessage] = useState<string | null>(null);
  async function act(fn: () => Promise<unknown>, done: string, then: () => void = router.refresh) {
    setMessage(null);
    try {
      await fn();
      setMessage(done);
      then();
    } catch (err) {
      setMessage((err as Error).message);
    }
  }
  return (
    <section aria-labelledby="actions-h" className="space-y-3">
      <h2 id="actions-h" className="text-lg font-bold">Status and sale</h2>
      <label htmlFor="model-status" className="block font-semibold">Status</label>
      <select id="model-status" defaultValue={status} className="min-h-14 w-full rounded-lg border-2 border-line bg-raised px-3 text-lg"
        onChange={(e) => act(() => requestJson("PATCH", `/api/models/${modelId}`, { status: e.target.value }), "Status saved.")}>
        {STATUSES.map(([v, l]) => <option key={v} value={v}>{l}</option>)}
      </select>
      {offer ? (
        <div className="space-y-2 rounded-xl border-2 border-line p-3" data-testid="waiting-offer">
          <p>
            Offered to <strong>{offer.email}</strong> {offer.withHistory ? "with its history" : "without its history"}, until {offer.expiresOn}.
            It moves when an account with that address accepts.
          </p>
          <Button type="button" variant="secondary" onClick={() => void act(() => withdrawOffer(modelId), "Offer withdrawn.")}>Withdraw the offer</Button>
        </div>
      ) : status === "sold" ? null : (
        <form className="space-y-3" aria-label="Offer to a buyer" onSubmit={(e) => { e.preventDefault(); void act(() => requestJson("POST", `/api/models/${modelId}/transfer`, { email, withHistory }), "Offered. If an account uses that address, it sees the offer in its hangar."); }}>
          <TextField id="buyer-email" type="email" label="Buyer's e-mail address" value={email} onChange={(e) => setEmail(e.target.value)} required />
          <label className="flex min-h-12 items-center gap-3"><input type="checkbox" className="size-6" checked={withHistory} onChange={(e) => setWithHistory(e.target.checked)} /> Hand over its history (flights, launch heights, repairs)</label>
          <Button type="submit" variant="danger">Offer the model</Button>
        </form>
      )}
      {message ? <p role="status">{message}</p> : null}
    </section>
  );
}
