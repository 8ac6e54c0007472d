"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { requestJson } from "@/components/request/json";

export type OfferView = { id: string; modelName: string; spanMm: number; massG: number; marking: string; sellerName: string; withHistory: boolean };

/** Models other pilots offered to this account's address: accept (the model joins the hangar) or decline. */
export function OffersToMe({ offers }: { offers: OfferView[] }) {
  const router = useRouter();
  const [busy, setBusy] = useState<string | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  async function answer(offer: OfferView, a: "accept" | "decline") {
    setBusy(offer.id);
    setMessage(null);
    try {
      const r = await requestJson<{ answer: string; modelId?: string }>("POST", `/api/model-offers/${offer.id}`, { answer: a });
      setMessage(a === "accept" ? `${offer.modelName} is in your hangar.` : `You declined ${offer.modelName}.`);
      if (r.modelId) router.push(`/hangar/${r.modelId}`);
      else router.refresh();
    } catch (err) {
      setMessage((err as Error).message);
    } finally {
      setBusy(null);
    }
  }
  return (
    <section aria-labelledby="offers-h" className="space-y-3">
      <h2 id="offers-h" className="text-lg font-bold">Offered to you</h2>
      <ul className="space-y-2" aria-label="Models offered to you">
        {offers.map((o) => (
          <li key={o.id} className="space-y-2 rounded-xl border-2 border-line bg-raised p-3">
            <p className="text-lg font-bold">{o.modelName}</p>
            <p className="text-sm">
              {o.spanMm} mm · {o.massG} g{o.marking ? ` · ${o.marking}` : ""} · from {o.sellerName}, {o.withHistory ? "with its history (flights, launch heights, repairs)" : "without its history"}
            </p>
            <div className="flex flex-wrap gap-2">
              <Button type="button" disabled={busy !== null} onClick={() => void answer(o, "accept")} aria-label={`Accept ${o.modelName}`}>Accept</Button>
              <Button type="button" variant="secondary" disabled={busy !== null} onClick={() => void answer(o, "decline")} aria-label={`Decline ${o.modelName}`}>Decline</Button>
            </div>
          </li>
        ))}
      </ul>
      {message ? <p role="status">{message}</p> : null}
    </section>
  );
}
