"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { decideConsent } from "@/lib/offline/consent";
import { getWindowcallDb } from "@/lib/offline/db";
import type { ConsentChoice } from "@/lib/sync/consent";
import { CONSENT_REASON_MAX } from "@/lib/sync/consent";
import { disputeFormSchema, type DisputeForm, type LaneConsent } from "@/lib/validations/consent";

const STANDING: Record<string, string> = {
  pending: "Not in your record until you accept it.",
  accepted: "You accepted it: it counts in your record.",
  disputed: "You disputed it: it does not count in your record.",
  hidden: "You hid it: it is left out of your lists.",
};

/**
 * A run someone else recorded for the signed-in pilot: who recorded it, where it stands, and
 * accept / dispute (with a reason the recorder sees) / hide (lib/sync/consent.ts); a hidden one
 * (listed with "Show hidden runs") can be un-hidden: it waits for a decision again.
 */
export function ConsentBar({ runId, consent, recorder, label }: { runId: string; consent: LaneConsent; recorder: string; label: string }) {
  const [disputing, setDisputing] = useState(false);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  // the dispute's reason: react-hook-form with the zod resolver, its message beside the field; an empty one sends nothing
  const dispute = useForm<DisputeForm>({ resolver: zodResolver(disputeFormSchema), defaultValues: { reason: "" } });

  async function decide(decision: ConsentChoice, reason = "") {
    setBusy(true);
    setError(null);
    const failure = await decideConsent(getWindowcallDb(), (u, i) => fetch(u, i), { runId, lane: consent.lane, decision, reason });
    setBusy(false);
    if (failure) setError(failure);
    else setDisputing(false);
  }

  const offer = consent.status === "hidden" ? (["pending"] as const) : (["accepted", "disputed", "hidden"] as const).filter((d) => d !== consent.status);
  return (
    <div role="group" aria-label={label} className={`space-y-2 rounded-lg border-2 p-3 ${consent.status === "accepted" ? "border-line" : "border-warn"}`} data-consent={consent.status}>
      <p>
        <span className="font-bold">Recorded by {recorder}.</span> {STANDING[consent.status]}
        {consent.status === "disputed" && consent.reason ? <span className="block text-sm">Your reason: “{consent.reason}”</span> : null}
      </p>
      {disputing ? (
        <form className="space-y-2" noValidate onSubmit={(e) => void dispute.handleSubmit(({ reason }) => decide("disputed", reason))(e)}>
          <TextField
            id={`dispute-${runId}-${consent.lane}`}
            label="What is wrong with it? (the recorder sees this)"
            maxLength={CONSENT_REASON_MAX}
            {...dispute.register("reason")}
            error={dispute.formState.errors.reason?.message}
          />
          <div className="flex flex-wrap gap-2">
            <Button type="submit" disabled={busy}>Send dispute</Button>
            <Button type="button" variant="secondary" onClick={() => setDisputing(false)}>Cancel</Button>
          </div>
        </form>
      ) : (
        <div className="flex flex-wrap gap-2">
          {offer.map((d) =>
            d === "accepted" ? (
              <Button key={d} type="button" disabled={busy} onClick={() => void decide("accepted")}>Accept</Button>
            ) : d === "disputed" ? (
              <Button key={d} type="button" variant="secondary" disabled={busy} onClick={() => setDisputing(true)}>Dispute</Button>
            ) : d === "hidden" ? (
              <Button key={d} type="button" variant="secondary" disabled={busy} onClick={() => void decide("hidden")}>Hide</Button>
            ) : (
              <Button key={d} type="button" disabled={busy} onClick={() => void decide("pending")}>Un-hide</Button>
            ),
          )}
        </div>
      )}
      {error ? <p role="alert" className="text-sm font-semibold text-danger">{error}</p> : null}
    </div>
  );
}

/** For the recorder: how each pilot they recorded for has decided (a dispute with its reason). */
export function RecordedFor({ consents, pilotName }: { consents: readonly LaneConsent[]; pilotName: (lane: number) => string }) {
  const others = consents.filter((c) => c.status !== "own");
  if (others.length === 0) return null;
  const word = { pending: "waiting for them to accept", accepted: "accepted", disputed: "disputed", hidden: "not in their record" } as const;
  return (
    <ul className="space-y-1 text-sm" aria-label="Pilots you recorded for">
      {others.map((c) => (
        <li key={c.lane} data-consent={c.status}>
          {pilotName(c.lane)}: {c.status === "own" ? "" : word[c.status]}
          {c.status === "disputed" && c.reason ? ` — “${c.reason}”` : ""}
        </li>
      ))}
    </ul>
  );
}
