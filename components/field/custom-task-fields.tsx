"use client";

import { useFormContext, useWatch, type UseFormRegisterReturn } from "react-hook-form";
import { TextField } from "@/components/ui/field";
import type { CustomTaskInput } from "@/lib/tasks";
import type { CustomTaskForm, NewWindowForm } from "@/lib/validations/new-window-form";

/** The custom task as typed (checked by customTaskFormSchema); `toCustomInput` turns it into buildCustomTask's input. */
export type CustomDraft = CustomTaskForm;

export const EMPTY_CUSTOM: CustomDraft = { name: "My practice task", workingMin: "10", counting: "best", count: "3", capSec: "120", targets: "", order: "in-order", launchLimit: "" };

const num = (s: string) => (s.trim() === "" ? undefined : Number(s.trim().replace(",", ".")));

/** Typed text → the engine's custom-task input (after the form's own checks; the engine checks the whole task). */
export function toCustomInput(d: CustomDraft): CustomTaskInput {
  const targets = d.targets.split(/[\s,;]+/).filter(Boolean).map(Number);
  const minutes = num(d.workingMin);
  return {
    name: d.name,
    workingTimeSec: minutes === undefined ? Number.NaN : Math.round(minutes * 60),
    capSec: targets.length > 0 ? null : (num(d.capSec) ?? null),
    targetsSec: targets,
    order: d.order,
    counting: d.counting,
    count: targets.length > 0 && d.counting !== "all" ? targets.length : num(d.count),
    launchLimit: num(d.launchLimit) ?? null,
  };
}

/** Fields of a custom practice task: window, cap, a ladder of targets, what counts; each message beside its field. */
export function CustomTaskFields() {
  const { register, control, formState } = useFormContext<NewWindowForm>();
  const errors = formState.errors.custom;
  const [targets, counting, order] = useWatch({ control, name: ["custom.targets", "custom.counting", "custom.order"] });
  const ladder = (targets ?? "").trim() !== "";
  return (
    <fieldset className="space-y-3 rounded-xl border-2 border-line p-3">
      <legend className="px-1 font-bold">Your own task</legend>
      <TextField id="custom-name" label="Name" {...register("custom.name")} error={errors?.name?.message} />
      <TextField id="custom-wt" label="Working time (minutes)" inputMode="decimal" {...register("custom.workingMin")} error={errors?.workingMin?.message} />
      <TextField id="custom-targets" label="Ladder of targets, seconds (optional, e.g. 60 90 120)" {...register("custom.targets")} error={errors?.targets?.message} />
      {ladder ? (
        <Choice label="Targets are flown" registration={register("custom.order")} value={order} options={[["in-order", "in order"], ["any-order", "in any order"]]} />
      ) : (
        <TextField id="custom-cap" label="Cap per flight, seconds (empty: no cap)" inputMode="numeric" {...register("custom.capSec")} error={errors?.capSec?.message} />
      )}
      <Choice label="Which flights count" registration={register("custom.counting")} value={counting} options={[["best", "the longest"], ["last", "the last"], ["all", "all of them"]]} />
      {counting !== "all" && !ladder ? <TextField id="custom-count" label="How many count" inputMode="numeric" {...register("custom.count")} error={errors?.count?.message} /> : null}
      <TextField id="custom-launches" label="Launch limit (empty: unlimited)" inputMode="numeric" {...register("custom.launchLimit")} error={errors?.launchLimit?.message} />
    </fieldset>
  );
}

function Choice({ label, registration, value, options }: { label: string; registration: UseFormRegisterReturn; value: string; options: [string, string][] }) {
  return (
    <fieldset>
      <legend className="font-semibold">{label}</legend>
      <div className="mt-1 flex flex-wrap gap-2">
        {options.map(([v, text]) => (
          <label key={v} className={`flex min-h-12 cursor-pointer items-center gap-2 rounded-lg border-2 px-3 ${value === v ? "border-ink border-4" : "border-line"}`}>
            <input type="radio" value={v} {...registration} className="h-5 w-5" />
            {text}
          </label>
        ))}
      </div>
    </fieldset>
  );
}
