"use client";

import { describeTask } from "@/lib/field/describe-task";
import { CATALOGUE, type TaskDefinition, type TaskLetter } from "@/lib/tasks";

/** A catalogue choice as the form keeps it: "H:600", "C:3"; or "custom". */
export type TaskKey = `${TaskLetter}:${number}` | "custom";

const variantOf = (d: TaskDefinition) => (d.kind === "all-up" ? d.attempts : d.workingTimeSec);
const variantLabel = (d: TaskDefinition) => (d.kind === "all-up" ? `${d.attempts} attempts` : `${d.workingTimeSec / 60} min`);

/** Every task of the catalogue (each working-time variant its own choice) and "custom". */
export function TaskChooser({ value, onChange }: { value: TaskKey; onChange: (key: TaskKey) => void }) {
  const options = (Object.keys(CATALOGUE) as TaskLetter[]).flatMap((letter) =>
    CATALOGUE[letter].map((d) => ({ key: `${letter}:${variantOf(d)}` as TaskKey, def: d, many: CATALOGUE[letter].length > 1 })),
  );
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
      </ul>
    </fieldset>
  );
}
