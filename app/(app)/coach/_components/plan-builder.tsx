"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useFieldArray, useForm, useWatch } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { EMPTY_ITEM, planFormSchema, planFromForm, planToForm, type PlanForm } from "@/lib/coach/plan-form";
import type { PulledPlan } from "@/lib/validations/coaching-sync";
import { itemTaskText, PLAN_ITEMS_MAX } from "@/lib/coach/plan-goals";
import { CATALOGUE, type TaskLetter } from "@/lib/tasks";
import { coachKeys, type RosterPilot } from "./coach-api";
import { requestJson } from "@/components/request/json";

const TASKS = (Object.keys(CATALOGUE) as TaskLetter[]).flatMap((letter) =>
  CATALOGUE[letter].map((d) => {
    const variant = d.kind === "all-up" ? d.attempts : d.workingTimeSec;
    return { key: `${letter}:${variant}`, label: `${itemTaskText({ letter, variant })} — ${d.name}` };
  }),
);
const select = "block min-h-14 w-full rounded-lg border-2 border-line bg-raised px-3 text-base text-ink";

/**
 * The coach builds a plan (title, then items: task, goal in words, windows, a number where
 * measurable) and assigns it to a pilot; given `editing`, the same form changes that plan
 * (PATCH: title and items; the pilot stays). Runs keep the item number they were set up from.
 */
export function PlanBuilder({ pilots, editing }: { pilots: RosterPilot[]; editing?: PulledPlan }) {
  const client = useQueryClient();
  const id = (name: string) => (editing ? `edit-${editing.id}-${name}` : name);
  const form = useForm<PlanForm>({
    resolver: zodResolver(planFormSchema),
    defaultValues: editing ? planToForm(editing) : { pilotId: pilots[0]?.pilotId ?? "", title: "", items: [EMPTY_ITEM] },
  });
  const { register, control, handleSubmit, reset, formState } = form;
  const watched = useWatch({ control, name: "items" });
  const items = useFieldArray({ control, name: "items" });
  const assign = useMutation({
    mutationFn: (f: PlanForm) => {
      const { pilotId, ...plan } = planFromForm(f);
      return editing
        ? requestJson("PATCH", `/api/coach/plans/${editing.id}`, plan)
        : requestJson("POST", "/api/coach/plans", { pilotId, ...plan });
    },
    onSuccess: () => {
      if (!editing) reset({ pilotId: form.getValues("pilotId"), title: "", items: [EMPTY_ITEM] });
      return client.invalidateQueries({ queryKey: coachKeys.plans });
    },
  });
  const fe = formState.errors;
  return (
    <form className="space-y-4" noValidate onSubmit={(e) => void handleSubmit((f) => assign.mutate(f))(e)}>
      {editing ? null : (
        <div className="space-y-1">
          <label htmlFor="plan-pilot" className="block font-semibold">Pilot</label>
          <select id="plan-pilot" className={select} {...register("pilotId")}>
            {pilots.map((p) => <option key={p.pilotId} value={p.pilotId}>{p.name}</option>)}
          </select>
        </div>
      )}
      <TextField id={id("plan-title")} label="Plan title" {...register("title")} error={fe.title?.message} />
      {items.fields.map((field, i) => {
        const ie = fe.items?.[i];
        const measure = watched?.[i]?.measure ?? "none";
        return (
          <fieldset key={field.id} className="space-y-2 rounded-xl border-2 border-line p-3">
            <legend className="px-1 font-bold">Item {i + 1}</legend>
            <div className="space-y-1">
              <label htmlFor={id(`item-${i}-task`)} className="block font-semibold">Task</label>
              <select id={id(`item-${i}-task`)} className={select} {...register(`items.${i}.task`)}>
                {TASKS.map((t) => <option key={t.key} value={t.key}>{t.label}</option>)}
              </select>
            </div>
            <TextField id={id(`item-${i}-goal`)} label="Goal in words" placeholder="three 1-2-3-4 windows, quick relaunches" {...register(`items.${i}.goal`)} error={ie?.goal?.message} />
            <TextField id={id(`item-${i}-windows`)} label="Windows to fly" inputMode="numeric" {...register(`items.${i}.windows`)} error={ie?.windows?.message} />
            <div className="space-y-1">
              <label htmlFor={id(`item-${i}-measure`)} className="block font-semibold">Measured by</label>
              <select id={id(`item-${i}-measure`)} className={select} {...register(`items.${i}.measure`)}>
                <option value="median-turnaround-below">Median turnaround under (seconds)</option>
                <option value="median-share-at-least">Median result at least (% of the maximum)</option>
                <option value="none">Nothing to measure (words only)</option>
              </select>
            </div>
            {measure !== "none" ? (
              <TextField id={id(`item-${i}-target`)} label={measure === "median-share-at-least" ? "Percent to reach" : "Seconds to beat"} inputMode="decimal"
                {...register(`items.${i}.target`)} error={ie?.target?.message} />
            ) : null}
            {items.fields.length > 1 ? <Button type="button" variant="secondary" onClick={() => items.remove(i)}>Remove item {i + 1}</Button> : null}
          </fieldset>
        );
      })}
      {fe.items?.message ? <p className="text-sm font-semibold text-danger">{fe.items.message}</p> : null}
      <div className="flex flex-wrap gap-2">
        <Button type="button" variant="secondary" disabled={items.fields.length >= PLAN_ITEMS_MAX} onClick={() => items.append({ ...EMPTY_ITEM })}>Add an item</Button>
        <Button type="submit" disabled={assign.isPending}>{editing ? "Save the changes" : "Assign the plan"}</Button>
      </div>
      <p role="status" aria-live="polite">
        {assign.error?.message ?? (assign.isSuccess ? (editing ? "Plan changed: the pilot's Field shows it after their next sync." : "Plan assigned: it is on the pilot's Field after their next sync.") : "")}
      </p>
    </form>
  );
}
