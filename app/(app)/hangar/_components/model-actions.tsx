"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { sendJson } from "./post-json";

const STATUSES = [["flying", "Flying"], ["being-repaired", "Being repaired"], ["retired", "Retired"], ["sold", "Sold"]] as const;

/** Status, and handing the model to its buyer (with its history only if the seller ticks it). */
export function ModelActions({ modelId, status }: { modelId: string; status: string }) {
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
        onChange={(e) => act(() => sendJson(`/api/models/${modelId}`, { status: e.target.value }, "PATCH"), "Status saved.")}>
        {STATUSES.map(([v, l]) => <option key={v} value={v}>{l}</option>)}
      </select>
      <form className="space-y-3" aria-label="Transfer to the buyer" onSubmit={(e) => { e.preventDefault(); void act(() => sendJson(`/api/models/${modelId}/transfer`, { email, withHistory }), "Transferred.", () => router.push("/hangar")); }}>
        <TextField id="buyer-email" type="email" label="Buyer's account e-mail" value={email} onChange={(e) => setEmail(e.target.value)} required />
        <label className="flex items-center gap-2"><input type="checkbox" checked={withHistory} onChange={(e) => setWithHistory(e.target.checked)} /> Hand over its history (flights, launch heights, repairs)</label>
        <Button type="submit" variant="danger">Transfer the model</Button>
      </form>
      {message ? <p role="status">{message}</p> : null}
    </section>
  );
}
