"use client";

import { useLiveQuery } from "dexie-react-hooks";
import { itemTaskText, nextPlanItem, progressText } from "@/lib/coach/plan-goals";
import { getMeta, getWindowcallDb } from "@/lib/offline/db";
import type { PulledPlan } from "@/lib/validations/coaching-sync";
import { StartPlanItem } from "./start-plan-item";

/** The address that sets up a window for one plan item (the form links the run to it). */
export const planItemHref = (planId: string, item: number) => `/field/new?plan=${planId}&item=${item}`;

/**
 * Practice plans a coach assigned to this pilot, as the last pull brought them (so they show
 * offline): open plans under "Ready to fly" with one tap to start the next item (StartPlanItem),
 * each item also a link to the set-up form with its task chosen, linked to the item, with its
 * progress as of that pull. Plans the coach closed, or with every goal met, fold away.
 */
export function AssignedPlans() {
  const plans = useLiveQuery(async () => (await getMeta(getWindowcallDb(), "assignedPlans")) ?? [], []);
  if (!plans || plans.length === 0) return null;
  const open = plans.filter((p) => !p.progress.done && p.closedAtMs === null);
  const done = plans.filter((p) => p.progress.done || p.closedAtMs !== null);
  return (
    <section aria-labelledby="ready-h" className="space-y-3">
      <h2 id="ready-h" className="text-lg font-bold">Ready to fly: plans from your coach</h2>
      {open.length === 0 ? <p className="text-muted">Every assigned plan is done. Well flown.</p> : null}
      {open.map((p) => <PlanCard key={p.id} plan={p} />)}
      {done.length > 0 ? (
        <details>
          <summary className="flex min-h-touch cursor-pointer items-center font-bold">Finished or closed plans ({done.length})</summary>
          {done.map((p) => <PlanCard key={p.id} plan={p} />)}
        </details>
      ) : null}
      <p className="text-sm text-muted">Progress as of the last sync. Fly only where the field&apos;s rules allow it.</p>
    </section>
  );
}

function PlanCard({ plan }: { plan: PulledPlan }) {
  const next = nextPlanItem(plan);
  return (
    <article aria-label={plan.title} className="space-y-2 rounded-xl border-2 border-line p-3">
      <h3 className="font-bold">{plan.title}</h3>
      {plan.coachName ? <p className="text-sm text-muted">From {plan.coachName}{plan.closedAtMs !== null ? " · closed by your coach" : ""}</p> : null}
      {next !== null ? <StartPlanItem planId={plan.id} index={next} item={plan.items[next]!} formHref={planItemHref(plan.id, next)} /> : null}
      <ol className="space-y-2">
        {plan.items.map((item, i) => {
          const progress = plan.progress.items[i];
          return (
            <li key={i} className="space-y-1">
              <a href={planItemHref(plan.id, i)} className="flex min-h-touch items-center justify-between gap-2 rounded-lg border-2 border-line px-3 font-semibold">
                <span>{itemTaskText(item)}: {item.goal}</span>
                <span aria-hidden>›</span>
              </a>
              {progress ? <p className="text-sm">{progressText(item, progress)}</p> : null}
            </li>
          );
        })}
      </ol>
    </article>
  );
}
