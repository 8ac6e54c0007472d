"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { v7 as uuidv7 } from "uuid";
import { Button } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { TextField } from "@/components/ui/field";
import { PLAN_ITEMS_MAX, planDraftSchema, practicePlanSchema, type PlanDraft } from "@/lib/field/practice-plan";
import { getWindowcallDb } from "@/lib/offline/db";
import { isQuotaError } from "@/lib/offline/storage";
import { getCatalogueTask, type TaskDefinition, type TaskLetter } from "@/lib/tasks";
import { catalogueOptions, taskTitle, type TaskKey } from "./task-chooser";

/** A title and the tasks in order (react-hook-form with the zod resolver: each message beside its field). */
export function NewPlanForm({ onDone }: { onDone: () => void }) {
  const options = catalogueOptions();
  const [pick, setPick] = useState<TaskKey>(options[0]?.key ?? "A:600");
  const [saveError, setSaveError] = useState<string | null>(null);
  const { register, control, setValue, handleSubmit, formState } = useForm<PlanDraft>({ resolver: zodResolver(planDraftSchema), defaultValues: { title: "", items: [] } });
  const items = useWatch({ control, name: "items" });
  const errors = { title: formState.errors.title?.message, items: formState.errors.items?.message ?? formState.errors.items?.root?.message };
  const setItems = (next: TaskDefinition[]) => setValue("items", next, { shouldValidate: formState.isSubmitted });

  const add = () => {
    const [letter, variant] = pick.split(":");
    setItems([...items, getCatalogueTask(letter as TaskLetter, Number(variant))]);
  };
  const save = async (draft: PlanDraft) => {
    setSaveError(null);
    try {
      const plan = practicePlanSchema.parse({ id: uuidv7(), ...draft, createdAtWallMs: Date.now() });
      await getWindowcallDb().plans.add(plan);
      onDone();
    } catch (e) {
      setSaveError(isQuotaError(e) ? "The phone's storage is full: the plan was not saved." : `The plan was not saved: ${e instanceof Error ? e.message : String(e)}`);
    }
  };

  return (
    <Card className="space-y-4">
      <h3 className="text-lg font-bold">New plan</h3>
      <form
        className="space-y-4"
        noValidate
        onSubmit={(e) => void handleSubmit(save)(e)}
      >
        <TextField id="plan-title" label="Plan title" maxLength={120} {...register("title")} error={errors.title} />
        <div className="space-y-1">
          <label htmlFor="plan-task" className="block font-semibold">
            Task to add
          </label>
          <div className="flex gap-2">
            <select id="plan-task" aria-invalid={errors.items ? true : undefined} aria-describedby={errors.items ? "plan-items-error" : undefined} value={pick} onChange={(e) => setPick(e.target.value as TaskKey)} className="min-h-touch min-w-0 flex-1 rounded-lg border-2 border-line bg-raised px-2 text-base text-ink">
              {options.map(({ key, def }) => (
                <option key={key} value={key}>
                  {taskTitle(def)}
                </option>
              ))}
            </select>
            <Button type="button" variant="secondary" onClick={add} disabled={items.length >= PLAN_ITEMS_MAX}>
              Add
            </Button>
          </div>
        </div>
        {items.length > 0 ? (
          <ol className="space-y-2" aria-label="Tasks in this plan">
            {items.map((def, i) => (
              <li key={`${i}-${def.letter}`} className="flex items-center justify-between gap-2 rounded-lg border-2 border-line p-2">
                <span className="min-w-0">
                  <span className="figures font-bold">{i + 1}. </span>
                  {taskTitle(def)}
                </span>
                <Button type="button" variant="danger" className="shrink-0 px-3" aria-label={`Remove task ${i + 1}, ${taskTitle(def)}`} onClick={() => setItems(items.filter((_, j) => j !== i))}>
                  Remove
                </Button>
              </li>
            ))}
          </ol>
        ) : (
          <p className="text-muted">No tasks added yet.</p>
        )}
        {errors.items ? (
          <p id="plan-items-error" className="font-semibold text-danger">
            {errors.items}
          </p>
        ) : null}
        {errors.title || errors.items || saveError ? (
          <p role="alert" className="rounded-lg border-2 border-danger p-3 font-semibold text-danger">
            {saveError ?? "The plan was not saved: fix the marked entries."}
          </p>
        ) : null}
        <div className="grid grid-cols-2 gap-2">
          <Button type="button" variant="secondary" onClick={onDone}>
            Cancel
          </Button>
          <Button type="submit">Save plan</Button>
        </div>
      </form>
    </Card>
  );
}
