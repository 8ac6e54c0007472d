"use client";

import { useState } from "react";
import { itemTaskText, type PlanItem } from "@/lib/coach/plan-goals";
import { planNewWindow } from "@/lib/field/new-window";
import { DEFAULT_RULE_SETTINGS, taskDefinitionSchema, withRuleSettings } from "@/lib/tasks";
import { LAST_FIELD_KEY } from "@/lib/field/last-field";
import { openNewRun } from "./open-new-run";
import { useFieldProfile } from "./use-field-profile";
import { useNotifyWrite } from "./use-notify-write";

/**
 * One tap to fly a coach's plan item: sets up a window of its task for this pilot alone at the
 * last field used (no countdown, default rule settings), linked to the plan item as the form would
 * link it, and opens the field timer. Offline too: it writes only the device database. Without a
 * last field (first window on this phone) it opens the form with the item chosen instead.
 */
export function StartPlanItem({ planId, index, item, formHref }: { planId: string; index: number; item: PlanItem; formHref: string }) {
  const { profile } = useFieldProfile();
  const notify = useNotifyWrite();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);

  const start = async () => {
    const fieldName = localStorage.getItem(LAST_FIELD_KEY);
    if (!fieldName || !profile) return window.location.assign(formHref);
    const out = planNewWindow({
      fieldName, position: null, windMs: "", gustMs: "", temperatureC: "", notes: "", who: { mode: "me" },
      task: { source: "catalogue", letter: item.letter, variant: item.variant }, prepMin: "", noFly: false,
    }, profile, Date.now());
    const parsed = out.ok ? taskDefinitionSchema.safeParse(out.plan.run.task) : null;
    if (!out.ok || !parsed?.success) return setError(`This task cannot be set up here: ${Object.values(out.ok ? {} : out.errors).join(" ") || "open the form."}`);
    setBusy(true);
    const problem = await openNewRun(out.plan.session, {
      ...out.plan.run, task: withRuleSettings(parsed.data, DEFAULT_RULE_SETTINGS) as unknown as Record<string, unknown>,
      plan: { id: planId, item: index },
    }, { notify });
    if (problem) { setBusy(false); setError(problem); } // on success the page is leaving: busy stays
  };

  return (
    <div className="space-y-1">
      <button type="button" onClick={() => void start()} disabled={busy}
        className="flex min-h-touch w-full items-center justify-between gap-2 rounded-lg bg-accent px-3 text-left font-bold text-accent-ink">
        <span>Start next: {itemTaskText(item)}</span>
        <span aria-hidden>▶</span>
      </button>
      {error ? <p role="alert" className="text-sm font-semibold text-warn">{error}</p> : null}
    </div>
  );
}
