"use client";

import { useLiveQuery } from "dexie-react-hooks";
import { lazy, Suspense, useState } from "react";
import { Button } from "@/components/ui/button";
import { getWindowcallDb } from "@/lib/offline/db";

// The form (and its form library) loads only when a plan is being made: the field page does not need it to open.
const NewPlanForm = lazy(() => import("./new-plan-form").then((m) => ({ default: m.NewPlanForm })));

/** /field: the pilot's own practice plans on this phone, and a small form to make one. */
export function PlanEditor() {
  const plans = useLiveQuery(() => getWindowcallDb().plans.orderBy("createdAtWallMs").toArray(), []);
  const [editing, setEditing] = useState(false);
  return (
    <section aria-labelledby="plans-title" className="space-y-2">
      <h2 id="plans-title" className="text-lg font-bold">
        Practice plans
      </h2>
      {plans === undefined ? (
        <p aria-busy="true">Reading this phone&apos;s plans…</p>
      ) : plans.length === 0 ? (
        <p className="text-muted">No plans yet. A plan is a list of tasks you fly one after another; pick it when you start a window.</p>
      ) : (
        <ul className="space-y-2" aria-label="Your practice plans">
          {plans.map((p) => (
            <li key={p.id} className="card rounded-xl border border-line bg-raised p-3">
              <span className="block font-bold">{p.title}</span>
              <span className="block text-sm text-muted">{p.items.map((d) => d.letter ?? d.name).join(" → ")}</span>
            </li>
          ))}
        </ul>
      )}
      {editing ? (
        <Suspense fallback={<p aria-busy="true">Opening the form…</p>}>
          <NewPlanForm onDone={() => setEditing(false)} />
        </Suspense>
      ) : (
        <Button variant="secondary" className="w-full" onClick={() => setEditing(true)}>
          New plan
        </Button>
      )}
    </section>
  );
}

