import { itemTaskText, progressText } from "@/lib/coach/plan-goals";
import type { PulledPlan } from "@/lib/validations/coaching-sync";

/** The coach's assigned plans with each item's progress (computed on the server from the pilot's runs). */
export function PlanList({ plans }: { plans: PulledPlan[] }) {
  if (plans.length === 0) return <p>No plans assigned yet. Build one below.</p>;
  return (
    <ul className="space-y-3">
      {plans.map((p) => (
        <li key={p.id} id={`plan-${p.id}`} className="space-y-2 rounded-xl border-2 border-line p-3">
          <article aria-label={`${p.title} for ${p.pilotName}`}>
            <h3 className="font-bold">{p.title}</h3>
            <p className="text-sm text-muted">For {p.pilotName} · {p.progress.done ? "done: every goal met" : "open"}</p>
            <ol className="mt-2 list-decimal space-y-1 pl-5">
              {p.items.map((item, i) => (
                <li key={i}>
                  <span className="font-semibold">{itemTaskText(item)}: {item.goal}</span>
                  {p.progress.items[i] ? <p className="text-sm">{progressText(item, p.progress.items[i]!)}</p> : null}
                </li>
              ))}
            </ol>
          </article>
        </li>
      ))}
    </ul>
  );
}
