"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useEffect, useState } from "react";
import { FormProvider, useForm, useWatch } from "react-hook-form";
import { TextField } from "@/components/ui/field";
import { planNewWindow, type NewWindowErrors, type WhoFlies } from "@/lib/field/new-window";
import { catalogueChoiceOf, planProgressKey, progressAfter } from "@/lib/field/practice-plan";
import { prepPlanKey } from "@/lib/field/prep-plan";
import { itemTaskText } from "@/lib/coach/plan-goals";
import { getMeta, getWindowcallDb } from "@/lib/offline/db";
import { DEFAULT_RULE_SETTINGS, taskDefinitionSchema, withRuleSettings, type RuleSettings, type TaskLetter } from "@/lib/tasks";
import { newWindowFormSchema, type NewWindowForm as FormValues } from "@/lib/validations/new-window-form";
import { CustomTaskFields, EMPTY_CUSTOM, toCustomInput } from "./custom-task-fields";
import { PlaceFields } from "./place-fields";
import { RuleSettingsFields } from "./rule-settings-fields";
import { PlanTaskChooser, TaskChooser, type PlanPick, type TaskKey } from "./task-chooser";
import { FieldCautions } from "./field-cautions";
import { matchClubField, useClubFields } from "./use-club-fields";
import { useClubMates } from "./use-club-mates";
import { useFieldProfile } from "./use-field-profile";
import { useIsClient } from "./use-is-client";
import { useNotifyWrite } from "./use-notify-write";
import { WhoFliesFields } from "./who-flies-fields";
import { openNewRun } from "./open-new-run";
import { LAST_FIELD_KEY } from "@/lib/field/last-field";

/** /field/new: where, conditions, who flies, which task, and an optional countdown. */
export function NewWindowForm() {
  // The form remembers the last field in localStorage, so it renders in the browser only.
  return useIsClient() ? <NewWindowFormInner /> : <p aria-busy="true">Loading the form…</p>;
}

function NewWindowFormInner() {
  const { profile, loading } = useFieldProfile();
  const mates = useClubMates();
  const clubFields = useClubFields();
  const notify = useNotifyWrite();
  // The typed fields go through react-hook-form and the zod schema (messages beside each field);
  // who flies, the position and a plan's task are richer choices kept in state.
  const form = useForm<FormValues>({
    resolver: zodResolver(newWindowFormSchema),
    defaultValues: { fieldName: localStorage.getItem(LAST_FIELD_KEY) ?? "", windMs: "", gustMs: "", temperatureC: "", notes: "", taskKey: "H:600", custom: EMPTY_CUSTOM, prepMin: "", noFly: false },
  });
  const { register, control, setValue, handleSubmit, formState } = form;
  const fe = formState.errors;
  const [position, setPosition] = useState<{ lat: number; lon: number } | null>(null);
  const [who, setWho] = useState<WhoFlies>({ mode: "me" });
  const [planPick, setPlanPick] = useState<PlanPick | null>(null);
  const coachItem = useCoachPlanItem((key) => setValue("taskKey", key));
  const [settings, setSettings] = useState<RuleSettings>(DEFAULT_RULE_SETTINGS);
  const [errors, setErrors] = useState<NewWindowErrors & { save?: string }>({});
  const [busy, setBusy] = useState(false);
  const taskKey = useWatch({ control, name: "taskKey" }) as TaskKey;
  const fieldName = useWatch({ control, name: "fieldName" });
  const clubField = matchClubField(clubFields, fieldName);

  const submit = async (values: FormValues) => {
    const { windMs, gustMs, temperatureC, notes, custom, prepMin, noFly } = values;
    const cond = { windMs, gustMs, temperatureC, notes };
    if (!profile) return setErrors({ save: "Sign in once with signal on this phone; after that the field timer works with none." });
    const [letter, variant] = taskKey.split(":");
    // A plan item is a catalogue task: it is checked as one, and its stored definition becomes the run's task.
    const planItem = taskKey === "plan" && planPick ? planPick.plan.items[planPick.itemIndex] : undefined;
    const planChoice = planItem ? catalogueChoiceOf(planItem) : null;
    if (taskKey === "plan" && !planChoice) return setErrors({ task: planPick ? "This plan task has no rulebook letter; choose another." : "Choose a practice plan and one of its tasks." });
    const task = planChoice ? { source: "catalogue" as const, ...planChoice } : taskKey === "custom" ? { source: "custom" as const, input: toCustomInput(custom) } : { source: "catalogue" as const, letter: letter as TaskLetter, variant: Number(variant) };
    const wallNow = Date.now();
    const out = planNewWindow({ fieldName: values.fieldName, position, ...cond, who, task, prepMin, noFly }, profile, wallNow, mates);
    if (!out.ok) return setErrors(out.errors);
    if (planItem) out.plan.run.task = structuredClone(planItem) as unknown as Record<string, unknown>;
    const parsed = taskDefinitionSchema.safeParse(out.plan.run.task);
    if (!parsed.success) return setErrors({ task: parsed.error.issues.map((i) => i.message).join(" ") });
    out.plan.run.task = withRuleSettings(parsed.data, settings) as unknown as Record<string, unknown>;
    setErrors({});
    setBusy(true);
    // a window set up from a coach's plan item (and still on its task) names that item
    const linked = coachItem && taskKey === coachItem.taskKey ? { plan: { id: coachItem.planId, item: coachItem.item } } : {};
    const problem = await openNewRun(out.plan.session, { ...out.plan.run, ...linked }, {
      notify,
      stored: (run) => {
        localStorage.setItem(LAST_FIELD_KEY, out.plan.session.fieldName);
        if (planPick && planItem) localStorage.setItem(planProgressKey(planPick.plan.id), JSON.stringify(progressAfter(planPick.plan, planPick.itemIndex)));
        if (out.plan.prep) localStorage.setItem(prepPlanKey(run.id), JSON.stringify({ beganAtWallMs: Date.now(), ...out.plan.prep }));
      },
    });
    if (problem) { setBusy(false); setErrors({ save: problem }); } // on success the page is leaving: busy stays
  };

  const problems = [...Object.values(errors).filter(Boolean), ...Object.keys(fe)];
  return (
    <FormProvider {...form}>
    <form
      className="space-y-6"
      noValidate
      onSubmit={(e) => {
        setErrors({});
        void handleSubmit(submit)(e);
      }}
    >
      <PlaceFields
        fieldName={fieldName}
        onFieldName={(v) => setValue("fieldName", v, { shouldValidate: formState.isSubmitted })}
        position={position}
        onPosition={setPosition}
        error={fe.fieldName?.message ?? errors.fieldName}
        clubFieldNames={clubFields.map((f) => f.name)}
      />
      {clubField ? <FieldCautions field={clubField} /> : null}
      <fieldset className="space-y-3">
        <legend className="text-lg font-bold">Conditions (optional)</legend>
        <div className="grid grid-cols-3 gap-2">
          <TextField id="wind" label="Wind m/s" inputMode="decimal" {...register("windMs")} error={fe.windMs?.message ?? errors.windMs} />
          <TextField id="gusts" label="Gusts m/s" inputMode="decimal" {...register("gustMs")} error={fe.gustMs?.message ?? errors.gustMs} />
          <TextField id="temp" label="Temp °C" inputMode="decimal" {...register("temperatureC")} error={fe.temperatureC?.message ?? errors.temperatureC} />
        </div>
        <TextField id="notes" label="Notes" {...register("notes")} error={fe.notes?.message} />
      </fieldset>
      <WhoFliesFields who={who} onChange={setWho} myName={profile?.name ?? ""} mates={mates} error={errors.who} />
      {coachItem ? (
        <p className="rounded-lg border-2 border-line p-3" data-testid="coach-plan-item">
          From {coachItem.coachName ? `${coachItem.coachName}'s` : "your coach's"} plan “{coachItem.title}”: {coachItem.text}
          {taskKey === coachItem.taskKey ? "" : " (another task is chosen now: this window will not count for the plan)"}
        </p>
      ) : null}
      <TaskChooser value={taskKey} onChange={(k) => setValue("taskKey", k)} />
      {taskKey === "custom" ? <CustomTaskFields /> : null}
      {taskKey === "plan" ? <PlanTaskChooser pick={planPick} onPick={setPlanPick} /> : null}
      <RuleSettingsFields value={settings} onChange={setSettings} showEndCall={taskKey.startsWith("E:") || taskKey === "plan"} />
      {errors.task ? (
        <p role="alert" className="rounded-lg border-2 border-danger p-3 font-semibold text-danger">
          The task does not work: {errors.task}
        </p>
      ) : null}
      <fieldset className="space-y-3">
        <legend className="text-lg font-bold">Before the working time (optional)</legend>
        <TextField id="prep" label="Preparation countdown, minutes" inputMode="decimal" {...register("prepMin")} error={fe.prepMin?.message ?? errors.prepMin} />
        <label className="flex min-h-touch items-center gap-3">
          <input type="checkbox" {...register("noFly")} className="h-6 w-6" />
          <span>Add the no-fly minute before the start (F3K.9)</span>
        </label>
      </fieldset>
      {problems.length > 0 && !errors.task ? (
        <p role="alert" className="font-semibold text-danger">
          {errors.save ?? "Please fix the marked entries."}
        </p>
      ) : null}
      <button type="submit" disabled={busy || loading} className="min-h-touch w-full rounded-2xl bg-accent text-xl font-extrabold text-accent-ink disabled:opacity-50">
        {busy ? "Saving…" : "Set up the window"}
      </button>
    </form>
    </FormProvider>
  );
}

type CoachItem = { planId: string; item: number; title: string; coachName: string | null; taskKey: string; text: string };

/**
 * The coach's plan item named in the address (/field/new?plan=…&item=…, from the Field's "Ready to
 * fly"), read from the device database; its task is chosen once it is found.
 */
function useCoachPlanItem(choose: (taskKey: TaskKey) => void): CoachItem | null {
  const [found, setFound] = useState<CoachItem | null>(null);
  useEffect(() => {
    const q = new URLSearchParams(window.location.search);
    const planId = q.get("plan");
    const item = Number(q.get("item"));
    if (!planId || !Number.isInteger(item)) return;
    let live = true;
    void getMeta(getWindowcallDb(), "assignedPlans").then((plans) => {
      const plan = plans?.find((p) => p.id === planId);
      const it = plan?.items[item];
      if (!live || !plan || !it) return;
      const taskKey = `${it.letter}:${it.variant}`;
      setFound({ planId, item, title: plan.title, coachName: plan.coachName, taskKey, text: `${itemTaskText(it)}, ${it.goal}` });
      choose(taskKey as TaskKey);
    });
    return () => {
      live = false;
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps -- once, from the address
  }, []);
  return found;
}
