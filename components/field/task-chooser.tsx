"use client";

import { useLiveQuery } from "dexie-react-hooks";
import { describeTask } from "@/lib/field/describe-task";
import { planProgressKey, readPlanProgress, type PracticePlan } from "@/lib/field/practice-plan";
import { getWindowcallDb } from "@/lib/offline/db";
import { CATALOGUE, type TaskDefinition, type TaskLetter } from "@/lib/tasks";

/** A catalogue choice as the form keeps it: "H:600", "C:3"; or "custom"; or "plan" (a practice plan's task). */
export type TaskKey = `${TaskLetter}:${number}` | "custom" | "plan";

/** A task picked from one of the device's practice plans. */
export type PlanPick = { plan: PracticePlan; itemIndex: number };

const variantOf = (d: TaskDefinition) => (d.kind === "all-up" ? d.attempts : d.workingTimeSec);
const variantLabel = (d: TaskDefinition) => (d.kind === "all-up" ? `${d.attempts} attempts` : `${d.workingTimeSec / 60} min`);

/** Every catalogue task, each working-time variant its own option (also used by the plan editor). */
export function catalogueOptions(): { key: TaskKey; def: TaskDefinition; many: boolean }[] {
  return (Object.keys(CATALOGUE) as TaskLetter[]).flatMap((letter) =>
    CATALOGUE[letter].map((d) => ({ key: `${letter}:${variantOf(d)}` as TaskKey, def: d, many: CATALOGUE[letter].length > 1 })),
  );
}

/** A task's short name: "H · 1, 2, 3 and 4 minutes · 10 min" (the variant only when there are several). */
export function taskTitle(def: TaskDefinition): string {
  const many = def.letter !== null && CATALOGUE[def.letter].length > 1;
  return `${def.letter ? `${def.letter} · ` : ""}${def.name}${many ? ` · ${variantLabel(def)}` : ""}`;
}

/** Every task of the catalogue (each working-time variant its own choice) and "custom". */
export function TaskChooser({ value, onChange }: { value: TaskKey; onChange: (key: TaskKey) => void }) {
  const options = catalogueOptions();
  return (
    <fieldset className="space-y-2">
      <legend className="text-lg font-bold">Task</legend>
      <ul className="space-y-2">
        {options.map(({ key, def, many }) => (
          <li key={key}>
            <label className={`flex min-h-touch cursor-pointer gap-3 rounded-xl border-2 p-3 ${value === key ? "border-ink border-4" : "border-line"}`}>
              <input type="radio" name="task" value={key} checked={value === key} onChange={() => onChange(key)} className="mt-1 h-5 w-5 shrink-0" />
              <span>
                <span className="block font-bold">
                  {def.letter} · {def.name}
                  {many ? ` · ${variantLabel(def)}` : ""}
                </span>
                <span className="block text-sm text-muted">{describeTask(def)}</span>
              </span>
            </label>
          </li>
        ))}
        <li>
          <label className={`flex min-h-touch cursor-pointer gap-3 rounded-xl border-2 p-3 ${value === "custom" ? "border-ink border-4" : "border-line"}`}>
            <input type="radio" name="task" value="custom" checked={value === "custom"} onChange={() => onChange("custom")} className="mt-1 h-5 w-5 shrink-0" />
            <span>
              <span className="block font-bold">Your own task</span>
              <span className="block text-sm text-muted">Any working time, cap, ladder of targets, and which flights count</span>
            </span>
          </label>
        </li>
        <li>
          <label className={`flex min-h-touch cursor-pointer gap-3 rounded-xl border-2 p-3 ${value === "plan" ? "border-ink border-4" : "border-line"}`}>
            <input type="radio" name="task" value="plan" checked={value === "plan"} onChange={() => onChange("plan")} className="mt-1 h-5 w-5 shrink-0" />
            <span>
              <span className="block font-bold">From a practice plan</span>
              <span className="block text-sm text-muted">The next task of one of your plans on this phone</span>
            </span>
          </label>
        </li>
      </ul>
    </fieldset>
  );
}

/** Picks one of the device's practice plans, then one of its tasks (the next unflown one first). */
export function PlanTaskChooser({ pick, onPick }: { pick: PlanPick | null; onPick: (pick: PlanPick | null) => void }) {
  const plans = useLiveQuery(() => getWindowcallDb().plans.orderBy("createdAtWallMs").toArray(), []);
  if (plans === undefined) return <p aria-busy="true">Reading this phone&apos;s plans…</p>;
  if (plans.length === 0) return <p className="rounded-lg border-2 border-line p-3">No practice plans on this phone yet. Make one on the Field page under “Practice plans”.</p>;
  const choosePlan = (id: string) => {
    const plan = plans.find((p) => p.id === id);
    onPick(plan ? { plan, itemIndex: readPlanProgress(plan, localStorage.getItem(planProgressKey(plan.id))) } : null);
  };
  const next = pick ? readPlanProgress(pick.plan, localStorage.getItem(planProgressKey(pick.plan.id))) : -1;
  return (
    <div className="space-y-3">
      <div className="space-y-1">
        <label htmlFor="plan-choice" className="block font-semibold">
          Practice plan
        </label>
        <select id="plan-choice" value={pick?.plan.id ?? ""} onChange={(e) => choosePlan(e.target.value)} className="min-h-touch w-full rounded-lg border-2 border-line bg-raised px-2 text-lg text-ink">
          <option value="">Choose a plan…</option>
          {plans.map((p) => (
            <option key={p.id} value={p.id}>
              {p.title}
            </option>
          ))}
        </select>
      </div>
      {pick ? (
        <fieldset className="space-y-2">
          <legend className="font-semibold">Task from “{pick.plan.title}”</legend>
          {pick.plan.items.map((def, i) => (
            <label key={i} className={`flex min-h-touch cursor-pointer gap-3 rounded-xl border-2 p-3 ${pick.itemIndex === i ? "border-ink border-4" : "border-line"}`}>
              <input type="radio" name="plan-item" checked={pick.itemIndex === i} onChange={() => onPick({ ...pick, itemIndex: i })} className="mt-1 h-5 w-5 shrink-0" />
              <span>
                <span className="block font-bold">
                  {i + 1}. {taskTitle(def)}
                  {i === next ? " (next)" : ""}
                </span>
                <span className="block text-sm text-muted">{describeTask(def)}</span>
              </span>
            </label>
          ))}
        </fieldset>
      ) : null}
    </div>
  );
}
