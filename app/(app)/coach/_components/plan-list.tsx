"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { itemTaskText, progressText } from "@/lib/coach/plan-goals";
import type { PulledPlan } from "@/lib/validations/coaching-sync";
import { describeAge } from "../../season/_components/data-age";
import { coachKeys, type RosterPilot } from "./coach-api";
import { requestJson } from "@/components/request/json";
import { PlanBuilder } from "./plan-builder";

/**
 * The coach's assigned plans with each item's progress (computed on the server from the runs the
 * pilot's phones pushed, so as of their last sync — said with its age), and for each an edit form
 * and a close / reopen button.
 */
export function PlanList({ plans, pilots, now }: { plans: PulledPlan[]; pilots: RosterPilot[]; now: number }) {
  if (plans.length === 0) return <p>No plans assigned yet. Build one below.</p>;
  return (
    <ul className="space-y-3">
      {plans.map((p) => (
        <li key={p.id} id={`plan-${p.id}`} className="space-y-2 rounded-xl border-2 border-line p-3">
          <article aria-label={`${p.title} for ${p.pilotName}`}>
            <h3 className="font-bold">{p.title}</h3>
            <p className="text-sm text-muted">
              For {p.pilotName} · {p.closedAtMs !== null ? "closed" : p.progress.done ? "done: every goal met" : "open"}
            </p>
            <p className="text-sm" data-testid="plan-as-of">
              {p.pilotSyncedAtMs === null
                ? `Progress: ${p.pilotName} has not synced a phone yet.`
                : `Progress as of ${p.pilotName}'s last sync, ${describeAge(Math.max(0, now - p.pilotSyncedAtMs))}.`}
            </p>
            <ol className="mt-2 list-decimal space-y-1 pl-5">
              {p.items.map((item, i) => (
                <li key={i}>
                  <span className="font-semibold">{itemTaskText(item)}: {item.goal}</span>
                  {p.progress.items[i] ? <p className="text-sm">{progressText(item, p.progress.items[i]!)}</p> : null}
                </li>
              ))}
            </ol>
          </article>
          <PlanActions plan={p} pilots={pilots} />
        </li>
      ))}
    </ul>
  );
}

function PlanActions({ plan, pilots }: { plan: PulledPlan; pilots: RosterPilot[] }) {
  const client = useQueryClient();
  const closed = plan.closedAtMs !== null;
  const [editing, setEditing] = useState(false);
  const toggle = useMutation({
    mutationFn: () => requestJson("PATCH", `/api/coach/plans/${plan.id}`, { closed: !closed }),
    onSuccess: () => client.invalidateQueries({ queryKey: coachKeys.plans }),
  });
  return (
    <div className="space-y-2">
      {/* the form is built when opened: one form per plan on the page at once would repeat every label */}
      <details onToggle={(e) => setEditing(e.currentTarget.open)}>
        <summary className="flex min-h-touch cursor-pointer items-center font-bold">Edit “{plan.title}”</summary>
        {editing ? <PlanBuilder pilots={pilots} editing={plan} /> : null}
      </details>
      <Button type="button" variant="secondary" disabled={toggle.isPending} onClick={() => toggle.mutate()}>
        {closed ? `Reopen “${plan.title}”` : `Close “${plan.title}”`}
      </Button>
      <p role="status" aria-live="polite" className="text-sm">{toggle.error?.message ?? ""}</p>
    </div>
  );
}
