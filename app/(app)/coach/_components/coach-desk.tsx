"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { coachKeys, type RosterPilot } from "./coach-api";
import { requestJson } from "@/components/request/json";
import { RosterTable } from "./roster-table";
import { PlanBuilder } from "./plan-builder";
import { PlanList } from "./plan-list";
import { DataAge } from "../../season/_components/data-age";
import type { PulledPlan } from "@/lib/validations/coaching-sync";

/** The Coach desk: the roster (each granting pilot, one tap into their Season) and the one-time code box. */
export function CoachDesk() {
  const client = useQueryClient();
  const roster = useQuery({ queryKey: coachKeys.roster, queryFn: () => requestJson<{ pilots: RosterPilot[] }>("GET", "/api/coach/pilots") });
  const plans = useQuery({ queryKey: coachKeys.plans, queryFn: () => requestJson<{ plans: PulledPlan[] }>("GET", "/api/coach/plans") });
  const [code, setCode] = useState("");
  const [note, setNote] = useState<string | null>(null);
  const claim = useMutation({
    mutationFn: (c: string) => requestJson<{ pilotId: string }>("POST", "/api/coach/claim", { code: c }),
    onSuccess: () => {
      setCode("");
      setNote("Code accepted: the pilot is on your roster.");
      return client.invalidateQueries({ queryKey: coachKeys.roster });
    },
  });

  function submit(e: FormEvent) {
    e.preventDefault();
    setNote(null);
    claim.mutate(code);
  }

  return (
    <div className="space-y-6">
      <h1 className="text-2xl font-extrabold">Coach desk</h1>
      <section aria-labelledby="roster-h" className="space-y-2">
        <h2 id="roster-h" className="text-lg font-bold">Your pilots</h2>
        {roster.isPending ? <p className="text-muted">Loading your pilots…</p> : null}
        <DataAge query={roster} what="roster" />
        {roster.data ? (
          roster.data.pilots.length === 0 ? (
            <p>No pilot lets you see their season yet. A pilot offers it from their Settings, by your e-mail or a one-time code.</p>
          ) : (
            <RosterTable pilots={roster.data.pilots} plans={plans.data?.plans ?? []} />
          )
        ) : null}
      </section>
      <section aria-labelledby="plans-h" className="space-y-2" id="plans">
        <h2 id="plans-h" className="text-lg font-bold">Practice plans</h2>
        {plans.isPending ? <p className="text-muted">Loading your plans…</p> : null}
        <DataAge query={plans} what="plans" />
        {plans.data ? <PlanList plans={plans.data.plans} pilots={roster.data?.pilots ?? []} now={plans.dataUpdatedAt} /> : null}
        {roster.data && roster.data.pilots.length > 0 ? (
          <details>
            <summary className="flex min-h-touch cursor-pointer items-center font-bold">Build a plan</summary>
            <PlanBuilder pilots={roster.data.pilots} />
          </details>
        ) : null}
      </section>
      <section aria-labelledby="code-h" className="space-y-2">
        <h2 id="code-h" className="text-lg font-bold">A pilot gave you a code</h2>
        <form onSubmit={submit} className="space-y-2" noValidate>
          <TextField id="coach-code" label="One-time code" autoComplete="off" autoCapitalize="characters" value={code} onChange={(e) => setCode(e.target.value)} />
          <Button type="submit" disabled={claim.isPending || !code.trim()}>Enter the code</Button>
        </form>
        <p role="status" aria-live="polite">{claim.error?.message ?? note ?? ""}</p>
      </section>
    </div>
  );
}
